import { ApiProperty, PartialType } from '@nestjs/swagger';
import { ALIGNMENT_SIDES } from '@roundbook/domain';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ValidateNested,
  ArrayMinSize,
  ArrayUnique,
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsNumber,
  IsOptional,
  IsString,
  Length,
  Matches,
  Max,
  Min,
  IsObject,
} from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';
import { CHAINAGE_SENSE_CODES, CHAINAGE_STYLES, PROFILE_SHAPES, STAGES } from '../heading.entity.js';

/** One segment of the alignment: a straight (no radius) or a circular arc turning left or right. */
export class AlignmentSegmentDto {
  /** Length along the alignment, metres */
  @IsNumber()
  @Min(0.1, { message: 'A segment is at least 0.1 m long.' })
  @Max(100000)
  length: number;

  /** Radius of an arc, metres; null for a straight */
  @IsOptional()
  @IsNumber()
  @Min(1, { message: 'An arc radius is at least 1 m.' })
  @Max(1000000)
  @ApiProperty({ type: Number, nullable: true })
  radius: number | null;

  /** Which side the arc turns to, looking in the drive direction; null for a straight */
  @IsOptional()
  @IsIn(ALIGNMENT_SIDES)
  @ApiProperty({ enum: ALIGNMENT_SIDES, enumName: 'AlignmentSide', nullable: true })
  side: (typeof ALIGNMENT_SIDES)[number] | null;
}

export class HeadingDto {
  id: string;
  projectId: string;
  code: string;
  name: string;
  /** Start chainage, metres */
  startChainage: number;
  @ApiProperty({ enum: CHAINAGE_STYLES, enumName: 'ChainageStyle' })
  chainageStyle: (typeof CHAINAGE_STYLES)[number];
  chainageDecimals: number;
  /** Drive direction, degrees clockwise from north */
  driveTrend: number;
  /** Gradient in per cent, positive rising in the direction of advance */
  gradientPercent: number;
  @ApiProperty({ enum: PROFILE_SHAPES, enumName: 'ProfileShape' })
  profileShape: (typeof PROFILE_SHAPES)[number];
  profileWidth: number;
  profileHeight: number;
  /** Height of the tunnel axis above the invert, metres */
  axisHeight: number;
  @ApiProperty({ enum: STAGES, enumName: 'Stage', isArray: true })
  stages: Array<(typeof STAGES)[number]>;
  plannedRoundLength: number;
  @ApiProperty({ type: Number, nullable: true })
  startEasting: number | null;
  @ApiProperty({ type: Number, nullable: true })
  startNorthing: number | null;
  @ApiProperty({ type: Number, nullable: true })
  startElevation: number | null;
  /** Whether chainage increases or decreases in the drive direction */
  // The four alignment fields are always sent; they are marked optional in the contract so that readers
  // written before them keep compiling (absent reads as: increasing, drive trend, one straight, axis).
  @ApiProperty({ enum: CHAINAGE_SENSE_CODES, enumName: 'ChainageSense', required: false })
  chainageSense?: (typeof CHAINAGE_SENSE_CODES)[number];
  /** Drive bearing at the start when a curve begins there; null: the drive trend */
  @ApiProperty({ type: Number, nullable: true, required: false })
  initialBearing?: number | null;
  /** Straights and arcs from the start, in the drive direction (empty: one straight) */
  @ApiProperty({ type: [AlignmentSegmentDto], required: false })
  alignmentSegments?: AlignmentSegmentDto[];
  /** Top of the bench above the invert, metres (staged profiles); null: at the axis */
  @ApiProperty({ type: Number, nullable: true, required: false })
  benchHeight?: number | null;
  version: number;
}

export class CreateHeadingDto {
  @IsString()
  @Matches(/^[A-Za-z0-9][A-Za-z0-9._-]{0,19}$/, {
    message: 'Use up to 20 letters, digits, dots, dashes or underscores.',
  })
  code: string;

  @IsString()
  @Length(1, 160, { message: 'Give the heading a name (up to 160 characters).' })
  name: string;

  @IsNumber({ maxDecimalPlaces: 3 }, { message: 'Start chainage is a number of metres, e.g. 1250.0.' })
  @Min(-99999)
  @Max(999999)
  startChainage: number;

  @Optional()
  @IsIn(CHAINAGE_STYLES)
  @ApiProperty({ enum: CHAINAGE_STYLES, enumName: 'ChainageStyle', required: false })
  chainageStyle?: (typeof CHAINAGE_STYLES)[number];

  @Optional()
  @IsInt()
  @Min(0)
  @Max(3)
  chainageDecimals?: number;

