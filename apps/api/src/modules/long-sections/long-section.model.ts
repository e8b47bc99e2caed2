// The long section of a heading as pure data: what each round found along chainage, and where each mapped
// fault or shear zone meets the crown and the invert of the full profile (geomath planeCrossings,
// methods.md §6), with the coming round that reaches it.
import {
  assessedHeading,
  jointKindLabels,
  type AssessedHeadingRecord,
  type JointKind,
  type Stage,
} from '@roundbook/domain';
import { driveOf, planeCrossings } from '@roundbook/geomath';
import type { LongSectionRoundDto, LongSectionTraceDto } from './dto/long-section.dto.js';

export interface LongSectionRoundRow {
  id: string;
  roundNumber: number;
  stage: Stage;
  status: LongSectionRoundDto['status'];
  faceChainage: number;
  previousChainage: number | null;
  roundLength: number | null;
  units: Array<{ name: string; sharePercent: number }>;
  inflowLpm: number | null;
  inflowLengthM: number | null;
  overbreakM3: number | null;
  q: number | null;
  rmr: number | null;
  gsi: number | null;
  recommendedClass: string | null;
  confirmedClass: string | null;
  installedClass: string | null;
  triggerLevel: LongSectionRoundDto['triggerLevel'];
}

export interface LongSectionJointRow {
  id: string;
  roundId: string;
  kind: JointKind;
  dipDirection: number;
  dip: number;
  faceOffset: { right: number; up: number } | null;
  sameAsJointId: string | null;
}

type HeadingShape = AssessedHeadingRecord & { chainageSense: 'increasing' | 'decreasing' };

const round3 = (v: number): number => Math.round(v * 1000) / 1000;

/** The unit with the largest share of the face (the first listed on a tie). */
function mainUnit(units: LongSectionRoundRow['units']): string | null {
  let best: LongSectionRoundRow['units'][number] | null = null;
  for (const u of units) if (!best || u.sharePercent > best.sharePercent) best = u;
  return best?.name?.trim() || null;
}

/** Chainage where the round started: the previous face, else the face less the round length against the drive. */
function startOf(r: LongSectionRoundRow, sign: 1 | -1): number {
  if (r.previousChainage !== null) return r.previousChainage;
  return r.faceChainage - sign * (r.roundLength ?? 0);
}

/** Inflow over the length it came from, scaled to 10 m (the round's length when none was given). */
function inflowPer10m(r: LongSectionRoundRow, length: number): number | null {
  if (r.inflowLpm === null) return null;
  const over = r.inflowLengthM !== null && r.inflowLengthM > 0 ? r.inflowLengthM : length;
  return over > 0 ? round3((r.inflowLpm * 10) / over) : null;
}

export function longSectionRounds(rows: LongSectionRoundRow[], sign: 1 | -1): LongSectionRoundDto[] {
  return rows.map((r) => {
    const from = startOf(r, sign);
    const length = Math.abs(r.faceChainage - from);
    return {
      id: r.id,
      roundNumber: r.roundNumber,
      stage: r.stage,
      status: r.status,
      fromChainage: from,
      faceChainage: r.faceChainage,
      rockUnit: mainUnit(r.units),
      q: r.q,
      rmr: r.rmr,
      gsi: r.gsi,
      recommendedClass: r.recommendedClass,
      confirmedClass: r.confirmedClass,
      installedClass: r.installedClass,
      triggerLevel: r.triggerLevel,
      inflowLpmPer10m: inflowPer10m(r, length),
      overbreakM3PerM: r.overbreakM3 !== null && length > 0 ? round3(r.overbreakM3 / length) : null,
    };
  });
}

/** Today's face: the furthest handed-in round along the drive, else the furthest draft. */
export function todaysFace(
  rows: Array<Pick<LongSectionRoundRow, 'faceChainage' | 'roundNumber' | 'status'>>,
  sign: 1 | -1,
): { chainage: number; roundNumber: number } | null {
  const pick = (list: typeof rows) =>
    list.reduce<(typeof rows)[number] | null>(
      (best, r) => (best === null || sign * (r.faceChainage - best.faceChainage) > 0 ? r : best),
      null,
    );
  const best = pick(rows.filter((r) => r.status !== 'draft')) ?? pick(rows);
  return best ? { chainage: best.faceChainage, roundNumber: best.roundNumber } : null;
}

/** Round k from now (1 = the next) covers (k − 1)·L up to and including k·L ahead of the face. */
export function roundsAhead(ahead: number | null, roundLength: number): number | null {
  if (ahead === null || ahead <= 0.001 || !(roundLength > 0)) return null;
  return Math.max(1, Math.ceil(ahead / roundLength - 1e-9));
}

/**
 * Each mapped fault or shear zone once (a feature linked across rounds from its latest face along the
 * drive), with its crown and invert crossings of the full profile measured from its trace on the face
 * (the face centre when no trace was recorded).
 */
export function longSectionTraces(input: {
  heading: HeadingShape;
  rounds: LongSectionRoundRow[];
  joints: LongSectionJointRow[];
  face: { chainage: number } | null;
  roundLength: number;
}): LongSectionTraceDto[] {
  const { heading } = input;
  const sign: 1 | -1 = heading.chainageSense === 'decreasing' ? -1 : 1;
  const roundOf = new Map(input.rounds.map((r) => [r.id, r]));
  const latest = new Map<string, { joint: LongSectionJointRow; round: LongSectionRoundRow }>();
  for (const joint of input.joints) {
    const round = roundOf.get(joint.roundId);
    if (!round) continue;
    const key = joint.sameAsJointId ?? joint.id;
    const held = latest.get(key);
    const further =
      !held ||
      sign * (round.faceChainage - held.round.faceChainage) > 0 ||
      (round.faceChainage === held.round.faceChainage && round.roundNumber > held.round.roundNumber);
    if (further) latest.set(key, { joint, round });
  }
  const crownHeight = heading.profileHeight - heading.axisHeight;
  const invertDepth = heading.axisHeight;
  const out: LongSectionTraceDto[] = [];
  for (const [featureKey, { joint, round }] of latest) {
    const geometry = assessedHeading(heading, round.stage, round.faceChainage);
    let c;
    try {
      c = planeCrossings({
        plane: { dipDirection: joint.dipDirection, dip: joint.dip },
        chainage: round.faceChainage,
        offset: joint.faceOffset ?? { right: 0, up: 0 },
        drive: driveOf(geometry),
        crownHeight,
        invertDepth,
        halfWidth: heading.profileWidth / 2,
        chainageSense: heading.chainageSense,
      });
    } catch {
      continue;
    }
    const along = (ch: number | null): number | null =>
      ch === null || input.face === null ? null : round3(sign * (ch - input.face.chainage));
    const crownAhead = along(c.crown);
    const invertAhead = along(c.invert);
    out.push({
      jointId: joint.id,
      featureKey,
      roundId: round.id,
      roundNumber: round.roundNumber,
      kind: joint.kind,
      label: `${jointKindLabels[joint.kind]} of round ${round.roundNumber}`,
      dipDirection: joint.dipDirection,
      dip: joint.dip,
      crownChainage: c.crown === null ? null : round3(c.crown),
      invertChainage: c.invert === null ? null : round3(c.invert),
      crownAhead,
      invertAhead,
      crownRoundsAhead: roundsAhead(crownAhead, input.roundLength),
      invertRoundsAhead: roundsAhead(invertAhead, input.roundLength),
      traceKnown: joint.faceOffset !== null,
    });
  }
  return out.sort((a, b) => sign * ((a.crownChainage ?? 0) - (b.crownChainage ?? 0)));
}
