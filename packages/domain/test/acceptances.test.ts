import {
  acceptanceErrors,
  acceptanceLapse,
  applyAcceptances,
  assessTriggers,
  conditionSnapshot,
  RED_ACCEPTANCE_REASON_MIN,
  type RoundFacts,
  type TriggerAcceptanceInput,
  type TriggerRuleInput,
} from '../src/index.js';

// Invented figures. Drive 060: a set dipping 70° toward 150 strikes along the drive and dips steeply,
// very unfavourable for tunnelling (Bieniawski 1989, Table 4.1F, as the adverse-orientation rule reads it).
const heading = { driveTrend: 60, gradientPercent: 0, profileHeight: 10, profileWidth: 10, axisHeight: 5 };
const along = { label: 'S1', plane: { dipDirection: 150, dip: 70 }, count: 3 };
const facts: RoundFacts = {
  q: 0.5,
  rmr: 40,
  inflowPer10m: 5,
  overbreakM3: 1,
  faceChainage: 1010,
  recommendedClassId: 'c-3',
  previousClassId: 'c-3',
  joints: [],
  sets: [along],
};

const rule = (r: Partial<TriggerRuleInput> & Pick<TriggerRuleInput, 'id' | 'watch'>): TriggerRuleInput => ({
  comparison: null,
  threshold: null,
  level: 'amber',
  action: 'Tell the engineer.',
  ownerRole: 'engineer',
  timeAllowedHours: 4,
  enabled: true,
  ...r,
});
const adverse = rule({ id: 'r-adv', watch: 'adverse-orientation', level: 'red' });
const lowQ = rule({ id: 'r-q', watch: 'q', comparison: '<', threshold: 1, level: 'amber' });
const rules = [adverse, lowQ];

/** An acceptance of a rule taken on `at` facts, for a range and/or until a date. */
function acceptOn(
  r: TriggerRuleInput,
  at: RoundFacts,
  extra: Partial<TriggerAcceptanceInput> = {},
): TriggerAcceptanceInput {
  const snapshot = conditionSnapshot(r, at, heading);
  if (!snapshot) throw new Error('the rule does not fire on these facts');
  return {
    id: `acc-${r.id}`,
    ruleId: r.id,
    fromChainage: 1000,
    toChainage: 1030,
    until: null,
    reason: 'Set S1 along the drive is covered by class C3 bolting.',
    acceptedByName: 'Edda Ravenshaw',
    acceptedAt: '2026-12-01T08:00:00.000Z',
    snapshot,
    ...extra,
  };
}
const now = new Date('2026-12-02T08:00:00.000Z');
const judge = (f: RoundFacts, list: TriggerAcceptanceInput[], at = now) =>
  applyAcceptances(assessTriggers(rules, f, heading), rules, f, heading, list, at);

describe('conditionSnapshot', () => {
  it('keeps what fired with its values: the adverse sets with their planes, the value of a numeric rule, the class', () => {
    const s = conditionSnapshot(adverse, facts, heading)!;
    expect(s).toMatchObject({ watch: 'adverse-orientation', level: 'red', classId: 'c-3' });
    expect(s.adverse).toEqual([{ label: 'S1', kind: 'set', dipDirection: 150, dip: 70 }]);
    expect(conditionSnapshot(lowQ, facts, heading)).toMatchObject({ value: 0.5 });
    expect(conditionSnapshot(lowQ, { ...facts, q: 4 }, heading)).toBeNull(); // does not fire
  });
});

