import { ApiProperty } from '@nestjs/swagger';
import { CHAINAGE_STYLES } from '@roundbook/domain';
import {
  ArrayMaxSize,
  ArrayUnique,
  IsArray,
  IsBoolean,
  IsEmail,
  IsIn,
  IsInt,
  IsString,
  Length,
  Matches,
  Max,
  Min,
  Validate,
  ValidatorConstraint,
  type ValidatorConstraintInterface,
} from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';
import { ROLE_ENUM } from '../../auth/dto/token-response.dto.js';
import { PLANE_NOTATIONS, Q_TABLE_EDITIONS } from '../project.entity.js';

export class LastHandoverDto {
  sentAt: string;
  acknowledgedAt: string | null;
  /** By when the incoming supervisor should have acknowledged it */
  ackDueAt: string;
  /** Not acknowledged and past its time (the project's handover acknowledgement minutes) */
  overdue: boolean;
}

/** The class confirmed on the heading's most recently confirmed round (the class being built) */
export class ConfirmedClassDto {
  code: string;
  roundNumber: number;
  @ApiProperty({ enum: ['full-face', 'top-heading', 'bench', 'invert'], enumName: 'Stage' })
  stage: string;
  confirmedAt: string;
}

export class HeadingSummaryDto {
  id: string;
  code: string;
  name: string;
  /** Drive direction, degrees clockwise from north */
  driveTrend: number;
  /** Gradient in per cent, positive rising in the direction of advance */
  gradientPercent: number;
  /** Start chainage in metres */
  startChainage: number;
  /** How the heading writes its chainages (every chainage on the Board is shown in it) */
  @ApiProperty({ enum: CHAINAGE_STYLES, enumName: 'ChainageStyle' })
  chainageStyle: (typeof CHAINAGE_STYLES)[number];
  chainageDecimals: number;
  @ApiProperty({ enum: ['full-face', 'top-heading', 'bench', 'invert'], enumName: 'Stage', isArray: true })
  stages: Array<'full-face' | 'top-heading' | 'bench' | 'invert'>;
  @ApiProperty({ enum: ['circular', 'horseshoe', 'd-shaped', 'rectangular'], enumName: 'ProfileShape' })
  profileShape: 'circular' | 'horseshoe' | 'd-shaped' | 'rectangular';
  profileWidth: number;
  profileHeight: number;
  plannedRoundLength: number;
  /** Chainage of the face furthest along the drive among rounds handed in (not drafts), metres; null before */
  @ApiProperty({ type: Number, nullable: true })
  faceChainage: number | null;
  /** A draft round's face beyond the handed-in one, metres (shown marked as a draft); null if none */
  @ApiProperty({ type: Number, nullable: true })
  draftFaceChainage: number | null;
  @ApiProperty({ type: String, nullable: true })
  lastRoundAt: string | null;
  /** Rounds submitted and waiting for the engineer's review */
  roundsToConfirm: number;
  @ApiProperty({ enum: ['green', 'amber', 'red'], enumName: 'TriggerLevel', nullable: true })
  triggerLevel: 'green' | 'amber' | 'red' | null;
  @ApiProperty({ type: LastHandoverDto, nullable: true })
  lastHandover: LastHandoverDto | null;
  @ApiProperty({ type: ConfirmedClassDto, nullable: true })
  confirmedClass: ConfirmedClassDto | null;
  /** The latest confirmed round of a stage has support outstanding (or none recorded yet while its class names some) */
  supportOutstanding: boolean;
}

export class ProjectSummaryDto {
  id: string;
  code: string;
  name: string;
  client: string;
  /** IANA time zone; shift dates follow it */
  timeZone: string;
  @ApiProperty({ enum: Q_TABLE_EDITIONS, enumName: 'QTableEdition' })
  qTableEdition: (typeof Q_TABLE_EDITIONS)[number];
  @ApiProperty({ enum: PLANE_NOTATIONS, enumName: 'PlaneNotation' })
  defaultNotation: (typeof PLANE_NOTATIONS)[number];
  /** Scale of weathering and strength grades (one per project) */
  @ApiProperty({ enum: ['isrm', 'iso-14689'], enumName: 'GroundScale' })
  groundScale: 'isrm' | 'iso-14689';
  /** Addresses that receive every handover */
  distributionList: string[];
  /** Name of the project's coordinate grid */
  coordinateGrid: string;
  /** Minutes the incoming supervisor has to acknowledge a handover before it is flagged overdue (default 60) */
  handoverAckMinutes: number;
  /** Separation of duties: whoever mapped or submitted a round may not confirm it (on by default) */
  separationOfDuties: boolean;
  /** The caller's role in this project */
  @ApiProperty({ enum: ROLE_ENUM, enumName: 'ProjectRole' })
  role: 'admin' | 'geologist' | 'engineer' | 'supervisor' | 'viewer';
  /** Optimistic-locking version; send it back when changing the project */
  version: number;
  headings: HeadingSummaryDto[];
}

