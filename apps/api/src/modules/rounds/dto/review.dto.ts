import { ApiProperty } from '@nestjs/swagger';
import { CHANGE_ASPECTS, CHANGE_TRENDS, ROUND_STATUSES, STAGES, TRIGGER_LEVELS } from '@roundbook/domain';
import { Type } from 'class-transformer';
import {
  IsISO8601,
  IsOptional,
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsIn,
  IsInt,
  IsNumber,
  IsString,
  IsUUID,
  Length,
  Max,
  MaxLength,
  Min,
  ValidateNested,
  IsObject,
} from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';
import { REVIEW_DECISIONS, REVIEW_SECTIONS, type ReviewSection } from '../round-review.entity.js';

export class ConfirmRoundDto {
  /** The round's version as the engineer read it (409 STALE_VERSION if it changed) */
  @IsInt()
  @Min(1)
  version: number;

  /** The support class to build */
  @IsUUID()
  classId: string;

  /** The next round length to build, m */
  @IsNumber({}, { message: 'Give the next round length in metres.' })
  @Min(0.1, { message: 'A round is at least 0.1 m.' })
  @Max(20, { message: 'A round is at most 20 m.' })
  roundLength: number;

  /** Needed when the class is not the recommended one, or the length is over the class's maximum */
  @IsString()
  @MaxLength(2000)
  reason: string;

  @IsString()
  @MaxLength(4000)
  comments: string;

  /** The engineer's password, asked again for the sign-off */
  @IsString()
  @Length(1, 200, { message: 'Type your password to sign.' })
  password: string;
}

export class ReturnCommentInputDto {
  @ApiProperty({ enum: REVIEW_SECTIONS, enumName: 'ReviewSection' })
  @IsIn(REVIEW_SECTIONS)
  section: ReviewSection;

  @IsString()
  @Length(1, 2000, { message: 'Write the comment (up to 2000 characters).' })
  text: string;
}

export class ReturnRoundDto {
  @IsInt()
  @Min(1)
  version: number;

  /** At least one comment, each on a section of the round */
  @IsArray()
  @ArrayMinSize(1, { message: 'Say what needs another look: at least one comment.' })
  @ArrayMaxSize(50)
  @IsObject({ each: true, message: 'Give each item as an object.' })
  @ValidateNested({ each: true })
  @Type(() => ReturnCommentInputDto)
  comments: ReturnCommentInputDto[];
}

export class CorrectRoundDto {
  @IsInt()
  @Min(1)
  version: number;

  /** Why the confirmed round is corrected */
  @IsString()
  @MaxLength(2000)
  reason: string;
}

export class ReviewCommentDto {
  id: string;
  @ApiProperty({ enum: REVIEW_SECTIONS, enumName: 'ReviewSection' })
  section: ReviewSection;
  text: string;
  revision: number;
  authorName: string;
  createdAt: string;
  @ApiProperty({ type: String, nullable: true })
  resolvedAt: string | null;
  /** Who marked it resolved (null while open) */
  @ApiProperty({ type: String, nullable: true })
  resolvedByName: string | null;
}

export class ReviewDecisionDto {
  id: string;
  @ApiProperty({ enum: REVIEW_DECISIONS, enumName: 'ReviewDecision' })
  decision: 'confirm' | 'return' | 'correct';
  revision: number;
  @ApiProperty({ type: String, nullable: true })
  classId: string | null;
  @ApiProperty({ type: String, nullable: true })
  classCode: string | null;
  @ApiProperty({ type: Number, nullable: true })
  roundLength: number | null;
  @ApiProperty({ type: String, nullable: true })
  recommendedClassId: string | null;
  reason: string;
  comments: string;
  signedByName: string;
  signedRole: string;
  signedAt: string;
}

/** What the caller may do on the round's review, and why not (the screen shows the reason). */
export class ReviewPermissionDto {
  allowed: boolean;
  /** Why not, in words (empty when allowed) */
  reason: string;
}

/** The review of one round: the confirmation, the decisions, the open comments, and the caller's options. */
/** One change from the previous round of the heading and stage to this one */
export class RoundChangeDto {
  @ApiProperty({ enum: CHANGE_ASPECTS, enumName: 'ChangeAspect' })
  aspect: string;
  label: string;
  before: string;
  after: string;
  @ApiProperty({ enum: CHANGE_TRENDS, enumName: 'ChangeTrend' })
  trend: string;
  text: string;
}

/** What changed since the previous round of the heading and stage, from the two frozen assessments */
export class SincePreviousDto {
  /** The previous round; null when there is none or it was never submitted (see note) */
  @ApiProperty({ type: String, nullable: true })
  previousRoundId: string | null;
  @ApiProperty({ type: Number, nullable: true })
  previousRoundNumber: number | null;
  /** The previous round's revision compared with */
  @ApiProperty({ type: Number, nullable: true })
  previousRevision: number | null;
  changes: RoundChangeDto[];
  /** Why nothing is compared, when nothing is */
  note: string;
}

