// The position a trace gives to the look-ahead and the crown-reach rule. Check values: methods.md §6,
// plane A (240/60 through 2 m right of and 1 m above the axis; circular tunnel r = 5 m, drive 060°,
// horizontal, face at 1000.000 m: crown 1002.309 m, invert 996.536 m), worked again by hand below with
// t = n·(P − Q0)/(n·a).
import { planeCrossings } from '@roundbook/geomath';
import {
  assessRound,
  jointPositionsOf,
  tracePosition,
  type AssessmentContext,
  type RoundRecordInput,
  type SketchDocument,
} from '../src/index.js';

const heading = {
  driveTrend: 60,
  gradientPercent: 0,
  profileHeight: 10,
  profileWidth: 10,
  axisHeight: 5,
  plannedRoundLength: 3,
};
const sketchWith = (points: [number, number][], jointId = 'a'): SketchDocument => ({
  schemaVersion: 2,
  frame: 'face-m',
  elements: [{ id: 't1', kind: 'trace', mode: 'polyline', points, link: { jointId } }],
});
// A trace of plane A drawn across the face: its middle (by length) is at 2 m right, 6 m above the invert
// (1 m above the 5 m axis).
const acrossA: [number, number][] = [
  [1, 5.5],
  [2, 6],
  [3, 6.5],
];

describe('tracePosition', () => {
  it('is the point halfway along the trace, relative to the axis', () => {
    expect(tracePosition(acrossA, 5)).toEqual({ right: 2, up: 1 });
    // uneven segments: length 3 + 1 = 4, halfway at 2 m along the first segment (by hand)
    const p = tracePosition(
      [
        [0, 0],
        [3, 0],
        [3, 1],
      ],
      1.5,
    );
    expect(p.right).toBeCloseTo(2, 12);
    expect(p.up).toBeCloseTo(-1.5, 12);
  });

  it('takes the longest trace linked to the joint itself, not a set link', () => {
    const doc: SketchDocument = {
      schemaVersion: 2,
      frame: 'face-m',
      elements: [
        {
          id: 's',
          kind: 'trace',
          mode: 'polyline',
          points: [
            [-4, 1],
            [-4, 9],
          ],
          link: { setLabel: 'S1' },
        },
        {
          id: 'short',
          kind: 'trace',
          mode: 'polyline',
          points: [
            [0, 0],
            [0, 1],
          ],
          link: { jointId: 'a' },
        },
        {
          id: 'long',
          kind: 'trace',
          mode: 'polyline',
          points: [
            [1, 2],
            [1, 6],
          ],
          link: { jointId: 'a' },
        },
      ],
    };
    expect([...jointPositionsOf(doc, 5)]).toEqual([['a', { right: 1, up: -1 }]]);
    expect(jointPositionsOf(null, 5).size).toBe(0);
  });
});

describe('the look-ahead reads the trace position from the sketch', () => {
  const record = (sketch: SketchDocument | null, faceOffset?: { right: number; up: number }) =>
    ({
      faceChainage: 1000,
      roundLength: 3,
      ground: {
        units: [],
        pointLoadIs50: null,
        pointLoadFactor: null,
        inflowLpm: null,
        inflowLengthM: null,
        waterDescription: '',
        overbreakM3: null,
        notes: '',
      },
      joints: [
        {
          id: 'a',
          kind: 'fault',
          dipDirection: 240,
          dip: 60,
          setLabel: null,
          setOverride: false,
          spacingM: null,
          ...(faceOffset ? { faceOffset } : {}),
        },
      ],
      qInput: null,
      rmrInput: null,
      gsiObserved: null,
      recommendedClassId: null,
      sketch,
    }) satisfies RoundRecordInput;
  const crownRule = {
    id: 'crown',
    watch: 'crown-crossing-within' as const,
    comparison: null,
    threshold: 2.5,
    level: 'amber' as const,
    action: 'Probe ahead',
    ownerRole: 'engineer',
    timeAllowedHours: 12,
    enabled: true,
  };
  const context: AssessmentContext = {
    heading,
    supportClasses: [],
    nearbyJoints: [],
    previousRound: null,
    rules: [crownRule],
  };

  it('crosses the crown where methods.md §6 and a hand computation put it, not from the face centre', () => {
    // By hand: upward normal of 240/60 n = (sin60·sin240, sin60·cos240, cos60) = (−0.75, −0.4330, 0.5);
    // drive a = (sin60, cos60, 0) so n·a = −0.8660; right = (sin150, cos150, 0) = (0.5, −0.8660, 0);
    // P = 2·right + 1·up = (1, −1.7321, 1), n·P = 0.5; crown Q = (0, 0, 5), n·Q = 2.5:
    // t = (0.5 − 2.5)/(−0.8660) = 2.309 m → 1002.309. Invert Q = (0, 0, −5): t = 3/(−0.8660) = −3.464.
    const a = assessRound(record(sketchWith(acrossA)), context);
    const [reach] = a.lookAhead;
    expect(reach.traceKnown).toBe(true);
    expect(reach.chainage.crown).toBeCloseTo(1002.309, 3);
    expect(reach.chainage.invert).toBeCloseTo(996.536, 3);
    // geomath planeCrossings with the offset the trace gives, as a second reading of the same rule
    const pc = planeCrossings({
      plane: { dipDirection: 240, dip: 60 },
      chainage: 1000,
      offset: tracePosition(acrossA, 5),
      drive: { trend: 60, plunge: 0 },
      crownHeight: 5,
      invertDepth: 5,
      halfWidth: 5,
    });
    expect(reach.chainage.crown).toBeCloseTo(pc.crown!, 9);
    // the crown-reach rule (threshold 2.5 m) fires at 2.3 m and no longer says "from the face centre"
    const firing = a.triggers.firings.find((f) => f.ruleId === 'crown');
    expect(firing?.detail).toContain('reaches the crown 2.3 m ahead');
    expect(firing?.detail).not.toContain('face centre');
  });

  it('without a trace the face centre is used (t = −2.5/−0.8660 = 2.887 m by hand), and the rule says so', () => {
    const a = assessRound(record(null), context);
    expect(a.lookAhead[0].traceKnown).toBe(false);
    expect(a.lookAhead[0].chainage.crown).toBeCloseTo(1002.887, 3);
    expect(a.triggers.firings.find((f) => f.ruleId === 'crown')).toBeUndefined();
  });

  it('a position recorded on the joint itself is kept over the sketch', () => {
    const a = assessRound(record(sketchWith(acrossA), { right: 0, up: 0 }), context);
    expect(a.lookAhead[0].chainage.crown).toBeCloseTo(1002.887, 3);
  });
});
