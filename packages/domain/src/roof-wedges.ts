// Every three-set roof wedge of a round (or a stretch): geomath's roofWedge on each combination of three set
// means, kept when the wedge falls or slides. Pure; the orientation panels read it.
import { angleBetweenLines, OrientationError, roofWedge } from '@roundbook/geomath';
import type { Line, Plane } from '@roundbook/geomath';

/** A set as the wedge analysis needs it: its label and its Fisher mean plane. */
export interface WedgeSet {
  label: string;
  mean: Plane;
}

/** What a wedge slides on: the intersection line of two of its planes, or one plane alone down its dip. */
export type WedgeSlidingOn = { kind: 'line'; labels: [string, string] } | { kind: 'plane'; labels: [string] };

export interface RoofWedgeFinding {
  /** The three sets, in the order of the list of sets. */
  labels: [string, string, string];
  mode: 'falls' | 'slides';
  /** The three downward intersection lines: sets 1–2, 2–3, 1–3. */
  edges: [Line, Line, Line];
  /** When it slides: the direction of sliding (steeper than φ) and what it slides on. */
  sliding: { direction: Line; on: WedgeSlidingOn } | null;
}

export interface RoofWedgeSummary {
  frictionAngle: number;
  /** Number of sets given. Below three there is no three-set wedge to look at. */
  setCount: number;
  /** Combinations of three sets looked at. */
  combinations: number;
  /** Combinations that bound no tetrahedral wedge (two planes parallel, a horizontal edge, one line). */
  noWedge: number;
  /** The wedges that fall or slide, those that fall first, then in the order of the combinations. */
  wedges: RoofWedgeFinding[];
}

/** A sliding direction this close to an edge (degrees) runs along that edge (common practice: round-off only). */
const SAME_LINE = 0.01;

/**
 * Every combination of three of the sets (by their means) run through geomath's roofWedge at φ
 * `frictionAngle`; the wedges that fall or slide are listed, with what a sliding wedge slides on (an edge,
 * i.e. two planes, or one plane down its dip).
 */
export function roofWedgesOfSets(sets: readonly WedgeSet[], frictionAngle: number): RoofWedgeSummary {
  const wedges: RoofWedgeFinding[] = [];
  let combinations = 0;
  let noWedge = 0;
  for (let i = 0; i < sets.length; i++)
    for (let j = i + 1; j < sets.length; j++)
      for (let k = j + 1; k < sets.length; k++) {
        combinations++;
        const trio: [WedgeSet, WedgeSet, WedgeSet] = [sets[i], sets[j], sets[k]];
        let result: ReturnType<typeof roofWedge>;
        try {
          result = roofWedge([trio[0].mean, trio[1].mean, trio[2].mean], frictionAngle);
        } catch (error) {
          if (error instanceof OrientationError) {
            noWedge++;
            continue;
          }
          throw error;
        }
        if (result.mode === 'stable') continue;
        const labels: [string, string, string] = [trio[0].label, trio[1].label, trio[2].label];
        let sliding: RoofWedgeFinding['sliding'] = null;
        if (result.mode === 'slides' && result.direction !== undefined) {
          const direction = result.direction;
          // Edge order as geomath gives it: 1–2, 2–3, 1–3.
          const edgePairs: [string, string][] = [
            [labels[0], labels[1]],
            [labels[1], labels[2]],
            [labels[0], labels[2]],
          ];
          const edge = result.edges.findIndex((e) => angleBetweenLines(e, direction) < SAME_LINE);
          let on: WedgeSlidingOn;
          if (edge >= 0) on = { kind: 'line', labels: edgePairs[edge] };
          else {
            // Not an edge: the dip line of one of the planes (the one whose dip direction and dip it is).
            const plane = trio.reduce((best, s) =>
              planeDipGap(s.mean, direction) < planeDipGap(best.mean, direction) ? s : best,
            );
            on = { kind: 'plane', labels: [plane.label] };
          }
          sliding = { direction, on };
        }
        wedges.push({ labels, mode: result.mode, edges: result.edges, sliding });
      }
  wedges.sort((a, b) => (a.mode === b.mode ? 0 : a.mode === 'falls' ? -1 : 1));
  return { frictionAngle, setCount: sets.length, combinations, noWedge, wedges };
}

function planeDipGap(plane: Plane, line: Line): number {
  return angleBetweenLines({ trend: plane.dipDirection, plunge: plane.dip }, line);
}
