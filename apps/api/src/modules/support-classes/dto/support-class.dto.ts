import { ApiProperty, PartialType } from '@nestjs/swagger';
import {
  ArrayUnique,
  IsArray,
  IsBoolean,
  IsInt,
  IsNumber,
  IsOptional,
  IsString,
  IsUUID,
  Length,
  Matches,
  Max,
  Min,
} from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';

export class SupportClassDto {
  id: string;
  code: string;
  name: string;
  /** 1 = best ground */
  sortOrder: number;
  /** Q range [qMin, qMax); null = open */
  @ApiProperty({ type: Number, nullable: true })
  qMin: number | null;
  @ApiProperty({ type: Number, nullable: true })
  qMax: number | null;
  /** RMR89 range [rmrMin, rmrMax], whole numbers; null = open */
  @ApiProperty({ type: Number, nullable: true })
  rmrMin: number | null;
  @ApiProperty({ type: Number, nullable: true })
  rmrMax: number | null;
  maxRoundLength: number;
  boltType: string;
  @ApiProperty({ type: Number, nullable: true })
  boltLength: number | null;
  boltPattern: string;
  /** Sprayed concrete, mm (0 = none) */
  shotcreteMm: number;
  steelSupport: string;
  probingRequired: boolean;
  notes: string;
  retired: boolean;
  version: number;
}

export class RangeWarningDto {
  @ApiProperty({ enum: ['overlap', 'gap', 'order'], enumName: 'RangeWarningKind' })
  kind: 'overlap' | 'gap' | 'order';
  @ApiProperty({ enum: ['Q', 'RMR89'], enumName: 'RatingSystem' })
  system: 'Q' | 'RMR89';
  classes: string[];
  message: string;
}

export class SupportClassLibraryDto {
  classes: SupportClassDto[];
  /** Overlaps, gaps and order problems in the active classes' ranges */
  warnings: RangeWarningDto[];
}

export class CreateSupportClassDto {
  @IsString()
  @Matches(/^[A-Za-z0-9][A-Za-z0-9._/-]{0,19}$/, {
    message: 'Use up to 20 letters, digits, dots, slashes or dashes.',
  })
  code: string;

  @IsString()
  @Length(1, 120, { message: 'Give the class a name (up to 120 characters).' })
  name: string;

  @IsOptional()
  @IsNumber()
  @Min(0.001, { message: 'Q runs from 0.001 to 1000.' })
  @Max(1000, { message: 'Q runs from 0.001 to 1000.' })
  qMin?: number | null;

  @IsOptional()
  @IsNumber()
  @Min(0.001, { message: 'Q runs from 0.001 to 1000.' })
  @Max(1000, { message: 'Q runs from 0.001 to 1000.' })
  qMax?: number | null;

  @IsOptional()
  @IsInt({ message: 'RMR89 is a whole number, 0 to 100.' })
  @Min(0)
  @Max(100)
  rmrMin?: number | null;

  @IsOptional()
  @IsInt({ message: 'RMR89 is a whole number, 0 to 100.' })
  @Min(0)
  @Max(100)
  rmrMax?: number | null;

  @IsNumber()
  @Min(0.3, { message: 'Maximum round length is 0.3 to 8 m.' })
  @Max(8, { message: 'Maximum round length is 0.3 to 8 m.' })
  maxRoundLength: number;

  @Optional()
  @IsString()
  @Length(0, 120)
  boltType?: string;

  @IsOptional()
  @IsNumber()
  @Min(0.5)
  @Max(20)
  boltLength?: number | null;

  @Optional()
  @IsString()
  @Length(0, 120)
  boltPattern?: string;

  @Optional()
  @IsInt()
  @Min(0)
  @Max(1000)
  shotcreteMm?: number;

  @Optional()
  @IsString()
  @Length(0, 160)
  steelSupport?: string;

  @Optional()
  @IsBoolean()
  probingRequired?: boolean;

  @Optional()
  @IsString()
  @Length(0, 4000)
  notes?: string;
}

export class UpdateSupportClassDto extends PartialType(CreateSupportClassDto, { skipNullProperties: false }) {
  @Optional()
  @IsBoolean()
  retired?: boolean;

  /** The version you last read */
  @IsInt()
  @Min(1)
  version: number;
}

export class ReorderSupportClassesDto {
  /** Every class id of the project, best ground first */
  @IsArray()
  @ArrayUnique()
  @IsUUID('all', { each: true })
  ids: string[];
}
