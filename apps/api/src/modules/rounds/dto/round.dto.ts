import { ApiProperty, OmitType, PartialType } from '@nestjs/swagger';
import {
  JOINT_KINDS,
  JOINT_WATER,
  JRC_METHODS,
  PLANE_NOTATIONS,
  ROUND_STATUSES,
  SET_WINDOWS,
  SHIFTS,
  STAGES,
} from '@roundbook/domain';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsNumber,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  Length,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import { IsCalendarDate } from '../../../common/dto/calendar-date.js';
import { Optional } from '../../../common/dto/optional.js';
import { QInputDto, RmrInputDto } from './rating-input.dto.js';

export class RockUnitDto {
  @IsString()
  @Length(0, 120)
  name: string;

  @IsNumber()
  @Min(0, { message: 'A share of the face is 0–100 %.' })
  @Max(100, { message: 'A share of the face is 0–100 %.' })
  sharePercent: number;

  @IsOptional()
  @IsString()
  @ApiProperty({ type: String, nullable: true })
  weatheringGrade: string | null;

  @IsOptional()
  @IsString()
  @ApiProperty({ type: String, nullable: true })
  strengthGrade: string | null;
}

export class GroundDto {
  @IsArray()
  @ArrayMaxSize(12)
  @IsObject({ each: true, message: 'Give each item as an object.' })
  @ValidateNested({ each: true })
  @Type(() => RockUnitDto)
  units: RockUnitDto[];

  /** Point-load index Is50, MPa */
  @IsOptional()
  @IsNumber()
  @Min(0)
  @Max(30, { message: 'Is50 above 30 MPa is beyond what point-load tests give; check the value.' })
  @ApiProperty({ type: Number, nullable: true })
  pointLoadIs50: number | null;

  /** Factor used to estimate UCS from Is50 (UCS ≈ factor × Is50) */
  @IsOptional()
  @IsNumber()
  @Min(5)
  @Max(50)
  @ApiProperty({ type: Number, nullable: true })
  pointLoadFactor: number | null;

  /** Water inflow at the face, l/min */
  @IsOptional()
  @IsNumber()
  @Min(0)
  @Max(100000)
  @ApiProperty({ type: Number, nullable: true })
  inflowLpm: number | null;

  /** Tunnel length the inflow comes from, m (for inflow per 10 m) */
  @IsOptional()
  @IsNumber()
  @Min(0.1)
  @Max(1000)
  @ApiProperty({ type: Number, nullable: true })
  inflowLengthM: number | null;

  /** True when the inflow was measured at the face (a point inflow; no length of tunnel is needed) */
  @IsOptional()
  @IsBoolean()
  @ApiProperty({ type: Boolean, nullable: true, required: false })
  inflowAtFace?: boolean | null;

  @IsString()
  @MaxLength(2000)
  waterDescription: string;

  @IsOptional()
  @IsNumber()
  @Min(0)
  @Max(10000)
  @ApiProperty({ type: Number, nullable: true })
  overbreakM3: number | null;

  @IsString()
  @MaxLength(8000)
  notes: string;
}

/** Where a feature's trace crosses the face, metres from the tunnel axis. */
export class FaceOffsetDto {
  /** Metres right of the axis, looking at the face (negative: left) */
  @IsNumber()
  @Min(-50)
  @Max(50)
  right: number;

  /** Metres above the axis (negative: below) */
  @IsNumber()
  @Min(-50)
  @Max(50)
  up: number;
}

export class JointInputDto {
  /** The joint's stable id (a UUID the client makes); a new one is made when absent. Joints are kept by it. */
  @Optional()
  @IsUUID()
  @ApiProperty({ type: String, required: false, format: 'uuid' })
  id?: string;

  @IsIn(JOINT_KINDS)
  @ApiProperty({ enum: JOINT_KINDS, enumName: 'JointKind' })
  kind: (typeof JOINT_KINDS)[number];

  /** The orientation exactly as typed (kept even when it cannot be read) */
  @IsString()
  @MaxLength(60)
  orientationText: string;

  @IsIn(PLANE_NOTATIONS)
  @ApiProperty({ enum: PLANE_NOTATIONS, enumName: 'PlaneNotation' })
  notation: (typeof PLANE_NOTATIONS)[number];

  @IsOptional()
  @IsString()
  @MaxLength(20)
  @ApiProperty({ type: String, nullable: true })
  setLabel: string | null;

  @Optional()
  @IsBoolean()
  setOverride?: boolean;

