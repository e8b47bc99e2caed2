// Issue 10 "Trust the numbers": the rules of the assessment, each check with its source.
import {
  assessRound,
  driveTrendAt,
  groundErrors,
  infillOf,
  nextFaceChainage,
  pointLoadWarning,
  readWater,
  roundLengthOf,
  stageGeometry,
  type AssessmentContext,
  type RoundRecordInput,
} from '../src/index.js';

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
  inflowLpm: null,
  inflowLengthM: null,
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
  jr: 1.5,
  ja: 2,
  apertureMm: 0.5,
  infill: '',
  thicknessM: null,
  ...extra,
});
const fault = joint('f', 240, 60, {
  kind: 'fault' as const,
  jr: 1,
  ja: 8,
  apertureMm: 40,
  infill: 'soft clay gouge',
  thicknessM: 0.4,
  spacingM: null,
});
const record = (over: Partial<RoundRecordInput> = {}): RoundRecordInput => ({
  faceChainage: 1003,
  roundLength: 3,
  ground,
  joints: [],
  qInput: null,
  rmrInput: null,
  gsiObserved: null,
  recommendedClassId: null,
  setParameters: { windowM: 0, count: null },
  ...over,
});
const context: AssessmentContext = {
  heading,
  supportClasses: [],
  nearbyJoints: [],
  previousRound: null,
  rules: [],
};
const q = { rqd: 60, jn: 4, jr: 1.5, ja: 2, jw: 1, srf: 1 };
const rmrInput = (groundwater: NonNullable<RoundRecordInput['rmrInput']>['groundwater']) => ({
  strength: { kind: 'point-load' as const, is50: 4 },
  rqd: 60,
  spacingM: 0.4,
  condition: { kind: 'simple' as const, condition: 'slightly-rough-slightly-weathered' as const },
  groundwater,
  orientation: { kind: 'not assessed' as const },
});

describe('water once (item 6)', () => {
  it('reads l/min over a stated length: 6 l/min over 3 m = 20 l/min per 10 m [computed here]', () => {
    expect(readWater({ inflowLpm: 6, inflowLengthM: 3 }).per10m).toBeCloseTo(20, 12);
  });

  it('asks for a missing length instead of using the round length (before: 6 × 10 / round length 3 = 20) [common practice]', () => {
    const a = assessRound(record({ ground: { ...ground, inflowLpm: 6, inflowLengthM: null } }), context);
    expect(a.inflowPer10m).toBeNull();
    expect(a.missing).toHaveProperty(['ground.inflowLengthM']);
    expect(a.warnings.join(' ')).toContain('ground.inflowLengthM');
  });

  it('takes an inflow at the face whole within its 10 m (Roundbook convention, from memory)', () => {
    expect(readWater({ inflowLpm: 6, inflowLengthM: null, inflowAtFace: true }).per10m).toBe(6);
  });

  it('rates RMR89 groundwater from the one record: 20 l/min per 10 m rates 7, not the 4 typed (which rates 10) (Bieniawski 1989, Table 4.1 A5)', () => {
    const a = assessRound(
      record({
        ground: { ...ground, inflowLpm: 6, inflowLengthM: 3 },
        rmrInput: rmrInput({ kind: 'inflow', litresPerMinutePer10m: 4 }),
      }),
      context,
    );
    expect(a.ratings.rmr.parts.groundwater).toBe(7);
    expect(a.facts.inflowPer10m).toBeCloseTo(20, 12);
    expect(a.warnings.join(' ')).toMatch(/reads the inflow recorded in Ground \(20 l\/min per 10 m\)/);
  });

  it('warns when groundwater rated "completely dry" (15) contradicts 20 l/min per 10 m (7) (Bieniawski 1989, Table 4.1 A5)', () => {
    const a = assessRound(
      record({
        ground: { ...ground, inflowLpm: 6, inflowLengthM: 3 },
        rmrInput: rmrInput({ kind: 'condition', condition: 'completely dry' }),
      }),
      context,
    );
    expect(a.ratings.rmr.parts.groundwater).toBe(15);
    expect(a.warnings.join(' ')).toMatch(
      /“completely dry” \(15\).*rates 7 \(Bieniawski 1989, Table 4.1 A5\)/,
    );
    const damp = assessRound(
      record({
        ground: { ...ground, inflowLpm: 2, inflowLengthM: 5 },
        rmrInput: rmrInput({ kind: 'condition', condition: 'damp' }),
      }),
      context,
    );
    // 4 l/min per 10 m is "under 10" (10), the same row as damp (10): no warning.
    expect(damp.warnings.join(' ')).not.toMatch(/Table 4.1 A5/);
  });
});

