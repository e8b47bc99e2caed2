// The round's assessment: everything Roundbook works out from one face record, in one pure function that
// the browser runs live, the API runs on save (and freezes at submit), and the reports read back.
import { driveOf, Q_TABLE_EDITION, rmrOrientationInTunnel } from '@roundbook/geomath';
import type { GroundScale, Plane, RmrOrientationResult } from '@roundbook/geomath';
import { applyAcceptances, type TriggerAcceptanceInput } from './acceptances.js';
import {
  conditionWarnings,
  governingDiscontinuity,
  jnWarning,
  jrJaWarnings,
  type GoverningDiscontinuity,
} from './governing.js';
import { groundErrors, pointLoadWarning } from './ground.js';
import type { HazardFact } from './hazards.js';
import {
  computeRatings,
  RATING_EDITIONS,
  type QRecord,
  type RmrRecord,
  type RoundRatings,
} from './ratings.js';
import {
  DEFAULT_SET_PARAMETERS,
  findRoundSets,
  type HeadingSet,
  type RoundSets,
  type SetNames,
  type SetParameters,
} from './sets.js';
import { jointPositionsOf, type SketchDocument } from './sketch.js';
import {
  explainSuggestion,
  suggestClasses,
  type SupportClassInput,
  type SupportSuggestion,
} from './support.js';
import {
  assessTriggers,
  featureReaches,
  type FactJoint,
  type FeatureReach,
  type HeadingGeometry,
  type PreviousRoundValues,
  type RoundFacts,
  type TriggerAssessment,
  type TriggerRuleInput,
} from './triggers.js';
import { SINGLE_FEATURE_KINDS, type JointKind } from './vocabulary.js';
import { readWater, waterConditionWarning } from './water.js';

/**
 * The version of the rules that produced an assessment (stored with it; bump when a rule changes).
 * domain-6: the trigger level leaves out fired rules held by an engineer's acceptance of a standing
 * condition (listed in triggers.accepted), so the same record can read a lower level than under domain-5.
 * domain-7: a joint the geologist took out of its set (override with no label) is in no set and out of the set
 * means (before, an empty override fell back to the computed set); the facts carry the previous round's values
 * for rules that fire on a change, and the round's length against the last class's allowance.
 * domain-8: set labels follow the heading (sets.ts SET_MATCH_RULE: matched to the earlier rounds' set means,
 * new sets take the next free label, the geologist's names rename or merge); before, S1, S2, … went by size
 * on each round, so labels could swap between rounds.
 */
export const ASSESSMENT_VERSION = 'domain-8';

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
  /** True when the inflow was measured at the face (a point inflow, no length of tunnel). */
  inflowAtFace?: boolean | null;
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
  /** Position on the round (1, 2, …), for the words of the warnings. */
  seq?: number;
  jr?: number | null;
  ja?: number | null;
  apertureMm?: number | null;
  infill?: string | null;
  thicknessM?: number | null;
  /** "Same feature as": the first observation of this feature on an earlier round (features.ts). */
  sameAsJointId?: string | null;
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
  /**
   * The round's sketch: a trace linked to a joint gives its position on the face (sketch.ts
   * jointPositionsOf) where the joint has no faceOffset of its own; absent or null: the face centre.
   */
  sketch?: SketchDocument | null;
}

export interface AssessmentContext {
  heading: HeadingGeometry & { plannedRoundLength: number };
  supportClasses: SupportClassInput[];
  /** Readable joints of earlier rounds of the heading within the set window. */
  nearbyJoints: Array<{
    id: string;
    roundId: string;
    dipDirection: number;
    dip: number;
    /** Linked observations of one feature count once (features.ts); absent: unlinked. */
    sameAsJointId?: string | null;
    roundNumber?: number;
  }>;
  /**
   * The heading's sets as its earlier rounds left them (sets.ts headingSetsOf), which this round's sets are
   * matched to; absent or empty: labels by size (S1 the largest).
   */
  headingSets?: HeadingSet[];
  /** The geologist's names for the heading's sets (renames and merges, sets.ts SetNames). */
  setNames?: SetNames;
  /**
   * The previous round of this heading and stage: its class (recommended, or confirmed once reviewed), and
   * its values and conditions for the rules that fire on a change (triggers.ts previousRoundValues; absent:
   * not read, so such a rule is not evaluated).
   */
  previousRound: { classId: string | null; values?: PreviousRoundValues } | null;
  rules: TriggerRuleInput[];
  qTableEdition?: string;
  /** The project's scale of weathering and strength grades (default ISRM). */
  groundScale?: GroundScale;
  /** The heading's open hazards (the register); absent: not read, so the open-red-hazard rule is not evaluated. */
  openHazards?: HazardFact[];
  /**
   * The heading's active acceptances of standing conditions, and the time they are judged at (ISO 8601);
   * absent: none read, every fired rule raises the level.
   */
  acceptances?: { list: TriggerAcceptanceInput[]; at: string };
}

