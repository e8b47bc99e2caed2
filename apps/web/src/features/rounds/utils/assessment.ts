import {
  assessedHeading,
  assessRound,
  SINGLE_FEATURE_KINDS,
  type AssessmentContext,
  type QRecord,
  type RmrRecord,
  type RoundAssessment,
  type RoundRecordInput,
  type TriggerRuleInput,
} from '@roundbook/domain';
import type {
  HeadingDetail,
  NearbyJoint,
  ProjectDetail,
  Round,
  SupportClass,
} from '@/features/rounds/api/types';
import type { RoundFormValues } from '@/features/rounds/schemas/round-form';
import { saveRequestOf } from '@/features/rounds/schemas/round-form';
import { readOrientation } from '@/features/rounds/utils/orientation';

/**
 * The round as typed, in the shape packages/domain's assessRound reads: the same record the API
 * assesses on save (SaveRoundDto), with each joint's orientation read from its text.
 */
export function assessmentRecordOf(values: RoundFormValues, fallbackChainage: number): RoundRecordInput {
  const sent = saveRequestOf(values, 0, fallbackChainage);
  return {
    faceChainage: sent.faceChainage,
    roundLength: sent.roundLength,
    ground: sent.ground,
    joints: values.joints.map((j, i) => {
      const input = sent.joints[i];
      const reading = readOrientation(j.orientationText, j.notation);
      const plane = reading.kind === 'plane' ? reading.plane : null;
      return {
        id: j.key,
        kind: j.kind,
        dipDirection: plane?.dipDirection ?? null,
        dip: plane?.dip ?? null,
        setLabel: input.setLabel ?? null,
        setOverride: j.setOverride,
        spacingM: input.spacingM ?? null,
        seq: i + 1,
        jr: input.jr ?? null,
        ja: input.ja ?? null,
        apertureMm: input.apertureMm ?? null,
        infill: input.infill ?? null,
        thicknessM: input.thicknessM ?? null,
        sameAsJointId: input.sameAsJointId ?? null,
      };
    }),
    // The typed inputs as sent; empty numbers are null and the ratings say what is missing.
    qInput: sent.qInput as unknown as QRecord | null,
    rmrInput: sent.rmrInput as unknown as RmrRecord | null,
    gsiObserved: sent.gsiObserved,
    recommendedClassId: sent.recommendedClassId,
    setParameters: values.setParameters,
    sketch: values.sketch,
  };
}

export interface AssessmentSetup {
  round: Round;
  project: ProjectDetail;
  heading: HeadingDetail;
  supportClasses: SupportClass[];
  nearbyJoints: NearbyJoint[];
  rules: TriggerRuleInput[];
}

/**
 * The previous round's class, and its values for the rules that fire on a change, as the last save found
 * them (the browser does not read other rounds).
 */
function previousRoundOf(round: Round): AssessmentContext['previousRound'] {
  const facts = (round.assessment as Partial<RoundAssessment>).facts;
  if (facts === undefined || facts.previousClassId === undefined) return null;
  return { classId: facts.previousClassId, ...(facts.previous ? { values: facts.previous } : {}) };
}

/** What the round is read against, built as the API builds it (round-assessor.service.ts). */
export function assessmentContextOf(setup: AssessmentSetup, faceChainage: number): AssessmentContext {
  return {
    heading: assessedHeading(setup.heading, setup.round.stage, faceChainage),
    supportClasses: setup.supportClasses,
    // Single features are not pooled into sets, on this face or on earlier ones.
    nearbyJoints: setup.nearbyJoints.filter((n) => !SINGLE_FEATURE_KINDS.includes(n.kind)),
    previousRound: previousRoundOf(setup.round),
    // The heading's sets this round's are matched to, as the last save read them (sets.ts SET_MATCH_RULE).
    headingSets: (setup.round.assessment as Partial<RoundAssessment>).sets?.matching?.headingSets ?? [],
    rules: setup.rules,
    qTableEdition: setup.project.qTableEdition,
    groundScale: setup.project.groundScale,
    // The heading's accepted standing conditions as the last save read them, judged now.
    ...acceptancesOf(setup.round),
  };
}

/** The acceptances the API read at the round's last save (absent before there were any). */
function acceptancesOf(round: Round): Pick<AssessmentContext, 'acceptances'> {
  const list = (round.assessment as Partial<RoundAssessment>).acceptances;
  return Array.isArray(list) ? { acceptances: { list, at: new Date().toISOString() } } : {};
}

/** The round's assessment from the form as typed: packages/domain's assessRound, as the API runs it on save. */
export function liveAssessment(values: RoundFormValues, setup: AssessmentSetup): RoundAssessment {
  const record = assessmentRecordOf(values, setup.round.faceChainage);
  return assessRound(record, assessmentContextOf(setup, record.faceChainage));
}
