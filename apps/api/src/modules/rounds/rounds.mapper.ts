// Pure mapping of stored rounds to their DTOs: no queries, no recomputation. What a round shows comes
// from its stored (or, for a draft being read, freshly worked out) assessment.
import type { RoundAssessment } from '@roundbook/domain';
import { DEFAULT_SET_PARAMETERS } from '@roundbook/domain';
import type { PlaneNotation } from '@roundbook/geomath';
import type { JointDto, RoundDto } from './dto/round.dto.js';
import type { Joint } from './joint.entity.js';
import type { Round } from './round.entity.js';

/** A stored JSON record read as the DTO that validated it on the way in. */
const stored = <T>(value: unknown): T => value as T;

export function toJointDto(j: Joint): JointDto {
  return {
    id: j.id,
    seq: j.seq,
    kind: j.kind,
    orientationText: j.orientationText,
    notation: j.notation as PlaneNotation,
    dipDirection: j.dipDirection,
    dip: j.dip,
    orientationError: j.orientationError,
    setLabel: j.setLabel,
    setOverride: j.setOverride,
    spacingM: j.spacingM,
    persistenceM: j.persistenceM,
    apertureMm: j.apertureMm,
    jr: j.jr,
    jrc: j.jrc,
    jrcMethod: j.jrcMethod,
    infill: j.infill,
    ja: j.ja,
    water: j.water,
    thicknessM: j.thicknessM,
    notes: j.notes,
    faceOffset: j.faceOffset ?? null,
    sameAsJointId: j.sameAsJointId ?? null,
  };
}

export function toRoundDto(
  round: Round,
  joints: Joint[],
  assessment: RoundAssessment,
  extras: { mapperName: string; plannedRoundLength: number },
): RoundDto {
  return {
    id: round.id,
    headingId: round.headingId,
    stage: round.stage,
    roundNumber: round.roundNumber,
    faceChainage: round.faceChainage,
    previousChainage: round.previousChainage,
    roundLength: round.roundLength,
    shiftDate: round.shiftDate,
    shift: round.shift,
    mappedBy: round.mappedBy,
    mappedByName: extras.mapperName,
    mappedAt: round.mappedAt.toISOString(),
    distantParts: round.distantParts,
    ground: round.ground,
    joints: [...joints].sort((a, b) => a.seq - b.seq).map(toJointDto),
    // Stored as typed (a draft's numbers may still be empty); the DTOs describe exactly that shape.
    qInput: stored<RoundDto['qInput']>(round.qInput),
    rmrInput: stored<RoundDto['rmrInput']>(round.rmrInput),
    gsiObserved: round.gsiObserved,
    sketch: stored<RoundDto['sketch']>(round.sketch ?? null),
    setParameters: round.setParameters ?? DEFAULT_SET_PARAMETERS,
    ratings: assessment.ratings,
    inflowPer10m: assessment.inflowPer10m,
    suggestedClassIds: assessment.suggestedClassIds,
    recommendedClassId: round.recommendedClassId,
    confirmedClassId: round.confirmedClassId,
    confirmedRoundLength: round.confirmedRoundLength,
    nextRoundLength: round.nextRoundLength,
    recommendationReason: round.recommendationReason,
    status: round.status,
    triggerLevel: assessment.triggers.level,
    triggerFirings: assessment.triggers.firings,
    triggersNotEvaluated: assessment.triggers.notEvaluated,
    triggersWaiting: assessment.triggers.waiting,
    assessment: assessment as unknown as Record<string, unknown>,
    assessmentVersion: assessment.version,
    revision: round.revision,
    submittedAt: round.submittedAt?.toISOString() ?? null,
    warnings: assessment.warnings,
    plannedRoundLength: extras.plannedRoundLength,
    version: round.version,
  };
}

/** The record part of a round as frozen in a revision (everything the geologist entered). */
export function recordOf(round: Round, joints: Joint[]): Record<string, unknown> {
  return {
    stage: round.stage,
    roundNumber: round.roundNumber,
    faceChainage: round.faceChainage,
    previousChainage: round.previousChainage,
    roundLength: round.roundLength,
    shiftDate: round.shiftDate,
    shift: round.shift,
    mappedBy: round.mappedBy,
    mappedAt: round.mappedAt.toISOString(),
    distantParts: round.distantParts,
    ground: round.ground,
    joints: [...joints].sort((a, b) => a.seq - b.seq).map(toJointDto),
    qInput: round.qInput,
    rmrInput: round.rmrInput,
    gsiObserved: round.gsiObserved,
    sketch: round.sketch ?? null,
    setParameters: round.setParameters,
    recommendedClassId: round.recommendedClassId,
    nextRoundLength: round.nextRoundLength,
    recommendationReason: round.recommendationReason,
  };
}
