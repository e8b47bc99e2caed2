import { assessRound, type AssessmentContext, type RoundRecordInput } from '../src/index.js';

const heading = {
  driveTrend: 60,
  gradientPercent: 0,
  profileHeight: 10,
  profileWidth: 10,
  axisHeight: 5,
  plannedRoundLength: 3,
};
const ground: RoundRecordInput['ground'] = {
  units: [],
  pointLoadIs50: null,
  pointLoadFactor: null,
  inflowLpm: 6,
  inflowLengthM: 3,
  waterDescription: '',
  overbreakM3: null,
  notes: '',
};
const joint = (id: string, dipDirection: number, dip: number, extra = {}) => ({
  id,
  kind: 'joint' as const,
  dipDirection,
  dip,
  setLabel: null,
  setOverride: false,
  spacingM: 0.4,
  ...extra,
});
const record = (joints: RoundRecordInput['joints']): RoundRecordInput => ({
  faceChainage: 1003,
  roundLength: 3,
  ground,
  joints,
  qInput: null,
  rmrInput: null,
  gsiObserved: null,
  recommendedClassId: null,
  setParameters: { windowM: 25, count: null },
});
const adverseRule = {
  id: 'adv',
  watch: 'adverse-orientation' as const,
  comparison: null,
  threshold: null,
  level: 'amber' as const,
  action: 'Check the bolting pattern',
  ownerRole: 'engineer',
  timeAllowedHours: 12,
  enabled: true,
};

describe('assessRound', () => {
  // An earlier round mapped a set striking along the drive (dip direction 150 for drive 060, dip 70):
  // very unfavourable (Bieniawski 1989 Table 4.1 F). This round sees two joints of it, a little scattered.
  const nearby = [148, 150, 152, 149, 151, 150].map((dd, i) => ({
    id: `n${i}`,
    roundId: 'earlier',
    dipDirection: dd,
    dip: 70 + (i % 3) - 1,
  }));
  const context: AssessmentContext = {
    heading,
    supportClasses: [],
    nearbyJoints: nearby,
    previousRound: null,
    rules: [adverseRule],
  };
  const here = record([joint('a', 147, 69), joint('b', 153, 71), joint('c', 20, 30)]);

  it('reads the same sets in the Rating view and in the adverse-orientation trigger', () => {
    const a = assessRound(here, context);
    const s1 = a.sets.sets.find((s) => s.memberIds.includes('a'));
    expect(s1).toBeDefined();
    expect(s1!.memberIds).toEqual(expect.arrayContaining(['a', 'b']));
    expect(s1!.nearbyMemberIds).toHaveLength(6);
    // The trigger reads the set found with the earlier round's joints, by the same label and mean.
    expect(a.facts.sets).toContainEqual({ label: s1!.label, plane: s1!.mean, count: 8 });
    expect(a.triggers.firings[0].detail).toContain(`${s1!.label} (150/70) is very unfavourable`);
    expect(s1!.orientation?.assessment).toBe('very unfavourable');
  });

  it('keeps a geologist’s override and marks it, and the override joins the named set', () => {
    const overridden = record([
      joint('a', 147, 69),
      joint('b', 153, 71),
      joint('c', 20, 30, { setLabel: 'S1', setOverride: true }),
    ]);
    const a = assessRound(overridden, context);
    expect(a.sets.membership.c).toBe('S1');
    expect(a.sets.overridden).toEqual(['c']);
  });

  it('takes a joint the geologist put in no set out of every set, and out of the set’s mean', () => {
    // Invented: three joints near 150/70 make one set; the geologist takes the third (150/70) out of it.
    const three = [joint('a', 147, 69), joint('b', 153, 71), joint('c', 150, 74)];
    const found = assessRound(record(three), context);
    expect(found.sets.membership.c).not.toBe('');
    const label = found.sets.membership.c;
    const out = assessRound(
      record([three[0], three[1], { ...three[2], setLabel: null, setOverride: true }]),
      context,
    );
    expect(out.sets.membership.c).toBe('');
    expect(out.sets.overridden).toEqual(['c']);
    const set = out.sets.sets.find((s) => s.label === label);
    expect(set?.memberIds).toEqual(['a', 'b']);
    expect(set?.countHere).toBe(2);
  });

  it('keeps the last round’s values with the facts for the rules that fire on a change (issue 11 item 3)', () => {
    // Invented: the last round of the stage read an inflow of 2 l/min per 10 m; this one 6 l/min over 3 m = 20.
    const rise = {
      ...adverseRule,
      id: 'rise',
      watch: 'inflow-per-10m' as const,
      comparison: '>' as const,
      threshold: 10,
      fires: 'change' as const,
    };
    const values = { q: null, rmr: null, inflowPer10m: 2, overbreakM3: null, conditions: {} };
    const withLast = assessRound(here, {
      ...context,
      rules: [rise],
      previousRound: { classId: null, values },
    });
    expect(withLast.facts.previous).toEqual(values);
    expect(withLast.triggers.firings.map((f) => f.ruleId)).toEqual(['rise']);
    // The first round of a stage: null, and the change rule is clear there.
    const first = assessRound(here, { ...context, rules: [rise] });
    expect(first.facts.previous).toBeNull();
    expect(first.triggers.level).toBe('green');
    // A last round read without its values (an older caller): absent, and the rule is not evaluated.
    const unread = assessRound(here, { ...context, rules: [rise], previousRound: { classId: null } });
    expect('previous' in unread.facts).toBe(false);
    expect(unread.triggers.notEvaluated.map((n) => n.ruleId)).toEqual(['rise']);
  });

  it('judges faults on their own and keeps them out of the sets', () => {
    const a = assessRound(record([joint('f', 240, 60, { kind: 'fault' })]), context);
    expect(a.features).toHaveLength(1);
    expect(a.sets.membership.f).toBeUndefined();
  });

  it('does not change with nearby joints when the window is 0 m', () => {
    const alone = assessRound({ ...here, setParameters: { windowM: 0, count: null } }, context);
    expect(alone.sets.sets.every((s) => s.nearbyMemberIds.length === 0)).toBe(true);
  });

  it('survives a JSON round trip unchanged (it is stored as JSON with the round)', () => {
    const a = assessRound(here, context);
    expect(JSON.parse(JSON.stringify(a))).toEqual(a);
  });

  it('suggests the classes whose ranges hold the ratings and stamps the editions', () => {
    const a = assessRound(
      {
        ...here,
        qInput: { rqd: 90, jn: 4, jr: 3, ja: 1, jw: 1, srf: 1 },
      },
      {
        ...context,
        supportClasses: [
          {
            id: 'good',
            code: 'A',
            qMin: 10,
            qMax: null,
            rmrMin: null,
            rmrMax: null,
            maxRoundLength: 4,
            retired: false,
            sortOrder: 1,
          },
          {
            id: 'fair',
            code: 'B',
            qMin: 1,
            qMax: 10,
            rmrMin: null,
            rmrMax: null,
            maxRoundLength: 3,
            retired: false,
            sortOrder: 2,
          },
        ],
      },
    );
    // Q = 90/4 × 3/1 × 1/1 = 67.5 (Barton et al. 1974) → class A [computed here].
    expect(a.ratings.q.value).toBeCloseTo(67.5, 9);
    expect(a.suggestedClassIds).toEqual(['good']);
    expect(a.editions.rmr).toMatch(/Bieniawski 1989/);
  });
});
