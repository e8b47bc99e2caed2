import { fisherStatistics, planeOfPole, poleOf } from '@roundbook/geomath';
import type { HistoryJoint } from './set-history';
import { chainageTicks, setHistoryOf } from './set-history';

// Invented window: three rounds of a heading; S1 near 300/70 on every round, S2 near 040/30 on two, one
// random joint, and a set label of a geologist's own ("Sheeting").
const j = (
  roundNumber: number,
  faceChainage: number,
  setLabel: string | null,
  dipDirection: number,
  dip: number,
): HistoryJoint => ({ roundId: `r${roundNumber}`, roundNumber, faceChainage, setLabel, dipDirection, dip });
const window: HistoryJoint[] = [
  j(12, 1036, 'S1', 302, 72),
  j(10, 1030, 'S1', 298, 70),
  j(10, 1030, 'S1', 302, 70),
  j(11, 1033, 'S2', 40, 30),
  j(11, 1033, 'S1', 305, 68),
  j(10, 1030, 'S2', 44, 28),
  j(10, 1030, 'S2', 36, 32),
  j(11, 1033, null, 180, 10),
  j(12, 1036, 'Sheeting', 10, 5),
  j(12, 1036, 'S10', 120, 80),
];

describe('setHistoryOf (the history of each set along the chainage)', () => {
  const history = setHistoryOf(window);

  it('has one line per set label in the net’s order, and leaves out joints in no set', () => {
    expect(history.map((s) => s.label)).toEqual(['S1', 'S2', 'S10', 'Sheeting']);
    const counted = history.flatMap((s) => s.points).reduce((n, p) => n + p.count, 0);
    expect(counted).toBe(window.length - 1);
  });

  it('gives each set one point per round, by chainage, with the round’s joints counted', () => {
    const s1 = history[0];
    expect(s1.points.map((p) => [p.roundNumber, p.chainage, p.count])).toEqual([
      [10, 1030, 2],
      [11, 1033, 1],
      [12, 1036, 1],
    ]);
    expect(history[1].points.map((p) => [p.roundNumber, p.count])).toEqual([
      [10, 2],
      [11, 1],
    ]);
  });

  it('takes the Fisher mean of a round’s joints in a set, and the plane itself for one joint', () => {
    // Two poles symmetric about the 300/70 plane's pole: their mean is that pole (computed here), and it
    // agrees with geomath's Fisher mean of the same two planes.
    const [first, second, third] = history[0].points;
    expect(first.mean.dipDirection).toBeCloseTo(300, 0);
    expect(first.mean.dip).toBeCloseTo(70, 1);
    const fisher = planeOfPole(
      fisherStatistics(
        [
          { dipDirection: 298, dip: 70 },
          { dipDirection: 302, dip: 70 },
        ].map(poleOf),
        { axial: true },
      ).mean,
    );
    expect(first.mean.dipDirection).toBeCloseTo(fisher.dipDirection, 9);
    expect(first.mean.dip).toBeCloseTo(fisher.dip, 9);
    expect(second.mean).toEqual({ dipDirection: 305, dip: 68 });
    expect(third.mean).toEqual({ dipDirection: 302, dip: 72 });
    // S2 on round 10: 044/28 and 036/32, mean near 040/30.
    expect(history[1].points[0].mean.dipDirection).toBeCloseTo(40, 0);
    expect(history[1].points[0].mean.dip).toBeCloseTo(30, 0);
  });

  it('is empty for a window with no set', () => {
    expect(setHistoryOf([j(1, 1000, null, 100, 40)])).toEqual([]);
  });
});

describe('chainageTicks', () => {
  it('puts round steps of 1, 2 or 5 × 10ⁿ m across the window, at most four', () => {
    expect(chainageTicks(1030, 1036)).toEqual([1030, 1032, 1034, 1036]);
    expect(chainageTicks(2450, 2600)).toEqual([2450, 2500, 2550, 2600]);
    expect(chainageTicks(1003, 1097)).toEqual([1020, 1040, 1060, 1080]);
    expect(chainageTicks(1000, 1000)).toEqual([1000]);
  });
});