export interface FeatureAssessment {
  jointId: string;
  kind: JointKind;
  plane: Plane;
  orientation: RmrOrientationResult | null;
  /** The first observation of the same feature on an earlier round, when linked. */
  sameAsJointId: string | null;
}

export interface RoundAssessment {
  version: string;
  /** qTable: the Q table edition the Q was computed with (geomath qValue().edition). */
  editions: { q: string; qTable: string; rmr: string; gsi: string };
  ratings: RoundRatings;
  sets: RoundSets;
  /** Significant single features (faults, shear zones) judged on their own against the drive. */
  features: FeatureAssessment[];
  inflowPer10m: number | null;
  /** How the inflow per 10 m was worked out from the one record (null: none recorded, or its length missing). */
  inflowBasis: string | null;
  /** The discontinuity Jr and Ja come from: named in the record, or the weakest significant one suggested. */
  governing: GoverningDiscontinuity | null;
  /** Where each significant feature meets the stage's profile ahead of the face (crown, invert, walls). */
  lookAhead: FeatureReach[];
  /** Fields the record should still give (e.g. the length the inflow comes from), by field path. */
  missing: Record<string, string>;
  suggestedClassIds: string[];
  /** The class to suggest and why (the cautious one when Q and RMR89 point to different classes). */
  suggestion: SupportSuggestion;
  warnings: string[];
  /** What the trigger rules read, as worked out here. */
  facts: RoundFacts;
  triggers: TriggerAssessment;
  /** The acceptances the triggers were read against (absent in assessments made without them). */
  acceptances?: TriggerAcceptanceInput[];
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
  const water = readWater(record.ground);
  // Water once: an RMR89 groundwater rating by inflow reads the one inflow record when it has one.
  const rmrInput =
    record.rmrInput && record.rmrInput.groundwater.kind === 'inflow' && water.per10m !== null
      ? {
          ...record.rmrInput,
          groundwater: { kind: 'inflow' as const, litresPerMinutePer10m: water.per10m },
        }
      : record.rmrInput;
  const ratings = computeRatings({ ...record, rmrInput });
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
      // The geologist's own set; an override with no label puts the joint in no set (random).
      override: j.setOverride ? (j.setLabel ?? '').trim() : null,
      sameAsJointId: j.sameAsJointId ?? null,
    })),
    parameters.windowM > 0
      ? context.nearbyJoints.map((n) => ({
          id: n.id,
          roundId: n.roundId,
          plane: { dipDirection: n.dipDirection, dip: n.dip },
          sameAsJointId: n.sameAsJointId ?? null,
          ...(n.roundNumber !== undefined ? { roundNumber: n.roundNumber } : {}),
        }))
      : [],
    drive,
    parameters,
    { sets: context.headingSets ?? [], names: context.setNames ?? {} },
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
      return { jointId: j.id, kind: j.kind, plane, orientation, sameAsJointId: j.sameAsJointId ?? null };
    });
  const previousClass =
    context.previousRound?.classId != null
      ? context.supportClasses.find((c) => c.id === context.previousRound!.classId)
      : undefined;
  // A joint's trace on the sketch places it on the face for the look-ahead and the crown-reach rule.
  const traced = jointPositionsOf(record.sketch, context.heading.axisHeight);
  const facts: RoundFacts = {
    q: ratings.q.value,
    rmr: ratings.rmr.value,
    inflowPer10m: water.per10m,
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
      faceOffset: j.faceOffset ?? traced.get(j.id) ?? null,
      sameAsJointId: j.sameAsJointId ?? null,
    })),
    sets: sets.sets.map((s) => ({ label: s.label, plane: s.mean, count: s.count })),
    ...(context.openHazards !== undefined ? { openHazards: context.openHazards } : {}),
    roundLength: record.roundLength,
    allowedRoundLength: previousClass?.maxRoundLength ?? null,
    ...(context.previousRound === null
      ? { previous: null }
      : context.previousRound.values !== undefined
        ? { previous: context.previousRound.values }
        : {}),
  };
  const qEdition = context.qTableEdition
    ? `${RATING_EDITIONS.q}; project tables: ${context.qTableEdition} edition`
    : RATING_EDITIONS.q;

  const warnings = roundWarnings(
    record,
    context.heading.plannedRoundLength,
    previousClass?.maxRoundLength ?? null,
  );
  const missing: Record<string, string> = { ...water.missing };
  warnings.push(...Object.values(water.missing));
  // Q: values between table rows and the Jr +1 rule (geomath qValue warnings).
  warnings.push(...(ratings.q.warnings ?? []));
  // The governing discontinuity of Jr and Ja, and the RMR89 condition against its aperture and infill.
  const { governing, warnings: namedWarnings } = governingDiscontinuity(
    { jointId: record.qInput?.governingJointId ?? null, setLabel: record.qInput?.governingSetLabel ?? null },
    record.joints.map((j, i) => ({
      id: j.id,
      seq: j.seq ?? i + 1,
      kind: j.kind,
      jr: j.jr ?? null,
      ja: j.ja ?? null,
      apertureMm: j.apertureMm ?? null,
      infill: j.infill ?? null,
      thicknessM: j.thicknessM ?? null,
      setLabel: SINGLE_FEATURE_KINDS.includes(j.kind)
        ? null
        : sets.membership[j.id] || (j.setOverride ? j.setLabel || null : null),
    })),
  );
  warnings.push(...namedWarnings);
  if (record.qInput && governing) warnings.push(...jrJaWarnings(record.qInput, governing));
  if (record.rmrInput && governing) warnings.push(...conditionWarnings(record.rmrInput.condition, governing));
  // Jn against the sets found and the random joints (joints of this round in no set, or the record's flag).
  if (record.qInput && setJoints.length > 0) {
    const random = record.qInput.randomJoints ?? setJoints.some((j) => (sets.membership[j.id] ?? '') === '');
    const w = jnWarning(record.qInput.jn, sets.sets.length, random);
    if (w) warnings.push(w);
  }
  // Water: a rating by condition that contradicts the measured inflow; a typed inflow the record overrides.
  if (record.rmrInput?.groundwater.kind === 'condition') {
    const w = waterConditionWarning(record.rmrInput.groundwater.condition, water.per10m);
    if (w) warnings.push(w);
  } else if (
    record.rmrInput?.groundwater.kind === 'inflow' &&
    water.per10m !== null &&
    Math.abs(record.rmrInput.groundwater.litresPerMinutePer10m - water.per10m) > 0.05
  ) {
    warnings.push(
      `RMR89 groundwater reads the inflow recorded in Ground (${Math.round(water.per10m * 10) / 10} l/min per 10 m), not the ${record.rmrInput.groundwater.litresPerMinutePer10m} typed with the rating.`,
    );
  }
  // Ground: grades of the project's scale (refused by the API on save) and the point load against the grade.
  warnings.push(...Object.values(groundErrors(record.ground, context.groundScale)));
  const pl = pointLoadWarning(record.ground, context.groundScale);
  if (pl) warnings.push(pl);

  return {
    version: ASSESSMENT_VERSION,
    editions: {
      q: qEdition,
      qTable: ratings.q.edition ?? Q_TABLE_EDITION,
      rmr: RATING_EDITIONS.rmr,
      gsi: RATING_EDITIONS.gsi,
    },
    ratings,
    sets,
    features,
    inflowPer10m: water.per10m,
    inflowBasis: water.basis,
    governing,
    lookAhead: featureReaches(facts, context.heading),
    missing,
    suggestedClassIds: suggestClasses(context.supportClasses, ratings.q.value, ratings.rmr.value),
    suggestion: explainSuggestion(context.supportClasses, ratings.q.value, ratings.rmr.value),
    warnings,
    facts,
    triggers: context.acceptances
      ? applyAcceptances(
          assessTriggers(context.rules, facts, context.heading),
          context.rules,
          facts,
          context.heading,
          context.acceptances.list,
          new Date(context.acceptances.at),
        )
      : assessTriggers(context.rules, facts, context.heading),
    ...(context.acceptances ? { acceptances: context.acceptances.list } : {}),
  };
}

/** A ground record with nothing recorded yet (a new round, a test's starting point). */
export function emptyGround(): GroundRecord {
  return {
    units: [],
    pointLoadIs50: null,
    pointLoadFactor: null,
    inflowLpm: null,
    inflowLengthM: null,
    waterDescription: '',
    overbreakM3: null,
    notes: '',
  };
}
