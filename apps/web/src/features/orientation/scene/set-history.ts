// The history of each set's mean along the heading: for every set label the rounds gave their joints, the
// Fisher mean of that set's joints on each round, by the round's face chainage. Plain data for the chart
// beside the heading's net (components/set-history-chart.tsx) and its table.
import { fisherStatistics, planeOfPole, poleOf } from '@roundbook/geomath';
import type { Plane } from '@roundbook/geomath';
import { setOrder } from './stereonet-scene';

/** A joint of a heading's window as the Orientation tab reads it (NearbyJointDto fits). */
export interface HistoryJoint {
  roundId: string;
  roundNumber: number;
  faceChainage: number;
  /** The set its round put it in (the round's own label), or null: random or a single feature. */
  setLabel: string | null;
  dipDirection: number;
  dip: number;
}

/** A set's mean on one round. */
export interface SetHistoryPoint {
  roundId: string;
  roundNumber: number;
  chainage: number;
  /** Fisher mean of the round's joints in the set (axial poles), or the one joint's plane. */
  mean: Plane;
  /** The round's joints in the set (in the window, after its filters). */
  count: number;
}

export interface SetHistory {
  label: string;
  /** Ordered by chainage (then round number). */
  points: SetHistoryPoint[];
}

/**
 * Each set label's mean per round, from the joints of the window. Labels come in the net's order (S1, S2,
 * … then others by name); joints in no set are left out.
 */
export function setHistoryOf(joints: readonly HistoryJoint[]): SetHistory[] {
  const byLabel = new Map<string, Map<string, HistoryJoint[]>>();
  for (const j of joints) {
    if (!j.setLabel) continue;
    let rounds = byLabel.get(j.setLabel);
    if (!rounds) {
      rounds = new Map<string, HistoryJoint[]>();
      byLabel.set(j.setLabel, rounds);
    }
    const list = rounds.get(j.roundId);
    if (list) list.push(j);
    else rounds.set(j.roundId, [j]);
  }
  return setOrder(byLabel.keys()).map((label) => ({
    label,
    points: [...byLabel.get(label)!.values()]
      .map((list): SetHistoryPoint => {
        const planes = list.map((j) => ({ dipDirection: j.dipDirection, dip: j.dip }));
        const mean =
          planes.length === 1
            ? planes[0]
            : planeOfPole(fisherStatistics(planes.map(poleOf), { axial: true }).mean);
        return {
          roundId: list[0].roundId,
          roundNumber: list[0].roundNumber,
          chainage: list[0].faceChainage,
          mean,
          count: list.length,
        };
      })
      .sort((a, b) => a.chainage - b.chainage || a.roundNumber - b.roundNumber),
  }));
}

/** Round steps of 1, 2 or 5 × 10ⁿ m giving at most `most` ticks across the span (common practice). */
export function chainageTicks(from: number, to: number, most = 4): number[] {
  const span = to - from;
  if (!(span > 0)) return [from];
  const raw = span / most;
  const power = 10 ** Math.floor(Math.log10(raw));
  const count = (s: number) => Math.floor(to / s + 1e-9) - Math.ceil(from / s - 1e-9) + 1;
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => count(s) <= most) ?? 10 * power;
  const out: number[] = [];
  for (let v = Math.ceil(from / step) * step; v <= to + 1e-9; v += step)
    out.push(Math.round(v * 1000) / 1000);
  return out;
}
