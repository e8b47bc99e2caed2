import { ApiProperty } from '@nestjs/swagger';
import {
  SUPPORT_ELEMENTS,
  SUPPORT_ITEM_STATUSES,
  SUPPORT_UNITS,
  type SupportElement,
  type SupportItemStatus,
  type SupportUnit,
} from '@roundbook/domain';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsIn,
  IsInt,
  IsISO8601,
  IsNumber,
  IsObject,
  IsOptional,
  IsString,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';

/** What the round's confirmed class plans for one element. */
export class PlannedSupportDto {
  /** The class names this element */
  inClass: boolean;
  /** A planned quantity in the element's unit, when the class gives one (sprayed concrete's thickness) */
  @ApiProperty({ type: Number, nullable: true })
  quantity: number | null;
  /** A planned length, m (bolts) */
  @ApiProperty({ type: Number, nullable: true })
  length: number | null;
  /** The class's own words for it (bolt type and pattern, the steel support) */
  text: string;
}

/** One line of the checklist: planned (from the class) against installed. */
export class SupportItemDto {
  @ApiProperty({ enum: SUPPORT_ELEMENTS, enumName: 'SupportElement' })
  element: SupportElement;
  @ApiProperty({ enum: SUPPORT_UNITS, enumName: 'SupportUnit' })
  unit: SupportUnit;
  /** Whether the item carries a length in metres */
  hasLength: boolean;
  planned: PlannedSupportDto;
  @ApiProperty({ enum: SUPPORT_ITEM_STATUSES, enumName: 'SupportItemStatus' })
  status: SupportItemStatus;
  /** Installed quantity in the unit; null when nothing is installed yet */
  @ApiProperty({ type: Number, nullable: true })
  quantity: number | null;
  /** Installed length, m */
  @ApiProperty({ type: Number, nullable: true })
  length: number | null;
  /** Why it is not needed, or a note on an outstanding item */
  reason: string;
  /** Who recorded the item's last change */
  @ApiProperty({ type: String, nullable: true })
  installedBy: string | null;
  @ApiProperty({ type: String, nullable: true })
  installedByName: string | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true })
  installedAt: string | null;
}

/** Support as built for one round: the checklist, prefilled from the confirmed class until it is saved. */
export class SupportRecordDto {
  roundId: string;
  headingId: string;
  roundNumber: number;
  /** Support is recorded once the round is confirmed; before that the checklist is not offered */
  confirmed: boolean;
  @ApiProperty({ type: String, nullable: true, format: 'uuid' })
  classId: string | null;
  @ApiProperty({ type: String, nullable: true })
  classCode: string | null;
  @ApiProperty({ type: String, nullable: true })
  className: string | null;
  /** False while the checklist is only the class's plan (nothing saved yet) */
  recorded: boolean;
  /** The record's version (0 before the first save); send it back with the change */
  version: number;
  @ApiProperty({ type: String, format: 'date-time', nullable: true })
  updatedAt: string | null;
  @ApiProperty({ type: String, nullable: true })
  updatedByName: string | null;
  @ApiProperty({ type: [SupportItemDto] })
  items: SupportItemDto[];
  /** How many items are outstanding */
  outstandingCount: number;
}

/** One item as the supervisor records it. */
export class SupportItemInputDto {
  @IsIn(SUPPORT_ELEMENTS)
  @ApiProperty({ enum: SUPPORT_ELEMENTS, enumName: 'SupportElement' })
  element: SupportElement;

  @IsIn(SUPPORT_ITEM_STATUSES)
  @ApiProperty({ enum: SUPPORT_ITEM_STATUSES, enumName: 'SupportItemStatus' })
  status: SupportItemStatus;

  /** Installed quantity in the element's unit (count, mm or m²); null when nothing is installed */
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give the quantity as a number.' })
  @Min(0, { message: 'A quantity is 0 or more.' })
  @Max(100000, { message: 'That quantity is far more than one round takes; check the figure.' })
  @ApiProperty({ type: Number, nullable: true, minimum: 0, maximum: 100000 })
  quantity: number | null;

  /** Installed length, m (bolts, spiles, probe holes); null otherwise */
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give the length in metres.' })
  @Min(0, { message: 'A length is more than 0 m.' })
  @Max(1000, { message: 'That length is far more than a round takes; check the figure.' })
  @ApiProperty({ type: Number, nullable: true, minimum: 0, maximum: 1000 })
  length: number | null;

  /** Why it is not needed (required then), or a note on an outstanding item */
  @IsString()
  @MaxLength(1000)
  reason: string;

  /** When it was installed (defaults to the time of the save when the item changes) */
  @Optional()
  @IsISO8601({ strict: true }, { message: 'Give the time as an ISO 8601 date and time.' })
  @ApiProperty({ type: String, format: 'date-time', required: false })
  installedAt?: string;
}

/** The whole checklist of a round, with the version it was read at (0 for the first save). */
export class SaveSupportRecordDto {
  /** The record's version as read (0 when nothing was recorded yet); 409 STALE_VERSION if it changed */
  @IsInt()
  @Min(0)
  @Max(1_000_000)
  version: number;

  @IsArray()
  @ArrayMinSize(1, { message: 'Send the checklist’s items.' })
  @ArrayMaxSize(SUPPORT_ELEMENTS.length)
  @IsObject({
    each: true,
    message: 'Each item is an object with element, status, quantity, length and reason.',
  })
  @ValidateNested({ each: true })
  @Type(() => SupportItemInputDto)
  @ApiProperty({ type: [SupportItemInputDto], minItems: 1, maxItems: SUPPORT_ELEMENTS.length })
  items: SupportItemInputDto[];
}