describe('Q inputs (item 5)', () => {
  it('stamps the Q table edition it used (geomath qValue().edition)', () => {
    const a = assessRound(record({ qInput: q }), context);
    expect(a.editions.qTable).toBe('ngi-2015');
    expect(a.ratings.q.edition).toBe('ngi-2015');
  });

  it('warns that Jn 7 is not in the table and names the nearest rows, 6 and 9 (Barton et al. 1974, Table of Jn; NGI 2015)', () => {
    const a = assessRound(record({ qInput: { ...q, jn: 7 } }), context);
    expect(a.warnings.join(' ')).toMatch(/Jn 7 is not a value .* nearest rows are 6 .* and 9/);
  });

  it('does not add +1 to Jr 1 of a clay zone (no wall contact) (NGI 2015 handbook, note to the Jr table)', () => {
    const a = assessRound(
      record({ qInput: { ...q, jr: 1, jrRowId: 'jr-clay-zone', jrSpacingOver3m: true } }),
      context,
    );
    expect(a.ratings.q.parts.jrUsed).toBe(1);
    expect(a.warnings.join(' ')).toMatch(/not added to Jr 1/);
  });

  it('takes Jr and Ja from the named governing fault: a typed 1.5/2 against the fault’s recorded 1/8 warns (Barton et al. 1974: weakest significant discontinuity, from memory)', () => {
    const a = assessRound(record({ joints: [fault], qInput: { ...q, governingJointId: 'f' } }), context);
    expect(a.governing).toMatchObject({ source: 'named', jointId: 'f', jr: 1, ja: 8 });
    expect(a.warnings).toContain('Jr 1.5 typed, but the governing fault (joint 1) is recorded with Jr 1.');
    expect(a.warnings).toContain('Ja 2 typed, but the governing fault (joint 1) is recorded with Ja 8.');
    const agreed = assessRound(
      record({ joints: [fault], qInput: { ...q, jr: 1, ja: 8, governingJointId: 'f' } }),
      context,
    );
    expect(agreed.warnings.filter((w) => w.includes('governing'))).toEqual([]);
    // Q = 60/4 × 1/8 × 1/1 = 1.875 [computed here]
    expect(agreed.ratings.q.value).toBeCloseTo(1.875, 12);
  });

  it('suggests the weakest significant discontinuity when none is named, and warns when the typed pair is stronger (Barton et al. 1974, from memory)', () => {
    const a = assessRound(record({ joints: [joint('a', 150, 70), fault], qInput: q }), context);
    expect(a.governing).toMatchObject({ source: 'suggested', jointId: 'f' });
    expect(a.warnings.join(' ')).toMatch(/not from the weakest significant discontinuity: fault \(joint 2\)/);
  });

  it('warns when the named governing joint is no longer on the round [common practice]', () => {
    const a = assessRound(record({ joints: [], qInput: { ...q, governingJointId: 'gone' } }), context);
    expect(a.warnings.join(' ')).toMatch(/not a joint of this round/);
  });

  it('checks Jn against one set plus random joints: Jn 9 warns, the table gives 3 (Barton et al. 1974, Jn table; geomath jnSetCountWarning)', () => {
    const joints = [joint('a', 150, 70), joint('b', 152, 71), joint('c', 149, 69), joint('r', 20, 30)];
    const one = { windowM: 0, count: 1 };
    const a = assessRound(record({ joints, qInput: { ...q, jn: 9 }, setParameters: one }), context);
    expect(a.sets.sets).toHaveLength(1);
    expect(a.sets.membership.r).toBe('');
    expect(a.warnings.join(' ')).toMatch(
      /Jn 9 does not match the 1 set and random joints found: the table gives 3/,
    );
    const ok = assessRound(record({ joints, qInput: { ...q, jn: 3 }, setParameters: one }), context);
    expect(ok.warnings.join(' ')).not.toMatch(/does not match/);
  });
});