  @IsOptional()
  @IsNumber()
  @Min(0)
  @Max(100)
  @ApiProperty({ type: Number, nullable: true })
  spacingM: number | null;

  @IsOptional()
  @IsNumber()
  @Min(0)
  @Max(1000)
  @ApiProperty({ type: Number, nullable: true })
  persistenceM: number | null;

  @IsOptional()
  @IsNumber()
  @Min(0)
  @Max(5000)
  @ApiProperty({ type: Number, nullable: true })
  apertureMm: number | null;

  @IsOptional()
  @IsNumber()
  @Min(0.5, { message: 'Jr is 0.5–5 (table value, +1 allowed for spacing over 3 m).' })
  @Max(5, { message: 'Jr is 0.5–5 (table value, +1 allowed for spacing over 3 m).' })
  @ApiProperty({ type: Number, nullable: true })
  jr: number | null;

  @IsOptional()
  @IsNumber()
  @Min(0, { message: 'JRC is 0–20.' })
  @Max(20, { message: 'JRC is 0–20.' })
  @ApiProperty({ type: Number, nullable: true })
  jrc: number | null;

  @IsOptional()
  @IsIn(JRC_METHODS)
  @ApiProperty({ enum: JRC_METHODS, enumName: 'JrcMethod', nullable: true })
  jrcMethod: (typeof JRC_METHODS)[number] | null;

  @IsString()
  @MaxLength(120)
  infill: string;

  @IsOptional()
  @IsNumber()
  @Min(0.75, { message: 'Ja is 0.75–20.' })
  @Max(20, { message: 'Ja is 0.75–20.' })
  @ApiProperty({ type: Number, nullable: true })
  ja: number | null;

  @IsOptional()
  @IsIn(JOINT_WATER)
  @ApiProperty({ enum: JOINT_WATER, enumName: 'JointWater', nullable: true })
  water: (typeof JOINT_WATER)[number] | null;

  /** Thickness of a fault or shear zone, m */
  @IsOptional()
  @IsNumber()
  @Min(0)
  @Max(500)
  @ApiProperty({ type: Number, nullable: true })
  thicknessM: number | null;

  @IsString()
  @MaxLength(500)
  notes: string;

  /** Where the trace crosses the face (metres right of and above the axis), when known; the crown-reach rule measures from it */
  @IsOptional()
  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => FaceOffsetDto)
  @ApiProperty({ type: FaceOffsetDto, nullable: true, required: false })
  faceOffset?: FaceOffsetDto | null;
  /**
   * "Same feature as": the id of an observation of the same persistent feature on an earlier round of the
   * heading; stored as that feature's first observation (a pick of a later one is resolved to it).
   */
  @IsOptional()
  @IsUUID('all', { message: 'Pick the earlier feature from the list (an id).' })
  @ApiProperty({ type: String, format: 'uuid', nullable: true, required: false })
  sameAsJointId?: string | null;
}

export class JointDto extends JointInputDto {
  @ApiProperty({ type: String, format: 'uuid', required: true })
  declare id: string;
  seq: number;
  /** Canonical dip direction, null while the typed text cannot be read */
  @ApiProperty({ type: Number, nullable: true })
  dipDirection: number | null;
  @ApiProperty({ type: Number, nullable: true })
  dip: number | null;
  /** Why the typed orientation could not be read */
  @ApiProperty({ type: String, nullable: true })
  orientationError: string | null;
}

/** How the round's sets are found: earlier rounds' joints within the window join the analysis. */
export class SetParametersDto {
  /** Metres either side of the face (0, 10, 25, 50 or 100) */
  @IsIn(SET_WINDOWS)
  @ApiProperty({ enum: SET_WINDOWS })
  windowM: number;

  /** Number of sets to look for; null lets Roundbook decide from the density */
  @IsOptional()
  @IsInt()
  @Min(1)
  @Max(8)
  @ApiProperty({ type: Number, nullable: true })
  count: number | null;
}

/** Everything the geologist edits on a round; sent whole on every save (PUT) with the version read. */
export class RoundInputDto {
  @IsNumber({}, { message: 'Face chainage is a number of metres.' })
  @Min(-99999)
  @Max(999999)
  faceChainage: number;

  @IsOptional()
  @IsNumber({}, { message: 'Previous chainage is a number of metres.' })
  @Min(-99999)
  @Max(999999)
  @ApiProperty({ type: Number, nullable: true })
  previousChainage: number | null;

