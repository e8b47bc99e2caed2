import { ApiProperty } from '@nestjs/swagger';
import {
  CYCLE_STAGES,
  HANDOVER_STATUSES,
  HAZARD_KINDS,
  SHIFTS,
  STAGES,
  TRIGGER_LEVELS,
} from '@roundbook/domain';
import type { CycleStage, HandoverStatus, HazardKind, Shift, Stage, TriggerLevel } from '@roundbook/domain';
import { Transform, Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  ArrayUnique,
  IsArray,
  IsEmail,
  IsIn,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  MaxLength,
  ValidateNested,
} from 'class-validator';
import { IsCalendarDate } from '../../../common/dto/calendar-date.js';
import { Optional } from '../../../common/dto/optional.js';

/** At most this many headings go into one handover (one supervisor's shift). */
export const MAX_HANDOVER_HEADINGS = 12;

export class HandoverDraftQueryDto {
  /** The headings to hand over, comma-separated ids (at least one) */
  @Transform(({ value }: { value: unknown }) =>
    typeof value === 'string'
      ? value
          .split(',')
          .map((s) => s.trim())
          .filter(Boolean)
      : value,
  )
  @IsArray({ message: 'headingIds lists the headings to hand over, comma-separated.' })
  @ArrayMinSize(1, { message: 'Name at least one heading to hand over.' })
  @ArrayMaxSize(MAX_HANDOVER_HEADINGS)
  @ArrayUnique()
  @IsUUID('all', { each: true, message: 'Each heading id is a UUID.' })
  @ApiProperty({ type: String, description: 'Comma-separated heading ids' })
  headingIds: string[];
}

export class HandoverAlertDto {
  @ApiProperty({ enum: TRIGGER_LEVELS, enumName: 'TriggerLevel' })
  level: TriggerLevel;
  summary: string;
  action: string;
  /** The role that owns the alert (who acts on it) */
  ownerRole: string;
}

/** An open hazard of the heading, carried forward on the handover (frozen when sent). */
export class HandoverHazardDto {
  id: string;
  @ApiProperty({ enum: HAZARD_KINDS, enumName: 'HazardKind' })
  kind: HazardKind;
  /** The range's end nearer the heading's start, m */
  fromChainage: number;
  /** The range's far end along the drive, m */
  toChainage: number;
  @ApiProperty({ enum: TRIGGER_LEVELS, enumName: 'TriggerLevel' })
  level: TriggerLevel;
  description: string;
}

/** A mapped fault or shear zone whose crown or invert crossing lies ahead of the face (frozen when sent). */
export class HandoverLookAheadDto {
  /** The feature as the round names it, e.g. "fault 1" */
  label: string;
  /** The round whose face map gave it */
  roundNumber: number;
  /** Where it reaches the crown and the invert, m (null: runs along the tunnel there) */
  @ApiProperty({ type: Number, nullable: true })
  crownChainage: number | null;
  @ApiProperty({ type: Number, nullable: true })
  invertChainage: number | null;
  /** Along the drive from the face, m (negative: already passed there) */
  @ApiProperty({ type: Number, nullable: true })
  crownAhead: number | null;
  @ApiProperty({ type: Number, nullable: true })
  invertAhead: number | null;
  /** The nearer crossing still ahead, m */
  nearestAhead: number;
  /** Where it is met first */
  @ApiProperty({ enum: ['crown', 'invert'], enumName: 'LookAheadPlace' })
  firstAt: 'crown' | 'invert';
  /** 1: in the next round, 2: the one after, …; null when no round length is known */
  @ApiProperty({ type: Number, nullable: true })
  roundsAhead: number | null;
  /** Whether its trace on the face was recorded (else measured from the face centre) */
  traceKnown: boolean;
}