describe('RMR89 condition against the governing discontinuity (item 3)', () => {
  it('reads "soft clay gouge" 0.4 m thick as soft infill of 400 mm [common practice]', () => {
    expect(infillOf({ infill: 'soft clay gouge', apertureMm: 40, thicknessM: 0.4 })).toEqual({
      kind: 'soft',
      thicknessMm: 400,
    });
    expect(infillOf({ infill: '', apertureMm: 1, thicknessM: null })).toBeNull();
  });

  it('warns when "slightly rough, slightly weathered" is typed for a fault with 400 mm soft gouge (Bieniawski 1989, Table 4.1 A4 and note to E)', () => {
    const a = assessRound(
      record({
        joints: [fault],
        qInput: { ...q, jr: 1, ja: 8, governingJointId: 'f' },
        rmrInput: rmrInput({ kind: 'condition', condition: 'damp' }),
      }),
      context,
    );
    expect(a.warnings.join(' ')).toMatch(
      /means open under 1 mm, but the governing joint has soft infill 400 mm/,
    );
  });
});

describe('ground description (item 7)', () => {
  const unit = { name: 'gneiss', sharePercent: 100, weatheringGrade: 'WII', strengthGrade: 'R4' };
  it('refuses grades that are not codes of the project scale, e.g. "W9" (ISRM 1981 weathering grades WI–WVI, from memory)', () => {
    const e = groundErrors({ units: [{ ...unit, weatheringGrade: 'W9', strengthGrade: 'hard' }] }, 'isrm');
    expect(e['ground.units.0.weatheringGrade']).toMatch(/“W9” is not a weathering grade .* WI, WII/);
    expect(e['ground.units.0.strengthGrade']).toMatch(/“hard” is not a strength grade/);
    expect(groundErrors({ units: [unit] }, 'isrm')).toEqual({});
    // ISO 14689 codes are its own (0–5 for weathering): WII is not one of them.
    expect(groundErrors({ units: [unit] }, 'iso-14689')).toHaveProperty(['ground.units.0.weatheringGrade']);
  });

  it('refuses unit shares that do not make 100 %: 60 + 30 = 90 [common practice]', () => {
    const e = groundErrors({
      units: [
        { ...unit, sharePercent: 60 },
        { ...unit, sharePercent: 30 },
      ],
    });
    expect(e['ground.units']).toMatch(/add up to 90 %/);
  });

  it('warns when Is50 × factor misses the strength grade: 2 × 22 = 44 MPa is not R4 (50–100 MPa) (ISRM 1981 strength grades; Broch & Franklin 1972 factor, from memory)', () => {
    const g = { units: [unit], pointLoadIs50: 2, pointLoadFactor: 22 };
    expect(pointLoadWarning(g)).toMatch(/UCS ≈ 22 × 2 = 44 MPa, outside .* R4 \(50–100 MPa\)/);
    expect(pointLoadWarning({ ...g, units: [{ ...unit, strengthGrade: 'R3' }] })).toBeNull();
  });
});

