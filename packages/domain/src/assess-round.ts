// The round's assessment: everything Roundbook works out from one face record, in one pure function that
// the browser runs live, the API runs on save (and freezes at submit), and the reports read back.
import { driveOf, rmrOrientationInTunnel } from '@roundbook/geomath';
import type { Plane, RmrOrientationResult } from '@roundbook/geomath';
import {
  computeRatings,
  RATING_EDITIONS,
  type QRecord,
  type RmrRecord,
  type RoundRatings,
} from './ratings.js';
import { DEFAULT_SET_PARAMETERS, findRoundSets, type RoundSets, type SetParameters } from './sets.js';
import { suggestClasses, type SupportClassInput } from './support.js';
import {
  assessTriggers,
  type FactJoint,
  type HeadingGeometry,
  type RoundFacts,
  type TriggerAssessment,
  type TriggerRuleInput,
} from './triggers.js';
import { SINGLE_FEATURE_KINDS, type JointKind } from './vocabulary.js';
import { inflowPer10m } from './water.js';

/** The version of the rules that produced an assessment (stored with it; bump when a rule changes). */
export const ASSESSMENT_VERSION = 'domain-1';

export interface GroundRecord {
  units: Array<{
    name: string;
    sharePercent: number;
    weatheringGrade: string | null;
    strengthGrade: string | null;
  }>;
  pointLoadIs50: number | null;
  pointLoadFactor: number | null;
  inflowLpm: number | null;
  inflowLengthM: number | null;
  waterDescription: string;
  overbreakM3: number | null;
  notes: string;
}

/** One joint of the round as the assessment reads it (canonical orientation already read from the text). */
export interface AssessedJoint {
  id: string;
  kind: JointKind;
  dipDirection: number | null;
  dip: number | null;
  /** The geologist's set label, kept over the computed one when setOverride is true. */
  setLabel: string | null;
  setOverride: boolean;
  spacingM: number | null;
  faceOffset?: { right: number; up: number } | null;
}

export interface RoundRecordInput {
  faceChainage: number;
  roundLength: number | null;
  ground: GroundRecord;
  joints: AssessedJoint[];
  qInput: QRecord | null;
  rmrInput: RmrRecord | null;
  gsiObserved: number | null;
  recommendedClassId: string | null;
  setParameters?: SetParameters | null;
}

export interface AssessmentContext {
  heading: HeadingGeometry & { plannedRoundLength: number };
  supportClasses: SupportClassInput[];
  /** Readable joints of earlier rounds of the heading within the set window. */
  nearbyJoints: Array<{ id: string; roundId: string; dipDirection: number; dip: number }>;
  /** The previous round of this heading and stage: its class (recommended, or confirmed once reviewed). */
  previousRound: { classId: string | null } | null;
  rules: TriggerRuleInput[];
  qTableEdition?: string;
}

export interface FeatureAssessment {
  jointId: string;
  kind: JointKind;
  plane: Plane;
  orientation: RmrOrientationResult | null;
}

export interface RoundAssessment {
  version: string;
  editions: { q: string; rmr: string; gsi: string };
  ratings: RoundRatings;
  sets: RoundSets;
  /** Significant single features (faults, shear zones) judged on their own against the drive. */
  features: FeatureAssessment[];
  inflowPer10m: number | null;
  suggestedClassIds: string[];
  warnings: string[];
  /** What the trigger rules read, as worked out here. */
  facts: RoundFacts;
  triggers: TriggerAssessment;
}