export class HandoverLastConfirmedDto {
  roundId: string;
  roundNumber: number;
  @ApiProperty({ enum: STAGES, enumName: 'Stage' })
  stage: Stage;
  faceChainage: number;
  @ApiProperty({ type: String, nullable: true })
  classId: string | null;
  @ApiProperty({ type: String, nullable: true })
  classCode: string | null;
  @ApiProperty({ type: String, nullable: true })
  className: string | null;
  /** The next round length the engineer confirmed, m */
  @ApiProperty({ type: Number, nullable: true })
  nextRoundLength: number | null;
  @ApiProperty({ type: String, nullable: true })
  confirmedAt: string | null;
}

/** One heading of a handover: the figures from the data, and the supervisor's words. */
export class HandoverHeadingDto {
  headingId: string;
  code: string;
  name: string;
  @ApiProperty({ enum: ['km+m', 'metres'], enumName: 'ChainageStyle' })
  chainageStyle: 'km+m' | 'metres';
  chainageDecimals: number;
  /** Face of the last round handed in (submitted or later), metres; null before the first */
  @ApiProperty({ type: Number, nullable: true })
  faceChainage: number | null;
  @ApiProperty({ enum: STAGES, enumName: 'Stage', nullable: true })
  stage: Stage | null;
  @ApiProperty({ type: Number, nullable: true })
  lastRoundNumber: number | null;
  @ApiProperty({ type: HandoverLastConfirmedDto, nullable: true })
  lastConfirmed: HandoverLastConfirmedDto | null;
  /** Trigger level of the last round handed in */
  @ApiProperty({ enum: TRIGGER_LEVELS, enumName: 'TriggerLevel', nullable: true })
  triggerLevel: TriggerLevel | null;
  @ApiProperty({ type: [HandoverAlertDto] })
  alerts: HandoverAlertDto[];
  /** The heading's open hazards, red first then amber then green, each by chainage */
  @ApiProperty({ type: [HandoverHazardDto] })
  hazards: HandoverHazardDto[];
  /** Support as built still outstanding on the heading's confirmed rounds, one line per item */
  @ApiProperty({ type: [String] })
  supportOutstanding: string[];
  /** Features of the latest handed-in rounds reaching the crown or invert ahead of the face, nearest first */
  @ApiProperty({ type: [HandoverLookAheadDto] })
  lookAhead: HandoverLookAheadDto[];
  /** The round length the coming rounds are counted in, m (last confirmed round's next, else planned) */
  @ApiProperty({ type: Number, nullable: true })
  lookAheadRoundLength: number | null;
  @ApiProperty({ enum: CYCLE_STAGES, enumName: 'CycleStage', nullable: true })
  cycleStage: CycleStage | null;
  notes: string;
}

export class HandoverPersonDto {
  userId: string;
  name: string;
  email: string;
}

/** What the composer opens with: the headings' figures now, and whom it could go to. */
export class HandoverDraftDto {
  @ApiProperty({ type: [HandoverHeadingDto] })
  headings: HandoverHeadingDto[];
  /** The shift now, in the project's time zone */
  shiftDate: string;
  @ApiProperty({ enum: SHIFTS, enumName: 'Shift' })
  shift: Shift;
  /** Members with the supervisor role, other than the caller: who can receive it */
  @ApiProperty({ type: [HandoverPersonDto] })
  supervisors: HandoverPersonDto[];
  /** The project's distribution list (always copied) */
  distributionList: string[];
  caution: string;
}

export class ComposeHandoverHeadingDto {
  @IsUUID('all', { message: 'headingId is the id of one of the project’s headings.' })
  headingId: string;

  /** Where the cycle stands at the face */
  @IsIn(CYCLE_STAGES, { message: `cycleStage is one of ${CYCLE_STAGES.join(', ')}.` })
  @ApiProperty({ enum: CYCLE_STAGES, enumName: 'CycleStage' })
  cycleStage: CycleStage;

  @Optional()
  @IsString()
  @MaxLength(4000)
  notes?: string;
}

