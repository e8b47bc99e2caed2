import { evaluateRule, setMeans, type RoundFacts } from './trigger-evaluation';

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