export class RoundReviewDto {
  roundId: string;
  @ApiProperty({ enum: ROUND_STATUSES, enumName: 'RoundStatus' })
  status: string;
  revision: number;
  version: number;
  @ApiProperty({ type: String, nullable: true })
  recommendedClassId: string | null;
  @ApiProperty({ type: Number, nullable: true })
  recommendedRoundLength: number | null;
  @ApiProperty({ type: String, nullable: true })
  confirmedClassId: string | null;
  @ApiProperty({ type: Number, nullable: true })
  confirmedRoundLength: number | null;
  @ApiProperty({ type: String, nullable: true })
  confirmedAt: string | null;
  /** The last confirmation, if the round is confirmed */
  @ApiProperty({ type: ReviewDecisionDto, nullable: true })
  confirmation: ReviewDecisionDto | null;
  /** Every decision, oldest first */
  decisions: ReviewDecisionDto[];
  /** Return comments not yet resolved, of any return */
  openComments: ReviewCommentDto[];
  /** Every comment of the last return, resolved or open (what the next review shows) */
  returnComments: ReviewCommentDto[];
  /** The fired trigger rules with their clocks (from the submit) and acknowledgements; empty before submit */
  rules: RoundRuleDto[];
  /** Fired rules held by an engineer's acceptance of the standing condition (not raising the level) */
  acceptedRules: AcceptedRuleDto[];
  /** Fired rules whose acceptance lapsed (range ended, date passed, condition changed), with why */
  lapsedAcceptances: LapsedAcceptanceDto[];
  canConfirm: ReviewPermissionDto;
  canReturn: ReviewPermissionDto;
  canCorrect: ReviewPermissionDto;
  /** The geologist may mark return comments resolved */
  canResolve: boolean;
  /** The caller is an engineer: may accept a fired rule's standing condition, or withdraw an acceptance */
  canAcceptConditions: boolean;
  separationOfDuties: boolean;
  /** Changes since the previous round of the heading and stage; null before the round is submitted */
  @ApiProperty({ type: SincePreviousDto, nullable: true })
  sincePrevious: SincePreviousDto | null;
  caution: string;
}

export class ReviewQueueQueryDto {
  @Optional()
  @IsUUID()
  headingId?: string;
}

export class RuleClockDto {
  ruleId: string;
  @ApiProperty({ enum: TRIGGER_LEVELS, enumName: 'TriggerLevel' })
  level: 'green' | 'amber' | 'red';
  summary: string;
  action: string;
  ownerRole: string;
  timeAllowedHours: number;
  dueAt: string;
  /** Minutes left against the rule's timeframe (negative once past it) */
  minutesLeft: number;
  /** Past its time without its owner's acknowledgement */
  overdue: boolean;
  @ApiProperty({ type: String, nullable: true })
  acknowledgedAt: string | null;
}

export class AcknowledgeRuleDto {
  /** What was done about it (e.g. "Probe holes drilled, no water") */
  @IsString()
  @Length(1, 2000, { message: 'Say what was done (up to 2000 characters).' })
  actionTaken: string;

  @IsString()
  @MaxLength(2000)
  note: string;
}

export class AcceptConditionDto {
  /** Start of the chainage range the acceptance holds for, m (null: open at that end) */
  @IsOptional()
  @IsNumber({}, { message: 'Give the chainage in metres, e.g. 1012.5.' })
  @Min(-100000)
  @Max(1000000)
  fromChainage?: number | null;

  /** End of the chainage range, m (null: open at that end) */
  @IsOptional()
  @IsNumber({}, { message: 'Give the chainage in metres, e.g. 1030.' })
  @Min(-100000)
  @Max(1000000)
  toChainage?: number | null;

  /** The acceptance holds until this time (ISO 8601), when given */
  @IsOptional()
  @IsISO8601({}, { message: 'Give the date as 2026-12-31 (or a full ISO 8601 time).' })
  until?: string | null;

  /** Why the condition is accepted (a red rule needs a written reason of at least 20 characters) */
  @IsString()
  @MaxLength(2000)
  reason: string;
}

/** A fired rule held by an acceptance of its standing condition: listed, not raising the level. */
export class AcceptedRuleDto {
  ruleId: string;
  @ApiProperty({ enum: TRIGGER_LEVELS, enumName: 'TriggerLevel' })
  level: 'green' | 'amber' | 'red';
  summary: string;
  detail: string;
  acceptanceId: string;
  reason: string;
  acceptedByName: string;
  acceptedAt: string;
  @ApiProperty({ type: Number, nullable: true })
  fromChainage: number | null;
  @ApiProperty({ type: Number, nullable: true })
  toChainage: number | null;
  @ApiProperty({ type: String, nullable: true })
  until: string | null;
  /** The acceptance was taken on this round (it may be withdrawn here) */
  acceptedHere: boolean;
}

/** A fired rule whose acceptance no longer holds, and why (it raises the level again). */
export class LapsedAcceptanceDto {
  ruleId: string;
  acceptanceId: string;
  why: string;
}

export class RuleAcknowledgementDto {
  actionTaken: string;
  note: string;
  byName: string;
  role: string;
  at: string;
}

/** One fired rule of the round, its clock and its acknowledgement. */
export class RoundRuleDto extends RuleClockDto {
  /** Why it fires, in words */
  detail: string;
  @ApiProperty({ type: RuleAcknowledgementDto, nullable: true })
  acknowledgement: RuleAcknowledgementDto | null;
  /** The caller owns this rule and may acknowledge it now */
  canAcknowledge: boolean;
  /** The caller is an engineer and may accept this rule's standing condition */
  canAccept: boolean;
}

export class ReviewQueueItemDto {
  roundId: string;
  projectId: string;
  projectCode: string;
  projectName: string;
  headingId: string;
  headingCode: string;
  roundNumber: number;
  faceChainage: number;
  /** The chainage as the heading prints it (e.g. 1+015.0) */
  chainageText: string;
  @ApiProperty({ enum: STAGES, enumName: 'Stage' })
  stage: string;
  geologistName: string;
  submittedAt: string;
  minutesWaiting: number;
  @ApiProperty({ enum: TRIGGER_LEVELS, enumName: 'TriggerLevel', nullable: true })
  triggerLevel: 'green' | 'amber' | 'red' | null;
  rules: RuleClockDto[];
  @ApiProperty({ type: String, nullable: true })
  recommendedClassCode: string | null;
  revision: number;
}

export class ReviewQueueDto {
  items: ReviewQueueItemDto[];
  caution: string;
}