describe('applyAcceptances', () => {
  it('inside the range the accepted rule is listed as accepted and does not raise the level', () => {
    const without = judge(facts, []);
    expect(without.level).toBe('red');
    const t = judge({ ...facts, faceChainage: 1020 }, [acceptOn(adverse, facts)]);
    expect(t.accepted.map((a) => [a.ruleId, a.acceptanceId, a.reason])).toEqual([
      ['r-adv', 'acc-r-adv', 'Set S1 along the drive is covered by class C3 bolting.'],
    ]);
    expect(t.firings.map((f) => f.ruleId)).toEqual(['r-q']);
    expect(t.level).toBe('amber'); // the low Q still raises it
    expect(t.lapsed).toEqual([]);
  });

  it('with every fired rule accepted and all rules evaluated, the level is green', () => {
    const t = judge(facts, [acceptOn(adverse, facts), acceptOn(lowQ, facts)]);
    expect(t.firings).toEqual([]);
    expect(t.accepted).toHaveLength(2);
    expect(t.level).toBe('green');
  });

  it('outside the range the rule raises the level again, with why', () => {
    const t = judge({ ...facts, faceChainage: 1033 }, [acceptOn(adverse, facts)]);
    expect(t.level).toBe('red');
    expect(t.accepted).toEqual([]);
    expect(t.lapsed).toEqual([
      {
        ruleId: 'r-adv',
        acceptanceId: 'acc-r-adv',
        why: expect.stringMatching(/outside the accepted range 1\+000.*1\+030/),
      },
    ]);
  });

  it('after the date the rule raises the level again', () => {
    const until = acceptOn(adverse, facts, {
      fromChainage: null,
      toChainage: null,
      until: '2026-12-05T00:00:00.000Z',
    });
    expect(judge(facts, [until], new Date('2026-12-04T23:00:00.000Z')).level).toBe('amber');
    const after = judge(facts, [until], new Date('2026-12-05T00:00:01.000Z'));
    expect(after.level).toBe('red');
    expect(after.lapsed[0].why).toBe('the acceptance ran until 2026-12-05');
  });

  it('a changed condition re-raises: a new adverse set, a steeper dip, a different class, a lower Q', () => {
    const list = [acceptOn(adverse, facts), acceptOn(lowQ, facts)];
    // A second set striking along the drive, dipping the other way (330/70): a new set.
    const newSet = judge(
      { ...facts, sets: [along, { label: 'S2', plane: { dipDirection: 330, dip: 70 }, count: 4 }] },
      list,
    );
    expect(newSet.level).toBe('red');
    expect(newSet.lapsed[0].why).toMatch(/a new adverse set: S2/);
    // The same set, 10° steeper (within 15° of the accepted plane, more than 5° steeper).
    const steeper = judge({ ...facts, sets: [{ ...along, plane: { dipDirection: 150, dip: 80 } }] }, list);
    expect(steeper.lapsed[0].why).toBe('S1 dips steeper: 80° against 70° when accepted');
    // 3° steeper is the same condition.
    expect(judge({ ...facts, sets: [{ ...along, plane: { dipDirection: 152, dip: 73 } }] }, list).level).toBe(
      'green',
    );
    // Another class recommended: both acceptances lapse.
    const otherClass = judge({ ...facts, recommendedClassId: 'c-2' }, list);
    expect(otherClass.accepted).toEqual([]);
    expect(otherClass.lapsed.map((l) => l.why)).toEqual([
      'the recommended support class is not the one the condition was accepted with',
      'the recommended support class is not the one the condition was accepted with',
    ]);
    // A lower Q than accepted re-raises the Q rule; a higher one (still below 1) does not.
    const lower = judge({ ...facts, q: 0.2 }, list);
    expect(lower.firings.map((f) => f.ruleId)).toEqual(['r-q']);
    expect(lower.lapsed[0].why).toBe('Q is 0.2 now, against 0.5 when accepted');
    expect(judge({ ...facts, q: 0.8 }, list).level).toBe('green');
  });

  it('an acceptance of another rule, or of a rule that is clear now, changes nothing', () => {
    const t = judge({ ...facts, q: 5 }, [acceptOn(lowQ, facts)]);
    expect(t.level).toBe('red');
    expect(t.accepted).toEqual([]);
    expect(t.lapsed).toEqual([]);
  });

  it('a rule whose level was changed since the acceptance raises again', () => {
    const acc = acceptOn(lowQ, facts);
    const redQ = { ...lowQ, level: 'red' as const };
    const t = applyAcceptances(
      assessTriggers([adverse, redQ], facts, heading),
      [adverse, redQ],
      facts,
      heading,
      [acc],
      now,
    );
    expect(t.lapsed[0].why).toBe("the rule's level is red now, not amber as accepted");
  });
});

