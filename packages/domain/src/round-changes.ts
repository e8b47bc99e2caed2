// What changed from the previous round of a heading to this one, read from the two frozen assessments
// (the engineer's "since the last round" view on the Review). Pure: no input is changed.
import { angleBetweenPlanes } from '@roundbook/geomath';
import type { Plane } from '@roundbook/geomath';
import { formatDipDirectionDip, formatQ, roundedAsPrinted } from './format.js';
import { jointKindLabels, type JointKind } from './vocabulary.js';

/**
 * Two planes farther apart than this (acute angle between their poles) are read as different sets or
 * features (our own choice, in line with the usual 15–20° spread of one set's poles: common practice).
 */
export const SAME_PLANE_WITHIN_DEG = 20;

/** One round as frozen at its last submit or confirm, as far as the comparison reads it. */
export interface FrozenRoundView {
  roundNumber: number;
  /** The class of the round: the confirmed one once confirmed, else the recommended one. */
  classCode: string | null;
  classConfirmed: boolean;
  assessment: {
    ratings: { q: { value: number | null }; rmr: { value: number | null } };
    sets: { sets: Array<{ label: string; mean: Plane }> };
    features: Array<{ jointId: string; kind: JointKind; plane: Plane }>;
    inflowPer10m: number | null;
  };
}

export const CHANGE_ASPECTS = ['class', 'q', 'rmr89', 'water', 'set', 'feature'] as const;
export type ChangeAspect = (typeof CHANGE_ASPECTS)[number];
/** worse / better: for the ground; new / gone: a set or feature; changed: the class; unknown: one side not recorded. */
export const CHANGE_TRENDS = ['worse', 'better', 'new', 'gone', 'changed', 'same', 'unknown'] as const;
export type ChangeTrend = (typeof CHANGE_TRENDS)[number];

export interface RoundChange {
  aspect: ChangeAspect;
  label: string;
  before: string;
  after: string;
  trend: ChangeTrend;
  /** The change in words, e.g. "Q fell from 4.0 to 0.80". */
  text: string;
}

const planeText = (p: Plane): string =>
  formatDipDirectionDip({ dipDirection: Math.round(p.dipDirection), dip: Math.round(p.dip) });

function numberChange(
  aspect: ChangeAspect,
  label: string,
  before: number | null,
  after: number | null,
  show: (v: number) => string,
  higherIsWorse: boolean,
  kind: 'q' | 'other' = 'other',
): RoundChange {
  const b = before === null ? 'not recorded' : show(before);
  const a = after === null ? 'not recorded' : show(after);
  if (before === null || after === null)
    return {
      aspect,
      label,
      before: b,
      after: a,
      trend: before === after ? 'same' : 'unknown',
      text: before === after ? `${label} not recorded in either round` : `${label}: ${b} before, ${a} now`,
    };
  // Compared as printed, so that "unchanged" never sits beside two different numbers.
  const pb = roundedAsPrinted(before, kind);
  const pa = roundedAsPrinted(after, kind);
  if (pa === pb)
    return { aspect, label, before: b, after: a, trend: 'same', text: `${label} unchanged at ${a}` };
  const up = pa > pb;
  return {
    aspect,
    label,
    before: b,
    after: a,
    trend: up === higherIsWorse ? 'worse' : 'better',
    text: `${label} ${up ? 'rose' : 'fell'} from ${b} to ${a}`,
  };
}

/** Pairs each plane of `now` with the nearest of `before` within SAME_PLANE_WITHIN_DEG (each used once). */
function matchPlanes<T extends { plane: Plane }>(
  now: T[],
  before: T[],
): { matched: Array<[T, T]>; added: T[]; gone: T[] } {
  const free = new Set(before.map((_, i) => i));
  const matched: Array<[T, T]> = [];
  const added: T[] = [];
  for (const n of now) {
    let best = -1;
    let bestAngle = Infinity;
    for (const i of free) {
      const angle = angleBetweenPlanes(n.plane, before[i].plane);
      if (angle <= SAME_PLANE_WITHIN_DEG && angle < bestAngle) {
        best = i;
        bestAngle = angle;
      }
    }
    if (best < 0) added.push(n);
    else {
      free.delete(best);
      matched.push([n, before[best]]);
    }
  }
  return { matched, added, gone: [...free].map((i) => before[i]) };
}

/**
 * The changes from the previous round of the heading to this one: the class, Q, RMR89, the water inflow per
 * 10 m, and each set or significant feature that is new (or no longer seen). Class, Q, RMR89 and water are
 * always listed (trend 'same' when unchanged); sets and features only when they came or went.
 */
export function roundChanges(previous: FrozenRoundView, current: FrozenRoundView): RoundChange[] {
  const out: RoundChange[] = [];
  const cls = (v: FrozenRoundView) =>
    v.classCode === null ? 'none' : `${v.classCode} (${v.classConfirmed ? 'confirmed' : 'recommended'})`;
  out.push({
    aspect: 'class',
    label: 'Support class',
    before: cls(previous),
    after: cls(current),
    trend: previous.classCode === current.classCode ? 'same' : 'changed',
    text:
      previous.classCode === current.classCode
        ? `Support class unchanged (${current.classCode ?? 'none'})`
        : `Support class ${previous.classCode ?? 'none'} → ${current.classCode ?? 'none'}`,
  });
  const pa = previous.assessment;
  const ca = current.assessment;
  out.push(numberChange('q', 'Q', pa.ratings.q.value, ca.ratings.q.value, formatQ, false, 'q'));
  out.push(
    numberChange(
      'rmr89',
      'RMR89',
      pa.ratings.rmr.value,
      ca.ratings.rmr.value,
      (v) => String(Math.round(v)),
      false,
    ),
  );
  out.push(
    numberChange(
      'water',
      'Inflow per 10 m',
      pa.inflowPer10m,
      ca.inflowPer10m,
      (v) => `${Math.round(v * 10) / 10} l/min`,
      true,
    ),
  );
  const sets = matchPlanes(
    ca.sets.sets.map((s) => ({ label: s.label, plane: s.mean })),
    pa.sets.sets.map((s) => ({ label: s.label, plane: s.mean })),
  );
  for (const s of sets.added)
    out.push({
      aspect: 'set',
      label: `Set ${s.label}`,
      before: '—',
      after: planeText(s.plane),
      trend: 'new',
      text: `New set ${s.label} (${planeText(s.plane)}): no set within ${SAME_PLANE_WITHIN_DEG}° of it in round ${previous.roundNumber}`,
    });
  for (const s of sets.gone)
    out.push({
      aspect: 'set',
      label: `Set ${s.label} of round ${previous.roundNumber}`,
      before: planeText(s.plane),
      after: '—',
      trend: 'gone',
      text: `Set ${s.label} of round ${previous.roundNumber} (${planeText(s.plane)}) is not among this round's sets`,
    });
  const feature = (f: { kind: JointKind }) => jointKindLabels[f.kind].toLowerCase();
  const features = matchPlanes(ca.features, pa.features);
  for (const f of features.added)
    out.push({
      aspect: 'feature',
      label: jointKindLabels[f.kind],
      before: '—',
      after: planeText(f.plane),
      trend: 'new',
      text: `New ${feature(f)} (${planeText(f.plane)})`,
    });
  for (const f of features.gone)
    out.push({
      aspect: 'feature',
      label: `${jointKindLabels[f.kind]} of round ${previous.roundNumber}`,
      before: planeText(f.plane),
      after: '—',
      trend: 'gone',
      text: `The ${feature(f)} of round ${previous.roundNumber} (${planeText(f.plane)}) is not mapped on this face`,
    });
  return out;
}
