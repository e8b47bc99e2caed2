import { ApiProperty } from '@nestjs/swagger';
import type { HazardKind, HazardOrigin, HazardStatus, TriggerLevel } from '@roundbook/domain';
import {
  ArrayMaxSize,
  IsArray,
  IsIn,
  IsInt,
  IsNumber,
  IsOptional,
  IsString,
  IsUUID,
  Length,
  Max,
  Min,
} from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';
import { HAZARD_KINDS, HAZARD_LEVELS, HAZARD_ORIGINS, HAZARD_STATUSES } from '../hazard.entity.js';

/** At most this many photos are linked to one hazard. */
export const MAX_HAZARD_PHOTOS = 20;

/** A hazard as the register, the handover and the trigger rules read it. */
export class HazardDto {
  id: string;
  headingId: string;
  @ApiProperty({ enum: HAZARD_KINDS, enumName: 'HazardKind' })
  kind: HazardKind;
  /** The range's end nearer the heading's start, m */
  fromChainage: number;
  /** The range's far end along the drive, m */
  toChainage: number;
  @ApiProperty({ enum: HAZARD_LEVELS, enumName: 'TriggerLevel' })
  level: TriggerLevel;
  description: string;
  @ApiProperty({ enum: HAZARD_ORIGINS, enumName: 'HazardOrigin' })
  origin: HazardOrigin;
  @ApiProperty({ type: String, nullable: true, format: 'uuid' })
  roundId: string | null;
  /** The round's number on its heading and stage, when raised on a round */
  @ApiProperty({ type: Number, nullable: true })
  roundNumber: number | null;
  @ApiProperty({ type: String, nullable: true, format: 'uuid' })
  handoverId: string | null;
  @ApiProperty({ type: [String] })
  photoIds: string[];
  @ApiProperty({ enum: HAZARD_STATUSES, enumName: 'HazardStatus' })
  status: HazardStatus;
  raisedBy: string;
  @ApiProperty({ type: String, nullable: true })
  raisedByName: string | null;
  @ApiProperty({ type: String, format: 'date-time' })
  raisedAt: string;
  @ApiProperty({ type: String, nullable: true })
  closedBy: string | null;
  @ApiProperty({ type: String, nullable: true })
  closedByName: string | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true })
  closedAt: string | null;
  @ApiProperty({ type: String, nullable: true })
  closeReason: string | null;
  version: number;
}

/** Raises a hazard on a heading: directly, from a round or from a handover. */
export class CreateHazardDto {
  /** The hazard's id (a UUID the client makes, so a retry finds it); made by the API when absent */
  @Optional()
  @IsUUID()
  @ApiProperty({ type: String, required: false, format: 'uuid' })
  id?: string;

  @IsIn(HAZARD_KINDS)
  @ApiProperty({ enum: HAZARD_KINDS, enumName: 'HazardKind' })
  kind: HazardKind;

  /** One end of the range, m (the ends may come in either order) */
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give the chainage in metres.' })
  @Min(-999999)
  @Max(999999)
  fromChainage: number;

  /** The other end, m (the same as from for a hazard at one place) */
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give the chainage in metres.' })
  @Min(-999999)
  @Max(999999)
  toChainage: number;

  @IsIn(HAZARD_LEVELS)
  @ApiProperty({ enum: HAZARD_LEVELS, enumName: 'TriggerLevel' })
  level: TriggerLevel;

  @IsString()
  @Length(3, 2000, { message: 'Say what the hazard is and where (3 to 2000 characters).' })
  description: string;

  /** Where it is raised (default: directly on the register) */
  @Optional()
  @IsIn(HAZARD_ORIGINS)
  @ApiProperty({ enum: HAZARD_ORIGINS, enumName: 'HazardOrigin', required: false })
  origin?: HazardOrigin;

  /** The round of this heading it was raised on (origin round) */
  @IsOptional()
  @IsUUID()
  @ApiProperty({ type: String, required: false, nullable: true, format: 'uuid' })
  roundId?: string | null;

  /** The handover it was raised on (origin handover) */
  @IsOptional()
  @IsUUID()
  @ApiProperty({ type: String, required: false, nullable: true, format: 'uuid' })
  handoverId?: string | null;

  /** Stored photos of this heading's rounds that show it */
  @Optional()
  @IsArray()
  @ArrayMaxSize(MAX_HAZARD_PHOTOS)
  @IsUUID('all', { each: true })
  @ApiProperty({ type: [String], required: false })
  photoIds?: string[];
}

/** Changes an open hazard (what, where, how serious, photos); the origin stays. */
export class UpdateHazardDto {
  @Optional()
  @IsIn(HAZARD_KINDS)
  @ApiProperty({ enum: HAZARD_KINDS, enumName: 'HazardKind', required: false })
  kind?: HazardKind;

  @Optional()
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give the chainage in metres.' })
  @Min(-999999)
  @Max(999999)
  fromChainage?: number;

  @Optional()
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give the chainage in metres.' })
  @Min(-999999)
  @Max(999999)
  toChainage?: number;

  @Optional()
  @IsIn(HAZARD_LEVELS)
  @ApiProperty({ enum: HAZARD_LEVELS, enumName: 'TriggerLevel', required: false })
  level?: TriggerLevel;

  @Optional()
  @IsString()
  @Length(3, 2000, { message: 'Say what the hazard is and where (3 to 2000 characters).' })
  description?: string;

  @Optional()
  @IsArray()
  @ArrayMaxSize(MAX_HAZARD_PHOTOS)
  @IsUUID('all', { each: true })
  @ApiProperty({ type: [String], required: false })
  photoIds?: string[];

  /** The version the change was made on (a stale one is refused with the current hazard) */
  @IsInt()
  @Min(1)
  version: number;
}

/** Closes a hazard: engineers, supervisors and admins, with the reason it no longer stands. */
export class CloseHazardDto {
  @IsString()
  @Length(3, 2000, { message: 'Say why the hazard is closed (3 to 2000 characters).' })
  reason: string;

  @IsInt()
  @Min(1)
  version: number;
}

export const HAZARD_LIST_STATUSES = ['open', 'closed', 'all'] as const;

export class HazardQueryDto {
  /** Which hazards to list (default all, open first) */
  @Optional()
  @IsIn(HAZARD_LIST_STATUSES)
  @ApiProperty({ enum: HAZARD_LIST_STATUSES, enumName: 'HazardListStatus', required: false })
  status?: (typeof HAZARD_LIST_STATUSES)[number];
}
