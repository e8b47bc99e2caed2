import {
  assessTriggers,
  evaluateRule,
  evaluateRuleOutcome,
  changeWords,
  nearestCrownReach,
  numericChange,
  previousRoundValues,
  setMeans,
  triggerRuleErrors,
  triggerRuleSummary,
  type PreviousRoundValues,
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

describe("rules that fire on a change from the last round (issue 11 item 3, fires: 'change')", () => {
  // Invented figures. The previous round of the same heading and stage read Q 4, RMR89 55, inflow 10, overbreak 1.
  const previous: PreviousRoundValues = {
    q: 4,
    rmr: 55,
    inflowPer10m: 10,
    overbreakM3: 1,
    conditions: { 'adverse-orientation': false, 'open-red-hazard': true, 'round-over-class-length': false },
  };
  const facts: RoundFacts = { ...base, q: 1.5, rmr: 43, inflowPer10m: 32.5, overbreakM3: 1.2, previous };
  const qFall = { watch: 'q' as const, comparison: '<' as const, threshold: -50, fires: 'change' as const };

  it('fires on a relative fall of Q: 4 → 1.5 is −63 %, more than a 50 % fall (Q is logarithmic, compared by ratio: common practice)', () => {
    expect(evaluateRuleOutcome(qFall, facts, heading)).toEqual({
      state: 'fired',
      value: -63,
      detail: 'Q fell by 63 % from the last round (4 → 1.5); the rule fires when it falls by more than 50 %',
    });
    // 4 → 2.5 is a fall of 38 %: clear. The same Q 1.5 on its own is no change rule's business.
    expect(evaluateRuleOutcome(qFall, { ...facts, q: 2.5 }, heading)).toEqual({ state: 'clear' });
    // A fall of exactly 50 % (4 → 2) is not more than 50 %; "50 % or more" fires on it.
    expect(evaluateRuleOutcome(qFall, { ...facts, q: 2 }, heading).state).toBe('clear');
    expect(evaluateRuleOutcome({ ...qFall, comparison: '<=' }, { ...facts, q: 2 }, heading).state).toBe(
      'fired',
    );
    // A fall that would read 100 % takes the decimals it needs: Q never reaches 0 (Barton et al. 1974: 0.001 to 1000).
    expect(numericChange('q', 11.25, 0.0275)).toBe(-99.7); // printed 11 → 0.028 [computed here]
    expect(numericChange('q', 1000, 0.001)).toBe(-99.9999);
    // The same rule on the value (the default) reads Q < −50, which no Q is.
    expect(evaluateRuleOutcome({ ...qFall, fires: 'value' }, facts, heading).state).toBe('clear');
  });

  it('compares RMR89, inflow and overbreak by their difference in the watch’s unit (common practice)', () => {
    const rmr = evaluateRuleOutcome(
      { watch: 'rmr89', comparison: '<=', threshold: -10, fires: 'change' },
      facts,
      heading,
    );
    expect(rmr).toEqual({
      state: 'fired',
      value: -12,
      detail:
        'RMR89 fell by 12 points from the last round (55 → 43); the rule fires when it falls by 10 points or more',
    });
    const inflow = evaluateRuleOutcome(
      { watch: 'inflow-per-10m', comparison: '>', threshold: 20, fires: 'change' },
      facts,
      heading,
    );
    expect(inflow.state).toBe('fired');
    expect(inflow.state === 'fired' && inflow.detail).toBe(
      'Inflow rose by 22.5 l/min per 10 m from the last round (10 → 32.5 l/min per 10 m); the rule fires when it rises by more than 20 l/min per 10 m',
    );
    expect(
      evaluateRuleOutcome(
        { watch: 'overbreak', comparison: '>=', threshold: 0.5, fires: 'change' },
        facts,
        heading,
      ),
    ).toEqual({ state: 'clear' });
  });

  it('is not evaluated without the last round’s values, and clear on the first round of a stage', () => {
    const { previous: _p, ...stored } = facts;
    expect(evaluateRuleOutcome(qFall, stored, heading)).toEqual({
      state: 'not-evaluated',
      detail: 'the last round’s values were not kept with this round’s facts',
    });
    expect(evaluateRuleOutcome(qFall, { ...facts, previous: { ...previous, q: null } }, heading)).toEqual({
      state: 'not-evaluated',
      detail: 'Q was not recorded on the last round',
    });
    expect(evaluateRuleOutcome(qFall, { ...facts, q: null }, heading).state).toBe('not-evaluated');
    expect(
      evaluateRuleOutcome(qFall, { ...facts, previous: null, previousClassId: undefined }, heading),
    ).toEqual({ state: 'clear', detail: 'first round of this stage: nothing to compare with' });
    // Never green while a change rule lacks the last round.
    const qRule = {
      id: 'q-fall',
      ...qFall,
      level: 'amber' as const,
      action: 'Tell the engineer',
      ownerRole: 'engineer',
      timeAllowedHours: 4,
      enabled: true,
    };
    expect(assessTriggers([qRule], stored, heading).level).toBeNull();
    expect(assessTriggers([qRule], facts, heading).level).toBe('amber');
  });

  it('fires a yes/no condition only when it newly appears (clear on the last round), not while it stays', () => {
    const hazard = {
      id: 'h',
      kind: 'wedge' as const,
      level: 'red' as const,
      fromChainage: 995,
      toChainage: 998,
      description: '',
    };
    const red = {
      watch: 'open-red-hazard' as const,
      comparison: null,
      threshold: null,
      fires: 'change' as const,
    };
    const withHazard = { ...facts, openHazards: [hazard] };
    // The last round already had an open red hazard: it stays, so the change rule is clear.
    expect(evaluateRuleOutcome(red, withHazard, heading)).toEqual({
      state: 'clear',
      detail: 'the condition already held on the last round',
    });
    // The last round was clear: the hazard is new, and the rule fires with its own words.
    const fresh = {
      ...withHazard,
      previous: { ...previous, conditions: { ...previous.conditions, 'open-red-hazard': false } },
    };
    expect(evaluateRuleOutcome(red, fresh, heading)).toEqual({
      state: 'fired',
      value: 1,
      detail: 'New since the last round: Open red hazard: wedge 0+995.0–0+998.0 (2.0 m behind this face)',
    });
    // The condition is not there now: clear, whatever the last round read.
    expect(evaluateRuleOutcome(red, { ...fresh, openHazards: [] }, heading).state).toBe('clear');
    // Not known on the last round (facts stored before hazards were read): not evaluated.
    const unknown = { ...withHazard, previous: { ...previous, conditions: { 'open-red-hazard': null } } };
    expect(evaluateRuleOutcome(red, unknown, heading).state).toBe('not-evaluated');
  });

  it('reads the last round’s conditions from its own facts (previousRoundValues)', () => {
    const last: RoundFacts = {
      ...base,
      q: 4,
      roundLength: 3,
      allowedRoundLength: 2.5,
      previousClassId: 'a',
    };
    expect(previousRoundValues(last, heading)).toEqual({
      q: 4,
      rmr: 35,
      inflowPer10m: 30,
      overbreakM3: 2,
      // No joints: adverse orientation could not be judged; no hazards read; 3 m over 2.5 m allowed.
      conditions: { 'adverse-orientation': null, 'open-red-hazard': null, 'round-over-class-length': true },
    });
  });

  it('refuses the combinations a change rule cannot have, in words', () => {
    expect(triggerRuleErrors({ ...qFall, comparison: '=' }).comparison).toMatch(/fall .* or on a rise/);
    expect(triggerRuleErrors({ ...qFall, threshold: 50 }).threshold).toBe(
      'A fall is a change of 0 or less: give it with a minus sign, e.g. −50.',
    );
    expect(triggerRuleErrors({ ...qFall, threshold: -100 }).threshold).toMatch(/cannot fall by 100 %/);
    expect(
      triggerRuleErrors({ watch: 'support-class-change', comparison: null, threshold: null, fires: 'change' })
        .fires,
    ).toMatch(/already compares the class/);
    expect(
      triggerRuleErrors({ watch: 'crown-crossing-within', comparison: null, threshold: 5, fires: 'change' })
        .fires,
    ).toMatch(/value only/);
    expect(triggerRuleErrors(qFall)).toEqual({});
    // On the value, a Q threshold of −50 is outside the Q range as before.
    expect(triggerRuleErrors({ ...qFall, fires: 'value' }).threshold).toBeDefined();
  });

  it('says the rule in words', () => {
    expect(triggerRuleSummary({ ...qFall, level: 'red' })).toBe(
      'Q falls by more than 50 % from the last round → red',
    );
    expect(
      triggerRuleSummary({
        watch: 'inflow-per-10m',
        comparison: '>=',
        threshold: 20,
        level: 'amber',
        fires: 'change',
      }),
    ).toBe('Water inflow per 10 m rises by 20 l/min per 10 m or more from the last round → amber');
    expect(
      triggerRuleSummary({
        watch: 'adverse-orientation',
        comparison: null,
        threshold: null,
        level: 'amber',
        fires: 'change',
      }),
    ).toBe('A set or feature adverse to the drive, newly (not on the last round) → amber');
    expect(changeWords('q', '>', 0)).toBe('rises');
  });
});