  @IsOptional()
  @IsNumber()
  @Min(-100)
  @Max(100)
  @ApiProperty({ type: Number, nullable: true })
  roundLength: number | null;

  @Matches(/^\d{4}-\d{2}-\d{2}$/, { message: 'Shift date is a date such as 2026-11-30.' })
  @IsCalendarDate({ message: 'Shift date is a real calendar date such as 2026-11-30.' })
  shiftDate: string;

  @IsIn(SHIFTS)
  @ApiProperty({ enum: SHIFTS, enumName: 'Shift' })
  shift: (typeof SHIFTS)[number];

  @IsString()
  @MaxLength(2000)
  distantParts: string;

  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => GroundDto)
  ground: GroundDto;

  @IsArray()
  @ArrayMaxSize(500)
  @IsObject({ each: true, message: 'Each joint is an object of its fields.' })
  @ValidateNested({ each: true })
  @Type(() => JointInputDto)
  joints: JointInputDto[];

  /** Q inputs (numbers may be empty while drafting; table values are checked by packages/geomath) */
  @IsOptional()
  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => QInputDto)
  @ApiProperty({ type: () => QInputDto, nullable: true })
  qInput: QInputDto | null;

  /** RMR89 inputs: strength, RQD, spacing, condition (simple or detailed), groundwater, orientation */
  @IsOptional()
  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => RmrInputDto)
  @ApiProperty({ type: () => RmrInputDto, nullable: true })
  rmrInput: RmrInputDto | null;

  @IsOptional()
  @IsNumber()
  @Min(0)
  @Max(100)
  @ApiProperty({ type: Number, nullable: true })
  gsiObserved: number | null;

  @IsOptional()
  @IsUUID()
  @ApiProperty({ type: String, nullable: true })
  recommendedClassId: string | null;

  @IsOptional()
  @IsNumber()
  @Min(0.3, { message: 'Next round length is 0.3–8 m.' })
  @Max(8, { message: 'Next round length is 0.3–8 m.' })
  @ApiProperty({ type: Number, nullable: true })
  nextRoundLength: number | null;

  @IsString()
  @MaxLength(4000)
  recommendationReason: string;

  /**
   * The face sketch: a packages/domain SketchDocument (schemaVersion, metres in the face frame), checked and
   * upgraded by restoreSketch; null: no sketch. A document that fails the check is a 400 with the reason,
   * one over 512 KB a 413.
   */
  @IsOptional()
  @IsObject({ message: 'The sketch is a document object with its schemaVersion.' })
  @ApiProperty({ type: 'object', additionalProperties: true, nullable: true })
  sketch: Record<string, unknown> | null;

  /** How the sets are found (kept with the round); the default window is 25 m, sets found from the density */
  @Optional()
  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => SetParametersDto)
  setParameters?: SetParametersDto;
}

/** Part of the ground record: on a save, a field left out keeps what the round has. */
export class GroundPatchDto extends PartialType(GroundDto, { skipNullProperties: false }) {}

/**
 * A save: any part of the record with the version read. A field left out keeps what the round has — a partial
 * body never erases anything; null clears only a field whose type allows null (null for any other is a 400).
 */
export class SaveRoundDto extends PartialType(OmitType(RoundInputDto, ['ground'] as const), {
  skipNullProperties: false,
}) {
  /** Ground fields to change; those left out are kept */
  @Optional()
  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => GroundPatchDto)
  @ApiProperty({ type: () => GroundPatchDto, required: false })
  ground?: GroundPatchDto;

  /** The version you last read; a stale version is refused with 409 STALE_VERSION */
  @IsInt()
  @Min(1)
  version: number;
}

export class CreateRoundDto {
  /** The round's id, a UUID made by the client (so a retried create finds the same round); made here when absent */
  @Optional()
  @IsUUID()
  @ApiProperty({ type: String, required: false, format: 'uuid' })
  id?: string;

  @IsIn(STAGES)
  @ApiProperty({ enum: STAGES, enumName: 'Stage' })
  stage: (typeof STAGES)[number];

  @IsNumber({}, { message: 'Face chainage is a number of metres.' })
  @Min(-99999)
  @Max(999999)
  faceChainage: number;
}

export class SubmitRoundDto {
  @IsInt()
  @Min(1)
  version: number;
}

