import {
  assessTriggers,
  evaluateRule,
  evaluateRuleOutcome,
  nearestCrownReach,
  setMeans,
  type RoundFacts,
  type Watched,
} from '../src/index.js';

const heading = { driveTrend: 60, gradientPercent: 0, profileHeight: 10, profileWidth: 10, axisHeight: 5 };
const base: RoundFacts = {
  q: 0.08,
  rmr: 35,
  inflowPer10m: 30,
  overbreakM3: 2,
  faceChainage: 1000,
  recommendedClassId: 'b',
  previousClassId: 'a',
  joints: [],
};

describe('evaluateRule', () => {
  it('compares numeric quantities with the threshold', () => {
    expect(evaluateRule({ watch: 'q', comparison: '<', threshold: 0.1 }, base, heading)).toEqual({
      value: 0.08,
      detail: 'Q 0.08 < 0.1',
    });
    expect(evaluateRule({ watch: 'q', comparison: '<', threshold: 0.05 }, base, heading)).toBeNull();
    expect(
      evaluateRule({ watch: 'inflow-per-10m', comparison: '>', threshold: 25 }, base, heading)?.detail,
    ).toBe('Inflow 30 l/min per 10 m > 25 l/min per 10 m');
    expect(
      evaluateRule({ watch: 'rmr89', comparison: '<', threshold: 30 }, { ...base, rmr: null }, heading),
    ).toBeNull();
  });

  it('fires on a class change only when there was a previous round', () => {
    expect(
      evaluateRule({ watch: 'support-class-change', comparison: null, threshold: null }, base, heading),
    ).not.toBeNull();
    expect(
      evaluateRule(
        { watch: 'support-class-change', comparison: null, threshold: null },
        { ...base, previousClassId: undefined },
        heading,
      ),
    ).toBeNull();
    expect(
      evaluateRule(
        { watch: 'support-class-change', comparison: null, threshold: null },
        { ...base, previousClassId: 'b' },
        heading,
      ),
    ).toBeNull();
  });

  it('flags a round longer than the class of the last round allows, at the printed centimetres (issue 11 item 3: over-length is a rule of the plan; common practice)', () => {
    const rule = { watch: 'round-over-class-length' as const, comparison: null, threshold: null };
    const over = { ...base, roundLength: 3.5, allowedRoundLength: 2.5 };
    expect(evaluateRuleOutcome(rule, over, heading)).toEqual({
      state: 'fired',
      value: 3.5,
      detail: 'The round is 3.5 m long; the support class of the last round allows 2.5 m.',
    });
    // At the limit (3.5 against 3.5, and 3.504 printed as 3.50): clear.
    expect(evaluateRuleOutcome(rule, { ...over, allowedRoundLength: 3.5 }, heading).state).toBe('clear');
    expect(
      evaluateRuleOutcome(rule, { ...over, roundLength: 3.504, allowedRoundLength: 3.5 }, heading).state,
    ).toBe('clear');
    // First round of the stage: nothing to compare with.
    expect(evaluateRuleOutcome(rule, { ...over, previousClassId: undefined }, heading)).toEqual({
      state: 'clear',
      detail: 'first round of this stage',
    });
    // Not evaluated, with the reason: no length yet, the last round without a class, facts from before.
    expect(evaluateRuleOutcome(rule, { ...over, roundLength: null }, heading).detail).toBe(
      'no round length yet',
    );
    expect(evaluateRuleOutcome(rule, { ...over, allowedRoundLength: null }, heading).detail).toBe(
      'the last round has no support class yet',
    );
    expect(evaluateRuleOutcome(rule, base, heading).state).toBe('not-evaluated');
  });

  it('flags a set striking along the drive and dipping steeply as very unfavourable (Bieniawski 1989 Table 4.1F; 30° rule)', () => {
    // Drive 060: a set dipping 70° toward 150 strikes 060, parallel to the axis → very unfavourable (methods.md §4.2 F).
    const joints = [150, 152, 148].map((dd) => ({
      kind: 'joint',
      setLabel: 'S1',
      dipDirection: dd,
      dip: 70,
    }));
    const fired = evaluateRule(
      { watch: 'adverse-orientation', comparison: null, threshold: null },
      { ...base, joints },
      heading,
    );
    expect(fired?.detail).toMatch(/^S1 \(150\/70\) is very unfavourable/);
    // Drive with the dip, perpendicular strike: very favourable, no flag (methods.md §4.2 computed example 060/45).
    const favourable = [{ kind: 'joint', setLabel: 'S2', dipDirection: 60, dip: 45 }];
    expect(
      evaluateRule(
        { watch: 'adverse-orientation', comparison: null, threshold: null },
        { ...base, joints: favourable },
        heading,
      ),
    ).toBeNull();
  });

  it('reports a fault reaching the crown within the distance ahead (methods.md §6)', () => {
    // methods.md §6 plane A (240/60, drive 060), here mapped at the axis: crown at 1000 + 5/tan60 = 1002.887 m [computed here].
    const joints = [{ kind: 'fault', setLabel: null, dipDirection: 240, dip: 60 }];
    const fired = evaluateRule(
      { watch: 'crown-crossing-within', comparison: null, threshold: 5 },
      { ...base, joints },
      heading,
    );
    expect(fired?.value).toBeCloseTo(5 / Math.tan(Math.PI / 3), 9);
    expect(
      evaluateRule(
        { watch: 'crown-crossing-within', comparison: null, threshold: 2 },
        { ...base, joints },
        heading,
      ),
    ).toBeNull();
    // Dipping ahead (with the drive) it reaches the crown behind the face: no flag.
    const behind = [{ kind: 'fault', setLabel: null, dipDirection: 60, dip: 45 }];
    expect(
      evaluateRule(
        { watch: 'crown-crossing-within', comparison: null, threshold: 50 },
        { ...base, joints: behind },
        heading,
      ),
    ).toBeNull();
  });

  it('averages each labelled set with Fisher statistics of the poles', () => {
    const means = setMeans([
      { kind: 'joint', setLabel: 'S1', dipDirection: 130, dip: 50 },
      { kind: 'joint', setLabel: 'S1', dipDirection: 130, dip: 50 },
      { kind: 'joint', setLabel: null, dipDirection: 10, dip: 10 },
    ]);
    expect(means).toHaveLength(1);
    expect(means[0].plane.dipDirection).toBeCloseTo(130, 9);
    expect(means[0].plane.dip).toBeCloseTo(50, 9);
  });
});

