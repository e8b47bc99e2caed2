import { jvFromSpacings } from '@roundbook/geomath';
import { assessedHeading, emptyGround, jvOfSets, type RoundSet } from '../src/index.js';

const heading = {
  startChainage: 1000,
  driveTrend: 90,
  gradientPercent: 0.5,
  profileShape: 'horseshoe' as const,
  profileWidth: 6,
  profileHeight: 6,
  axisHeight: 3,
  plannedRoundLength: 3,
};

describe('assessedHeading', () => {
  it('reads the drive, the profile and the planned round length of a straight heading', () => {
    const g = assessedHeading(heading, 'full-face', 1100);
    expect(g).toMatchObject({
      driveTrend: 90,
      gradientPercent: 0.5,
      profileHeight: 6,
      profileWidth: 6,
      axisHeight: 3,
      chainageSense: 1,
      plannedRoundLength: 3,
    });
    // The full face reaches the crown, 3 m above the 3 m axis of a 6 m high profile.
    expect(g.stageCrownHeight).toBeCloseTo(3, 6);
  });

  it('takes the tangent of an arc at the face and the sense of the chainage', () => {
    // A right-hand arc of radius 100 m turns the bearing by 180/π ≈ 57.3° per 100 m (geometry of a circle).
    const curved = {
      ...heading,
      chainageSense: 'decreasing' as const,
      alignmentSegments: [{ length: 100, radius: 100, side: 'right' as const }],
    };
    const g = assessedHeading(curved, 'full-face', 950);
    expect(g.chainageSense).toBe(-1);
    expect(g.driveTrend).toBeCloseTo(90 + (50 / 100) * (180 / Math.PI), 1);
    // Without a face chainage the drive trend is the heading's own.
    expect(assessedHeading(curved, 'full-face').driveTrend).toBe(90);
  });
});

describe('jvOfSets', () => {
  const set = (meanSpacingM: number | null) => ({ meanSpacingM }) as RoundSet;

  it('is Jv from the mean spacing of each set (geomath jvFromSpacings)', () => {
    expect(jvOfSets([set(0.5), set(null), set(0.25)])).toEqual({
      jv: jvFromSpacings([0.5, 0.25]),
      spacings: [0.5, 0.25],
    });
  });

  it('is null when no set has a spacing', () => {
    expect(jvOfSets([set(null)])).toBeNull();
    expect(jvOfSets([])).toBeNull();
  });
});

describe('emptyGround', () => {
  it('records nothing, and each call is a record of its own', () => {
    const a = emptyGround();
    expect(a.units).toEqual([]);
    // Every other field is empty: no number (null) and no text ('').
    expect(Object.entries(a).filter(([k, v]) => k !== 'units' && v !== null && v !== '')).toEqual([]);
    expect(Object.keys(a)).toHaveLength(8);
    a.units.push({ name: 'Granite', sharePercent: 100, weatheringGrade: null, strengthGrade: null });
    expect(emptyGround().units).toEqual([]);
  });
});