export class RatingOutcomeDto {
  @ApiProperty({ type: Number, nullable: true })
  value: number | null;
  /** Class or band in words */
  @ApiProperty({ type: String, nullable: true })
  label: string | null;
  /** Why it could not be computed from the inputs, if so */
  @ApiProperty({ type: String, nullable: true })
  error: string | null;
  /** Intermediate values and ratings, for showing the inputs beside the result */
  @ApiProperty({ type: 'object', additionalProperties: { type: 'number' } })
  parts: Record<string, number>;
}

export class RoundRatingsDto {
  q: RatingOutcomeDto;
  rmr: RatingOutcomeDto;
  gsi: RatingOutcomeDto;
}

export class TriggerFiringDto {
  ruleId: string;
  @ApiProperty({ enum: ['green', 'amber', 'red'], enumName: 'TriggerLevel' })
  level: 'green' | 'amber' | 'red';
  /** The rule in words, e.g. "Q < 0.1 → red" */
  summary: string;
  /** Why it fires on this round */
  detail: string;
  /** What the project's rule says to do */
  action: string;
  ownerRole: string;
  timeAllowedHours: number;
}

export class RuleNotEvaluatedDto {
  ruleId: string;
  summary: string;
  /** Why it could not be evaluated, or why it waits */
  detail: string;
}

export class RoundDto extends RoundInputDto {
  id: string;
  declare setParameters: SetParametersDto;
  /** Rules whose input this round lacks (its level is not green until they are in) */
  triggersNotEvaluated: RuleNotEvaluatedDto[];
  /** Rules that cannot fire yet (what they watch is not recorded by Roundbook yet) */
  triggersWaiting: RuleNotEvaluatedDto[];
  /** The whole assessment (packages/domain RoundAssessment): saved with a draft, frozen at submit */
  @ApiProperty({ type: 'object', additionalProperties: true })
  assessment: Record<string, unknown>;
  /** The rules version that produced the assessment */
  assessmentVersion: string;
  headingId: string;
  @ApiProperty({ enum: STAGES, enumName: 'Stage' })
  stage: (typeof STAGES)[number];
  roundNumber: number;
  mappedBy: string;
  mappedByName: string;
  mappedAt: string;
  @ApiProperty({ enum: ROUND_STATUSES, enumName: 'RoundStatus' })
  status: (typeof ROUND_STATUSES)[number];
  revision: number;
  /** Highest level among the project's trigger rules that fire on this round; green only when every rule could be evaluated; null when it has no rules or some lack their data */
  @ApiProperty({ enum: ['green', 'amber', 'red'], enumName: 'TriggerLevel', nullable: true })
  triggerLevel: 'green' | 'amber' | 'red' | null;
  /** The rules that fire, red first (as worked out at the last save) */
  triggerFirings: TriggerFiringDto[];
  @ApiProperty({ type: String, nullable: true })
  submittedAt: string | null;
  /** The class the engineer confirmed, apart from the recommendation (null until confirmed) */
  @ApiProperty({ type: String, nullable: true })
  confirmedClassId: string | null;
  /** The next round length the engineer confirmed, m */
  @ApiProperty({ type: Number, nullable: true })
  confirmedRoundLength: number | null;
  declare joints: JointDto[];
  ratings: RoundRatingsDto;
  /** Inflow per 10 m of tunnel, l/min (from inflow and the length it comes from) */
  @ApiProperty({ type: Number, nullable: true })
  inflowPer10m: number | null;
  /** Support classes whose ranges fit the ratings, best ground first */
  suggestedClassIds: string[];
  /** Things worth a second look that do not stop saving (e.g. round length over the planned maximum) */
  warnings: string[];
  /** The planned round length of the heading, m */
  plannedRoundLength: number;
  version: number;
}

export class RoundSummaryDto {
  id: string;
  roundNumber: number;
  @ApiProperty({ enum: STAGES, enumName: 'Stage' })
  stage: (typeof STAGES)[number];
  faceChainage: number;
  shiftDate: string;
  @ApiProperty({ enum: SHIFTS, enumName: 'Shift' })
  shift: (typeof SHIFTS)[number];
  mapperName: string;
  @ApiProperty({ type: Number, nullable: true })
  q: number | null;
  @ApiProperty({ type: Number, nullable: true })
  rmr: number | null;
  @ApiProperty({ type: String, nullable: true })
  recommendedClassCode: string | null;
  /** The class the engineer confirmed (null until confirmed) */
  @ApiProperty({ type: String, nullable: true })
  confirmedClassCode: string | null;
  @ApiProperty({ enum: ROUND_STATUSES, enumName: 'RoundStatus' })
  status: (typeof ROUND_STATUSES)[number];
  @ApiProperty({ enum: ['green', 'amber', 'red'], enumName: 'TriggerLevel', nullable: true })
  triggerLevel: 'green' | 'amber' | 'red' | null;
  /** How many of the project's rules this round lacks the data for */
  triggersNotEvaluated: number;
}