describe('acceptanceLapse', () => {
  it('holds inside a range given either way round, and on an open-ended range', () => {
    const r = { fromChainage: 1030, toChainage: 1000, until: null };
    expect(acceptanceLapse(r, 1000, now)).toBeNull();
    expect(acceptanceLapse(r, 1030, now)).toBeNull();
    expect(acceptanceLapse(r, 999.9, now)).toMatch(/outside/);
    expect(acceptanceLapse({ fromChainage: 1000, toChainage: null, until: null }, 5000, now)).toBeNull();
    expect(acceptanceLapse({ fromChainage: null, toChainage: 1030, until: null }, 1031, now)).toMatch(
      /past the accepted range/,
    );
  });
});

describe('acceptanceErrors', () => {
  const ok = { fromChainage: 1000, toChainage: 1030, until: null, reason: 'Covered by the class.' };
  it('needs a range or a date, a date to come, and a reason', () => {
    expect(acceptanceErrors('amber', ok, now)).toEqual({});
    expect(
      acceptanceErrors('amber', { ...ok, fromChainage: null, toChainage: null }, now).toChainage,
    ).toMatch(/range or the date/);
    expect(acceptanceErrors('amber', { ...ok, until: '2026-12-01' }, now).until).toMatch(/passed/);
    expect(acceptanceErrors('amber', { ...ok, reason: ' ' }, now).reason).toMatch(/Say why/);
  });
  it('a red rule needs a written reason', () => {
    expect(acceptanceErrors('red', { ...ok, reason: 'Covered.' }, now).reason).toMatch(
      new RegExp(`written reason \\(at least ${RED_ACCEPTANCE_REASON_MIN}`),
    );
    expect(
      acceptanceErrors('red', { ...ok, reason: 'Set S1 is covered by the C3 pattern bolting.' }, now),
    ).toEqual({});
  });
});

describe('acceptances of a rule that fires on a change (issue 11 item 3)', () => {
  // Invented figures: Q fell from 4 to 1.5 at 0+1010; the engineer accepted that ground.
  const qFall = rule({ id: 'r-fall', watch: 'q', comparison: '<', threshold: -50, fires: 'change' });
  const last = { q: 4, rmr: 40, inflowPer10m: 5, overbreakM3: 1, conditions: {} };
  const fell: RoundFacts = { ...facts, q: 1.5, sets: [], previous: last };
  const judgeFall = (f: RoundFacts, list: TriggerAcceptanceInput[]) =>
    applyAcceptances(assessTriggers([qFall], f, heading), [qFall], f, heading, list, now);

  it('keeps the Q the fall reached, and the fall itself', () => {
    expect(conditionSnapshot(qFall, fell, heading)).toMatchObject({
      fires: 'change',
      value: 1.5,
      change: -63,
    });
  });

  it('holds a later fall that reaches no lower ground, and lapses on one that reaches lower', () => {
    const accepted = acceptOn(qFall, fell);
    // 3.2 → 1.5 is another fall of 53 %, to the same Q 1.5: the accepted ground.
    const same = judgeFall({ ...fell, faceChainage: 1014, previous: { ...last, q: 3.2 } }, [accepted]);
    expect(same.accepted.map((a) => a.ruleId)).toEqual(['r-fall']);
    expect(same.level).toBe('green');
    // 1.5 → 0.6 is a fall of 60 % to lower ground than accepted: it raises the level again.
    const lower = judgeFall({ ...fell, q: 0.6, faceChainage: 1014, previous: { ...last, q: 1.5 } }, [
      accepted,
    ]);
    expect(lower.level).toBe('amber');
    expect(lower.lapsed[0].why).toBe('Q is 0.6 now, beyond the 1.5 the accepted change reached');
  });

  it('lapses when the rule is switched between the value and a change', () => {
    const accepted = acceptOn(qFall, fell);
    const onValue = rule({ id: 'r-fall', watch: 'q', comparison: '<', threshold: 2 });
    const r = applyAcceptances(
      assessTriggers([onValue], fell, heading),
      [onValue],
      fell,
      heading,
      [accepted],
      now,
    );
    expect(r.lapsed[0].why).toBe(
      'the rule fires on the value now, not on a change from the last round as accepted',
    );
  });
});