  @IsNumber({}, { message: 'Drive direction is an azimuth in degrees, 0 to less than 360.' })
  @Min(0, { message: 'Drive direction is an azimuth in degrees, 0 to less than 360.' })
  @Max(359.99, { message: 'Drive direction is an azimuth in degrees, 0 to less than 360.' })
  driveTrend: number;

  /** Per cent; −30 to 30 */
  @IsNumber()
  @Min(-30, { message: 'Gradients steeper than 30 % are outside what Roundbook handles.' })
  @Max(30, { message: 'Gradients steeper than 30 % are outside what Roundbook handles.' })
  gradientPercent: number;

  @IsIn(PROFILE_SHAPES)
  @ApiProperty({ enum: PROFILE_SHAPES, enumName: 'ProfileShape' })
  profileShape: (typeof PROFILE_SHAPES)[number];

  @IsNumber()
  @Min(1, { message: 'Width is 1 to 40 m.' })
  @Max(40, { message: 'Width is 1 to 40 m.' })
  profileWidth: number;

  @IsNumber()
  @Min(1, { message: 'Height is 1 to 40 m.' })
  @Max(40, { message: 'Height is 1 to 40 m.' })
  profileHeight: number;

  @IsNumber()
  @Min(0, { message: 'The axis lies between the invert and the crown.' })
  @Max(40)
  axisHeight: number;

  @IsArray()
  @ArrayMinSize(1, { message: 'Choose at least one stage.' })
  @ArrayUnique()
  @IsIn(STAGES, { each: true })
  @ApiProperty({ enum: STAGES, enumName: 'Stage', isArray: true })
  stages: Array<(typeof STAGES)[number]>;

  @IsNumber()
  @Min(0.3, { message: 'Planned round length is 0.3 to 8 m.' })
  @Max(8, { message: 'Planned round length is 0.3 to 8 m.' })
  plannedRoundLength: number;

  @IsOptional()
  @IsNumber({}, { message: 'startEasting is a number of metres.' })
  @Min(-99999999, { message: 'Grid coordinates are within ±99999999 m.' })
  @Max(99999999, { message: 'Grid coordinates are within ±99999999 m.' })
  startEasting?: number | null;

  @IsOptional()
  @IsNumber({}, { message: 'startNorthing is a number of metres.' })
  @Min(-99999999, { message: 'Grid coordinates are within ±99999999 m.' })
  @Max(99999999, { message: 'Grid coordinates are within ±99999999 m.' })
  startNorthing?: number | null;

  @IsOptional()
  @IsNumber({}, { message: 'startElevation is a number of metres.' })
  @Min(-99999, { message: 'Grid coordinates are within ±99999 m.' })
  @Max(99999, { message: 'Grid coordinates are within ±99999 m.' })
  startElevation?: number | null;

  @Optional()
  @IsIn(CHAINAGE_SENSE_CODES, {
    message: 'Chainage sense is increasing or decreasing (in the drive direction).',
  })
  @ApiProperty({ enum: CHAINAGE_SENSE_CODES, enumName: 'ChainageSense', required: false })
  chainageSense?: (typeof CHAINAGE_SENSE_CODES)[number];

  @IsOptional()
  @IsNumber({}, { message: 'Initial bearing is an azimuth in degrees, 0 to less than 360.' })
  @Min(0, { message: 'Initial bearing is an azimuth in degrees, 0 to less than 360.' })
  @Max(359.99, { message: 'Initial bearing is an azimuth in degrees, 0 to less than 360.' })
  @ApiProperty({ type: Number, nullable: true, required: false })
  initialBearing?: number | null;

  @Optional()
  @IsArray()
  @ArrayMaxSize(50)
  @IsObject({ each: true, message: 'Give each item as an object.' })
  @ValidateNested({ each: true })
  @Type(() => AlignmentSegmentDto)
  @ApiProperty({ type: [AlignmentSegmentDto], required: false })
  alignmentSegments?: AlignmentSegmentDto[];

  @IsOptional()
  @IsNumber()
  @Min(0.1, { message: 'The bench line lies above the invert.' })
  @Max(40)
  @ApiProperty({ type: Number, nullable: true, required: false })
  benchHeight?: number | null;
}

export class UpdateHeadingDto extends PartialType(CreateHeadingDto, { skipNullProperties: false }) {
  /** The version you last read; a stale version is refused with 409 STALE_VERSION */
  @IsInt()
  @Min(1)
  version: number;

  /** Required when the drive or profile changes after rounds exist (they are recomputed) */
  @Optional()
  @IsBoolean()
  confirmRecompute?: boolean;
}