export function roundWarnings(
  r: { roundLength: number | null },
  plannedRoundLength: number,
  maxRoundLength: number | null,
): string[] {
  const w: string[] = [];
  if (r.roundLength !== null) {
    if (r.roundLength < 0)
      w.push(`The round length is negative (${r.roundLength} m): check the face and previous chainages.`);
    else if (r.roundLength === 0) w.push('The round length is zero: check the face and previous chainages.');
    else if (r.roundLength > plannedRoundLength)
      w.push(`The round length ${r.roundLength} m is over the planned ${plannedRoundLength} m.`);
    if (maxRoundLength !== null && r.roundLength > maxRoundLength) {
      w.push(
        `The round length ${r.roundLength} m is over the ${maxRoundLength} m allowed by the support class of the last round.`,
      );
    }
  }
  return w;
}

/** Everything worked out from one round record and its context; no input is changed. */
export function assessRound(record: RoundRecordInput, context: AssessmentContext): RoundAssessment {
  const drive = driveOf(context.heading);
  const ratings = computeRatings(record);
  const parameters = record.setParameters ?? DEFAULT_SET_PARAMETERS;
  const readable = record.joints.filter(
    (j): j is AssessedJoint & { dipDirection: number; dip: number } =>
      j.dipDirection !== null && j.dip !== null,
  );
  // Single features are judged on their own, not pooled into sets (common practice).
  const setJoints = readable.filter((j) => !SINGLE_FEATURE_KINDS.includes(j.kind));
  const sets = findRoundSets(
    setJoints.map((j) => ({
      id: j.id,
      plane: { dipDirection: j.dipDirection, dip: j.dip },
      spacingM: j.spacingM,
      override: j.setOverride && j.setLabel ? j.setLabel : null,
    })),
    parameters.windowM > 0
      ? context.nearbyJoints.map((n) => ({
          id: n.id,
          roundId: n.roundId,
          plane: { dipDirection: n.dipDirection, dip: n.dip },
        }))
      : [],
    drive,
    parameters,
  );
  const features: FeatureAssessment[] = readable
    .filter((j) => SINGLE_FEATURE_KINDS.includes(j.kind))
    .map((j) => {
      const plane = { dipDirection: j.dipDirection, dip: j.dip };
      let orientation: RmrOrientationResult | null;
      try {
        orientation = rmrOrientationInTunnel(plane, drive);
      } catch {
        orientation = null;
      }
      return { jointId: j.id, kind: j.kind, plane, orientation };
    });
  const water = inflowPer10m(record.ground.inflowLpm, record.ground.inflowLengthM ?? record.roundLength);
  const previousClass =
    context.previousRound?.classId != null
      ? context.supportClasses.find((c) => c.id === context.previousRound!.classId)
      : undefined;
  const facts: RoundFacts = {
    q: ratings.q.value,
    rmr: ratings.rmr.value,
    inflowPer10m: water,
    overbreakM3: record.ground.overbreakM3,
    faceChainage: record.faceChainage,
    recommendedClassId: record.recommendedClassId,
    previousClassId: context.previousRound === null ? undefined : context.previousRound.classId,
    joints: record.joints.map((j): FactJoint => ({
      id: j.id,
      kind: j.kind,
      setLabel: sets.membership[j.id] || null,
      dipDirection: j.dipDirection,
      dip: j.dip,
      faceOffset: j.faceOffset ?? null,
    })),
    sets: sets.sets.map((s) => ({ label: s.label, plane: s.mean, count: s.count })),
  };
  const qEdition = context.qTableEdition
    ? `${RATING_EDITIONS.q}; project tables: ${context.qTableEdition} edition`
    : RATING_EDITIONS.q;
  return {
    version: ASSESSMENT_VERSION,
    editions: { q: qEdition, rmr: RATING_EDITIONS.rmr, gsi: RATING_EDITIONS.gsi },
    ratings,
    sets,
    features,
    inflowPer10m: water,
    suggestedClassIds: suggestClasses(context.supportClasses, ratings.q.value, ratings.rmr.value),
    warnings: roundWarnings(
      record,
      context.heading.plannedRoundLength,
      previousClass?.maxRoundLength ?? null,
    ),
    facts,
    triggers: assessTriggers(context.rules, facts, context.heading),
  };
}