describe('rules whose input is missing (issue 10: never green)', () => {
  const rule = (watch: Watched, extra = {}) => ({
    id: watch,
    watch,
    comparison: null,
    threshold: null,
    level: 'amber' as const,
    action: 'Tell the engineer',
    ownerRole: 'engineer',
    timeAllowedHours: 4,
    enabled: true,
    ...extra,
  });

  it('says not evaluated, not clear, for a Q rule on a round without Q [common practice]', () => {
    expect(
      evaluateRuleOutcome({ watch: 'q', comparison: '<', threshold: 1 }, { ...base, q: null }, heading).state,
    ).toBe('not-evaluated');
  });

  it('gives no level (not green) while some rules lack their data, and green once all are in', () => {
    const rules = [
      rule('q', { comparison: '<', threshold: 0.01 }),
      rule('rmr89', { comparison: '<', threshold: 10 }),
    ];
    const partial = assessTriggers(rules, { ...base, rmr: null }, heading);
    expect(partial.level).toBeNull();
    expect(partial.notEvaluated.map((n) => n.ruleId)).toEqual(['rmr89']);
    expect(assessTriggers(rules, base, heading).level).toBe('green');
  });

  it('keeps a fired level even when other rules lack data', () => {
    const rules = [
      rule('q', { comparison: '<', threshold: 0.1, level: 'red' }),
      rule('rmr89', { comparison: '<', threshold: 10 }),
    ];
    expect(assessTriggers(rules, { ...base, rmr: null }, heading).level).toBe('red');
  });

  it('does not evaluate the open-red-hazard rule on facts stored before hazards were read', () => {
    const r = assessTriggers([rule('open-red-hazard')], base, heading);
    expect(r.waiting).toHaveLength(0);
    expect(r.notEvaluated.map((n) => n.ruleId)).toEqual(['open-red-hazard']);
    expect(r.level).toBeNull();
  });

  it('fires red on any open red hazard of the heading, saying where it lies from this face; amber ones do not fire it', () => {
    const hazard = (
      id: string,
      level: 'green' | 'amber' | 'red',
      fromChainage: number,
      toChainage: number,
      kind: 'wedge' | 'gas' | 'water' = 'wedge',
    ) => ({ id, kind, level, fromChainage, toChainage, description: '' });
    const clear = assessTriggers(
      [rule('open-red-hazard', { level: 'red' })],
      { ...base, openHazards: [hazard('a', 'amber', 990, 1000)] },
      heading,
    );
    expect(clear.level).toBe('green');
    expect(clear.firings).toHaveLength(0);

    const fired = assessTriggers(
      [rule('open-red-hazard', { level: 'red' })],
      {
        ...base,
        openHazards: [
          hazard('b', 'red', 980, 985, 'gas'),
          hazard('a', 'amber', 990, 1000),
          hazard('c', 'red', 996, 1002),
        ],
      },
      heading,
    );
    expect(fired.level).toBe('red');
    expect(fired.firings[0].detail).toBe(
      '2 open red hazards: gas 0+980.0–0+985.0 (15.0 m behind this face); wedge 0+996.0–1+002.0 (reaching this face)',
    );
    expect(
      evaluateRuleOutcome(
        { watch: 'open-red-hazard', comparison: null, threshold: null },
        { ...base, openHazards: [] },
        heading,
      ),
    ).toEqual({ state: 'clear' });
  });

  it('compares at the figures it prints: Q 0.098 reads "0.098", Q 0.1004 is not "< 0.1" [common practice]', () => {
    expect(
      evaluateRule({ watch: 'q', comparison: '<', threshold: 0.1 }, { ...base, q: 0.1004 }, heading),
    ).toBeNull();
    expect(
      evaluateRule({ watch: 'q', comparison: '<', threshold: 0.1 }, { ...base, q: 0.098 }, heading)?.detail,
    ).toBe('Q 0.098 < 0.1');
  });

  it('flags a fault dipping out of the face (sliding toward the tunnel) as adverse (planar sliding conditions: Hoek & Bray 1981, Rock Slope Engineering, ch. 7)', () => {
    // Drive 060; the face faces 240. A fault dipping 50° toward 240 daylights in the vertical face and is
    // steeper than 30° friction [computed here].
    const joints = [{ kind: 'fault', setLabel: null, dipDirection: 240, dip: 50 }];
    const fired = evaluateRule(
      { watch: 'adverse-orientation', comparison: null, threshold: null },
      { ...base, joints },
      heading,
    );
    expect(fired?.detail).toMatch(/fault 1 \(240\/50\) .*dips out of the face/);
  });

  it('gives crown-reach chainages that decrease ahead of a face driven against the chainage [computed here]', () => {
    const joints = [{ kind: 'fault', setLabel: null, dipDirection: 240, dip: 60 }];
    // methods.md §6 plane A mapped at the axis: 5/tan 60° = 2.887 m ahead, so 1000 − 2.887 on a heading
    // whose chainage decreases in the drive direction.
    const hit = nearestCrownReach({ ...base, joints }, { ...heading, chainageSense: -1 });
    expect(hit?.distance).toBeCloseTo(5 / Math.tan(Math.PI / 3), 9);
    expect(hit?.chainage).toBeCloseTo(1000 - 5 / Math.tan(Math.PI / 3), 9);
    expect(nearestCrownReach({ ...base, joints }, heading)?.chainage).toBeCloseTo(
      1000 + 5 / Math.tan(Math.PI / 3),
      9,
    );
  });
});