export class RoundPageDto {
  items: RoundSummaryDto[];
  total: number;
  page: number;
  pageSize: number;
}

export const ROUND_SORTS = [
  'faceChainage',
  '-faceChainage',
  'shiftDate',
  '-shiftDate',
  'q',
  '-q',
  'rmr',
  '-rmr',
  'roundNumber',
  '-roundNumber',
] as const;

export class RoundQueryDto {
  @Optional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(100000, { message: 'Page is 1–100000.' })
  page?: number;

  @Optional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(200)
  pageSize?: number;

  @Optional()
  @IsIn(ROUND_SORTS)
  @ApiProperty({ enum: ROUND_SORTS, enumName: 'RoundSort', required: false })
  sort?: (typeof ROUND_SORTS)[number];

  @Optional()
  @IsIn(ROUND_STATUSES)
  @ApiProperty({ enum: ROUND_STATUSES, enumName: 'RoundStatus', required: false })
  status?: (typeof ROUND_STATUSES)[number];

  @Optional()
  @IsIn(STAGES)
  @ApiProperty({ enum: STAGES, enumName: 'Stage', required: false })
  stage?: (typeof STAGES)[number];

  @Optional()
  @Type(() => Number)
  @IsNumber()
  @Min(-99999)
  @Max(999999)
  fromChainage?: number;

  @Optional()
  @Type(() => Number)
  @IsNumber()
  @Min(-99999)
  @Max(999999)
  toChainage?: number;
}

export class NextRoundDto {
  @ApiProperty({ enum: STAGES, enumName: 'Stage' })
  stage: (typeof STAGES)[number];
  roundNumber: number;
  /** Face chainage of the last round of this heading and stage, or the heading's start */
  previousChainage: number;
  plannedRoundLength: number;
  /** The longest round the support class of the last round allows (its confirmed, else recommended class) */
  @ApiProperty({ type: Number, nullable: true })
  allowedRoundLength: number | null;
  /** That class's code */
  @ApiProperty({ type: String, nullable: true })
  allowedByClassCode: string | null;
  /**
   * previousChainage ± the smaller of the planned round length and allowedRoundLength (by the heading's chainage
   * sense), as a starting value
   */
  suggestedFaceChainage: number;
}

export class NearbyJointDto {
  id: string;
  roundId: string;
  roundNumber: number;
  faceChainage: number;
  @ApiProperty({ enum: JOINT_KINDS, enumName: 'JointKind' })
  kind: (typeof JOINT_KINDS)[number];
  dipDirection: number;
  dip: number;
  @ApiProperty({ type: String, nullable: true })
  setLabel: string | null;
  /** The first observation of the same feature on an earlier round, when linked */
  @ApiProperty({ type: String, format: 'uuid', nullable: true, required: false })
  sameAsJointId?: string | null;
  /** The geologist's notes on the joint (a named feature is named there) */
  @ApiProperty({ required: false })
  notes?: string;
}

export class NearbyJointsQueryDto {
  @Type(() => Number)
  @IsNumber()
  @Min(-99999)
  @Max(999999)
  fromChainage: number;

  @Type(() => Number)
  @IsNumber()
  @Min(-99999)
  @Max(999999)
  toChainage: number;

  @Optional()
  @IsUUID()
  excludeRoundId?: string;
}

export class RoundRevisionDto {
  id: string;
  revision: number;
  /** What froze it: submit (later also confirm, return, correct) */
  @ApiProperty({ enum: ['submit', 'confirm', 'return', 'correct'], enumName: 'RoundEvent' })
  event: 'submit' | 'confirm' | 'return' | 'correct';
  @ApiProperty({ enum: ROUND_STATUSES, enumName: 'RoundStatus' })
  status: string;
  createdBy: string;
  createdAt: string;
  /** The record as it was */
  @ApiProperty({ type: 'object', additionalProperties: true })
  record: Record<string, unknown>;
  /** The assessment as it was (packages/domain RoundAssessment) */
  @ApiProperty({ type: 'object', additionalProperties: true })
  assessment: Record<string, unknown>;
  assessmentVersion: string;
}