describe('chainage sense and alignment (items 9–10)', () => {
  it('gives positive round lengths and the next face by the sense [common practice of route surveying]', () => {
    expect(roundLengthOf(2446.5, 2450, 'decreasing')).toBe(3.5);
    expect(roundLengthOf(2453.5, 2450, 'increasing')).toBe(3.5);
    expect(nextFaceChainage(2450, 3.5, 'decreasing')).toBe(2446.5);
    expect(nextFaceChainage(2450, 3.5, null)).toBe(2453.5);
  });

  it('takes the drive at the face from the alignment: 50 m into a 200 m right arc turns 14.32° (bearing change = s/R) [computed here]', () => {
    const h = {
      startChainage: 1000,
      driveTrend: 90,
      gradientPercent: 0,
      alignmentSegments: [
        { length: 100, radius: null, side: null },
        { length: 100, radius: 200, side: 'right' as const },
      ],
    };
    expect(driveTrendAt(h, 1050)).toBeCloseTo(90, 9);
    expect(driveTrendAt(h, 1150)).toBeCloseTo(90 + (50 / 200) * (180 / Math.PI), 9);
    expect(driveTrendAt({ ...h, chainageSense: 'decreasing' }, 850)).toBeCloseTo(
      90 + (50 / 200) * (180 / Math.PI),
      9,
    );
    // Beyond the last segment the alignment runs on along the tangent: 100/200 rad = 28.65°.
    expect(driveTrendAt(h, 1300)).toBeCloseTo(90 + (100 / 200) * (180 / Math.PI), 9);
  });
});

describe('crown reach on the stage’s own part of the profile (item 8)', () => {
  it('reads the top heading above the bench line and the bench below it (geomath stagePart) [computed here]', () => {
    const h = {
      profileShape: 'rectangular' as const,
      profileWidth: 10,
      profileHeight: 10,
      axisHeight: 5,
      benchHeight: 6,
    };
    expect(stageGeometry(h, 'top-heading')).toEqual({ crownHeight: 5, invertDepth: -1, halfWidth: 5 });
    expect(stageGeometry(h, 'bench')).toEqual({ crownHeight: 1, invertDepth: 5, halfWidth: 5 });
  });

  it('reports crown, invert and walls; the bench crown (1 m above the axis) is reached 1/tan 60° ahead (methods.md §6) [computed here]', () => {
    const joints = [joint('f', 240, 60, { kind: 'fault' as const })];
    const bench = { ...heading, stageCrownHeight: 1, stageInvertDepth: 5, stageHalfWidth: 5 };
    const a = assessRound(record({ joints, faceChainage: 1000 }), { ...context, heading: bench });
    const reach = a.lookAhead[0];
    expect(reach.distance.crown).toBeCloseTo(1 / Math.tan(Math.PI / 3), 9);
    expect(reach.distance.invert).toBeCloseTo(-5 / Math.tan(Math.PI / 3), 9);
    // The fault strikes across the drive: it meets both walls at the face itself.
    expect(reach.distance.rightWall).toBeCloseTo(0, 9);
    expect(reach.distance.leftWall).toBeCloseTo(0, 9);
    expect(reach.traceKnown).toBe(false);
  });

  it('measures from the trace position on the face when recorded: a trace 1 m up reaches the bench crown at the face [computed here]', () => {
    const joints = [joint('f', 240, 60, { kind: 'fault' as const, faceOffset: { right: 0, up: 1 } })];
    const bench = {
      ...heading,
      stageCrownHeight: 1,
      stageInvertDepth: 5,
      stageHalfWidth: 5,
      chainageSense: -1 as const,
    };
    const a = assessRound(record({ joints, faceChainage: 1000 }), { ...context, heading: bench });
    expect(a.lookAhead[0].distance.crown).toBeCloseTo(0, 9);
    // Driven against the chainage, the invert crossing behind the face has a larger chainage.
    expect(a.lookAhead[0].chainage.invert!).toBeGreaterThan(1000);
    expect(a.lookAhead[0].traceKnown).toBe(true);
  });
});