@ValidatorConstraint({ name: 'timeZone' })
class IsTimeZone implements ValidatorConstraintInterface {
  validate(value: unknown): boolean {
    if (typeof value !== 'string') return false;
    try {
      new Intl.DateTimeFormat('en', { timeZone: value });
      return true;
    } catch {
      return false;
    }
  }
  defaultMessage(): string {
    return 'Use a time zone name such as Europe/Zurich or America/Lima.';
  }
}

export class UpdateProjectDto {
  @Optional()
  @IsString()
  @Length(1, 160)
  name?: string;

  @Optional()
  @IsString()
  @Length(0, 160)
  client?: string;

  @Optional()
  @Validate(IsTimeZone)
  timeZone?: string;

  @Optional()
  @IsIn(PLANE_NOTATIONS)
  @ApiProperty({ enum: PLANE_NOTATIONS, enumName: 'PlaneNotation', required: false })
  defaultNotation?: (typeof PLANE_NOTATIONS)[number];

  @Optional()
  @IsIn(Q_TABLE_EDITIONS)
  @ApiProperty({ enum: Q_TABLE_EDITIONS, enumName: 'QTableEdition', required: false })
  qTableEdition?: (typeof Q_TABLE_EDITIONS)[number];

  @Optional()
  @IsIn(['isrm', 'iso-14689'])
  @ApiProperty({ enum: ['isrm', 'iso-14689'], enumName: 'GroundScale', required: false })
  groundScale?: 'isrm' | 'iso-14689';

  /** Addresses that receive every handover */
  @Optional()
  @IsArray()
  @ArrayMaxSize(50)
  @ArrayUnique()
  @IsEmail({}, { each: true, message: 'Each entry must be an e-mail address such as name@example.org.' })
  distributionList?: string[];

  @Optional()
  @IsString()
  @Length(0, 120)
  coordinateGrid?: string;

  /** Separation of duties: whoever mapped or submitted a round may not confirm it (on by default) */
  @Optional()
  @IsBoolean()
  separationOfDuties?: boolean;

  /** Minutes the incoming supervisor has to acknowledge a handover before it is flagged overdue (5 to 720) */
  @Optional()
  @IsInt({ message: 'handoverAckMinutes is a whole number of minutes.' })
  @Min(5, { message: 'Allow at least 5 minutes to acknowledge a handover.' })
  @Max(720, { message: 'Allow at most 720 minutes (12 hours, one shift) to acknowledge a handover.' })
  handoverAckMinutes?: number;

  /** The version you last read; a stale version is refused with 409 STALE_VERSION */
  @IsInt()
  @Min(1)
  version: number;
}

export class CreateProjectDto {
  @IsString()
  @Matches(/^[A-Za-z0-9][A-Za-z0-9._-]{0,19}$/, {
    message: 'Use up to 20 letters, digits, dots, dashes or underscores.',
  })
  code: string;

  @IsString()
  @Length(1, 160, { message: 'Give the project a name (up to 160 characters).' })
  name: string;

  @Optional()
  @IsString()
  @Length(0, 160)
  client?: string;

  @Validate(IsTimeZone)
  timeZone: string;

  @Optional()
  @IsIn(PLANE_NOTATIONS)
  @ApiProperty({ enum: PLANE_NOTATIONS, enumName: 'PlaneNotation', required: false })
  defaultNotation?: (typeof PLANE_NOTATIONS)[number];

  @Optional()
  @IsIn(['isrm', 'iso-14689'])
  @ApiProperty({ enum: ['isrm', 'iso-14689'], enumName: 'GroundScale', required: false })
  groundScale?: 'isrm' | 'iso-14689';
}
