/**
 * Names the Round screens use for the API's types, taken from the generated client so that a change in
 * the API contract breaks the web build.
 */
import type { components } from '@/api/generated/schema';

type Schemas = components['schemas'];

export type Stage = Schemas['Stage'];
export type Shift = Schemas['Shift'];
export type RoundStatus = Schemas['RoundStatus'];
export type RoundSort = Schemas['RoundSort'];
export type RoundSummary = Schemas['RoundSummaryDto'];
export type RoundPage = Schemas['RoundPageDto'];
export type NextRound = Schemas['NextRoundDto'];
export type CreateRoundRequest = Schemas['CreateRoundDto'];
export type Round = Schemas['RoundDto'];
/**
 * What the round screen sends: always the whole record. (The API also takes part of one and keeps what a
 * save leaves out; the screen never relies on that.)
 */
export type SaveRoundRequest = Omit<Required<Schemas['SaveRoundDto']>, 'ground' | 'setParameters'> &
  Pick<Schemas['SaveRoundDto'], 'setParameters'> & { ground: Schemas['GroundDto'] };
export type JointKind = Schemas['JointKind'];
export type JointWater = Schemas['JointWater'];
export type JrcMethod = Schemas['JrcMethod'];
export type Joint = Schemas['JointDto'];
export type JointInput = Schemas['JointInputDto'];
export type NearbyJoint = Schemas['NearbyJointDto'];
export type RatingOutcome = Schemas['RatingOutcomeDto'];
export type RoundRatings = Schemas['RoundRatingsDto'];
export type Ground = Schemas['GroundDto'];
export type RockUnit = Schemas['RockUnitDto'];
export type PlaneNotation = Schemas['PlaneNotation'];
export type GroundScale = Schemas['GroundScale'];
export type ChainageStyle = Schemas['ChainageStyle'];
export type HeadingDetail = Schemas['HeadingDto'];
export type ProjectDetail = Schemas['ProjectSummaryDto'];
export type SupportClass = Schemas['SupportClassDto'];
export type SupportClassLibrary = Schemas['SupportClassLibraryDto'];
export type TriggerFiring = Schemas['TriggerFiringDto'];
export type TriggerLevel = Schemas['TriggerLevel'];
