import { ApiProperty } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsIn,
  IsInt,
  IsNumber,
  IsOptional,
  IsPositive,
  IsString,
  Length,
  Max,
  MaxLength,
  Min,
  ValidateIf,
  ValidateNested,
  IsObject,
} from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';
import {
  FACE_PARTS,
  UPLOAD_STATES,
  VARIANT_STATES,
  type FacePart,
  type UploadState,
  type VariantState,
} from '../photo.entity.js';

export const PHOTO_VARIANTS = ['original', 'display', 'thumbnail'] as const;
export type PhotoVariant = (typeof PHOTO_VARIANTS)[number];

/** A point on the photo as fractions of its upright width (x, from the left) and height (y, from the top). */
export class PhotoPointDto {
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give x as a number from 0 to 1.' })
  @Min(0, { message: 'x is a fraction of the photo width, from 0 to 1.' })
  @Max(1, { message: 'x is a fraction of the photo width, from 0 to 1.' })
  x: number;

  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give y as a number from 0 to 1.' })
  @Min(0, { message: 'y is a fraction of the photo height, from 0 to 1.' })
  @Max(1, { message: 'y is a fraction of the photo height, from 0 to 1.' })
  y: number;
}

/** A scale on the photo: two marked points and the known distance between them. */
export class PhotoScaleDto {
  @IsObject({ message: 'Give the first point as { x, y }.' })
  @ValidateNested()
  @Type(() => PhotoPointDto)
  a: PhotoPointDto;

  @IsObject({ message: 'Give the second point as { x, y }.' })
  @ValidateNested()
  @Type(() => PhotoPointDto)
  b: PhotoPointDto;

  /** metres between the two points */
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give the distance in metres.' })
  @IsPositive({ message: 'The distance between the two points must be more than 0 m.' })
  @Max(1000, { message: 'The distance between the two points can be at most 1000 m.' })
  distanceM: number;
}

/** A photo as the app shows it. */
export class PhotoDto {
  id: string;
  roundId: string;
  @ApiProperty({ enum: UPLOAD_STATES, enumName: 'PhotoUploadState' })
  uploadState: UploadState;
  @ApiProperty({ enum: VARIANT_STATES, enumName: 'PhotoVariantState' })
  variantState: VariantState;
  contentType: string;
  /** bytes */
  size: number;
  originalName: string;
  caption: string;
  @ApiProperty({ enum: FACE_PARTS, enumName: 'FacePart', nullable: true })
  facePart: FacePart | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true })
  takenAt: string | null;
  uploadedBy: string;
  @ApiProperty({ type: String, nullable: true })
  uploadedByName: string | null;
  @ApiProperty({ type: Number, nullable: true })
  pinX: number | null;
  @ApiProperty({ type: Number, nullable: true })
  pinY: number | null;
  @ApiProperty({ type: PhotoScaleDto, nullable: true })
  scale: PhotoScaleDto | null;
  @ApiProperty({ type: Number, nullable: true })
  width: number | null;
  @ApiProperty({ type: Number, nullable: true })
  height: number | null;
  @ApiProperty({ type: String, format: 'date-time' })
  createdAt: string;
}

/** Asks to start an upload: what the browser knows of the file. */
export class CreatePhotoUploadDto {
  /** The file's name on the device (shown, never used in a storage key) */
  @IsString()
  @Length(1, 255)
  fileName: string;

  /** The type the browser reports; the stored bytes are checked again on completion */
  @IsString()
  @MaxLength(100)
  contentType: string;

  /** bytes */
  @IsInt()
  @Min(1, { message: 'The file is empty.' })
  size: number;
}

/** A started upload: send `partCount` parts of `partSize` bytes (the last one shorter), then complete. */
export class PhotoUploadDto {
  photo: PhotoDto;
  partSize: number;
  partCount: number;
  /** Largest accepted file, bytes */
  maxBytes: number;
}

export class UploadedPartDto {
  @IsInt()
  @Min(1)
  @Max(10000)
  partNumber: number;

  @IsString()
  @Length(1, 200)
  etag: string;
}

export class CompletePhotoUploadDto {
  @IsArray()
  @ArrayMinSize(1)
  @ArrayMaxSize(10000)
  @IsObject({ each: true, message: 'Give each part as an object.' })
  @ValidateNested({ each: true })
  @Type(() => UploadedPartDto)
  parts: UploadedPartDto[];
}

/** Caption, part of the face and pin; null clears. */
export class UpdatePhotoDto {
  @Optional()
  @IsString()
  @MaxLength(500)
  caption?: string;

  @ApiProperty({ enum: FACE_PARTS, enumName: 'FacePart', nullable: true, required: false })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsIn(FACE_PARTS, { message: `Choose one of: ${FACE_PARTS.join(', ')}.` })
  facePart?: FacePart | null;

  @ApiProperty({ type: Number, nullable: true, required: false })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsNumber()
  @Min(-1000)
  @Max(1000)
  pinX?: number | null;

  @ApiProperty({ type: Number, nullable: true, required: false })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsNumber()
  @Min(-1000)
  @Max(1000)
  pinY?: number | null;

  /** The scale marked on the photo; null removes it */
  @ApiProperty({ type: PhotoScaleDto, nullable: true, required: false })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsObject({ message: 'Give the scale as { a, b, distanceM }, or null to remove it.' })
  @ValidateNested()
  @Type(() => PhotoScaleDto)
  scale?: PhotoScaleDto | null;
}

export class PhotoUrlQueryDto {
  @ApiProperty({ enum: PHOTO_VARIANTS, enumName: 'PhotoVariant', required: false })
  @IsOptional()
  @IsIn(PHOTO_VARIANTS, { message: `Choose one of: ${PHOTO_VARIANTS.join(', ')}.` })
  variant?: PhotoVariant;
}

/** A short-lived signed address of one size of the photo. */
export class PhotoUrlDto {
  url: string;
  /** The size served: the original while the smaller ones are being made */
  @ApiProperty({ enum: PHOTO_VARIANTS, enumName: 'PhotoVariant' })
  variant: PhotoVariant;
  @ApiProperty({ type: String, format: 'date-time' })
  expiresAt: string;
}

export class UploadedPartResultDto {
  partNumber: number;
  etag: string;
}