/** The supervisor's handover: the headings with their words, whom it goes to, and the shift. */
export class ComposeHandoverDto {
  @IsCalendarDate()
  @ApiProperty({ type: String, pattern: '^\\d{4}-\\d{2}-\\d{2}$' })
  shiftDate: string;

  @IsIn(SHIFTS)
  @ApiProperty({ enum: SHIFTS, enumName: 'Shift' })
  shift: Shift;

  /** The incoming supervisor: a member of the project with the supervisor role */
  @IsUUID('all')
  incomingUserId: string;

  @IsArray()
  @ArrayMinSize(1, { message: 'Hand over at least one heading.' })
  @ArrayMaxSize(MAX_HANDOVER_HEADINGS)
  @IsObject({ each: true, message: 'Each heading is an object with headingId and cycleStage.' })
  @ValidateNested({ each: true })
  @Type(() => ComposeHandoverHeadingDto)
  @ApiProperty({ type: [ComposeHandoverHeadingDto], minItems: 1, maxItems: MAX_HANDOVER_HEADINGS })
  headings: ComposeHandoverHeadingDto[];

  @Optional()
  @IsString()
  @MaxLength(8000)
  generalNotes?: string;

  /** Further addresses besides the incoming supervisor and the project's distribution list */
  @Optional()
  @IsArray()
  @ArrayMaxSize(20)
  @ArrayUnique()
  @IsEmail({}, { each: true, message: 'Each extra recipient is an e-mail address.' })
  @MaxLength(254, { each: true })
  @ApiProperty({ type: [String], format: 'email', maxItems: 20, required: false })
  extraRecipients?: string[];
}

export class AcknowledgeHandoverDto {
  /** A remark or a question back to the outgoing supervisor */
  @IsOptional()
  @IsString()
  @MaxLength(2000)
  @ApiProperty({ type: String, nullable: true, required: false, maxLength: 2000 })
  comment?: string | null;
}

export class HandoverDto {
  id: string;
  projectId: string;
  projectName: string;
  /** The project's time zone (times are shown in it) */
  timeZone: string;
  shiftDate: string;
  @ApiProperty({ enum: SHIFTS, enumName: 'Shift' })
  shift: Shift;
  @ApiProperty({ enum: HANDOVER_STATUSES, enumName: 'HandoverStatus' })
  status: HandoverStatus;
  outgoing: HandoverPersonDto;
  incoming: HandoverPersonDto;
  @ApiProperty({ type: [HandoverHeadingDto] })
  headings: HandoverHeadingDto[];
  generalNotes: string;
  /** Every address the e-mail goes to */
  recipients: string[];
  /** Where the e-mail stands: waiting for its PDF or in the outbox (queued), sent, or failed */
  @ApiProperty({ enum: ['queued', 'sent', 'failed'], enumName: 'HandoverEmailStatus' })
  emailStatus: 'queued' | 'sent' | 'failed';
  /** The PDF is stored and can be downloaded */
  pdfReady: boolean;
  @ApiProperty({ type: String, format: 'date-time' })
  sentAt: string;
  /** By when the incoming supervisor should acknowledge (sent + the project's handover minutes) */
  @ApiProperty({ type: String, format: 'date-time' })
  ackDueAt: string;
  /** Not acknowledged and past ackDueAt */
  overdue: boolean;
  /** The outgoing supervisor and the engineers were told it ran overdue */
  overdueNotified: boolean;
  @ApiProperty({ type: String, format: 'date-time', nullable: true })
  acknowledgedAt: string | null;
  @ApiProperty({ type: HandoverPersonDto, nullable: true })
  acknowledgedBy: HandoverPersonDto | null;
  @ApiProperty({ type: String, nullable: true })
  acknowledgeComment: string | null;
  caution: string;
}

export class HandoverUrlDto {
  url: string;
  @ApiProperty({ type: String, format: 'date-time' })
  expiresAt: string;
}
