// The Q and RMR89 inputs as typed, validated at the edge (issue 9 item 8): every key named, every number
// bounded (loosely: a value outside the Q tables is kept and the assessment says why it cannot be rated), each choice a discriminated union (oneOf in OpenAPI). Numbers may be null while a draft is being
// filled in; the assessment then says what is missing. Unknown keys are refused by the global pipe.
import { ApiExtraModels, ApiProperty, getSchemaPath } from '@nestjs/swagger';
import {
  RMR89_CONDITION_SIMPLE,
  RMR89_ROUGHNESS,
  RMR89_WATER_CONDITION,
  RMR89_WEATHERING,
  RMR_TUNNEL_ADJUSTMENT,
} from '@roundbook/geomath';
import { Type } from 'class-transformer';
import {
  Equals,
  IsBoolean,
  IsIn,
  IsNumber,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  ValidateNested,
  IsObject,
} from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';

const SIMPLE_CONDITIONS = RMR89_CONDITION_SIMPLE.map((c) => c.id);
const ROUGHNESS = Object.keys(RMR89_ROUGHNESS);
const WEATHERING = Object.keys(RMR89_WEATHERING);
const WATER_CONDITIONS = Object.keys(RMR89_WATER_CONDITION);
const ASSESSMENTS = Object.keys(RMR_TUNNEL_ADJUSTMENT);
const Q_LOCATIONS = ['tunnel', 'intersection', 'portal'] as const;

/** A number that may be left empty (null) while the draft is filled in. */
function OptionalNumber(min: number, max: number, message?: string): PropertyDecorator {
  return (target, key) => {
    IsOptional()(target, key);
    IsNumber({ allowNaN: false, allowInfinity: false })(target, key);
    Min(min, message ? { message } : undefined)(target, key);
    Max(max, message ? { message } : undefined)(target, key);
    ApiProperty({ type: Number, nullable: true, minimum: min, maximum: max })(target, key);
  };
}

/** The table row chosen for each Q parameter (several rows can share a value). */
export class QRowsDto {
  @IsOptional() @IsString() @MaxLength(40) rqd?: string;
  @IsOptional() @IsString() @MaxLength(40) jn?: string;
  @IsOptional() @IsString() @MaxLength(40) jr?: string;
  @IsOptional() @IsString() @MaxLength(40) ja?: string;
  @IsOptional() @IsString() @MaxLength(40) jw?: string;
  @IsOptional() @IsString() @MaxLength(40) srf?: string;
}

/** Q-system inputs (Barton et al. 1974; table values checked by packages/geomath). */
export class QInputDto {
  @OptionalNumber(0, 100, 'RQD is 0–100 %.')
  rqd: number | null;

  @OptionalNumber(0, 1000, 'Jn is a table value (0.5–20); Roundbook stores up to 1000.')
  jn: number | null;

  @OptionalNumber(
    0,
    1000,
    'Jr is a table value (0.5–4, +1 for spacing over 3 m); Roundbook stores up to 1000.',
  )
  jr: number | null;

  @OptionalNumber(0, 1000, 'Ja is a table value (0.75–20); Roundbook stores up to 1000.')
  ja: number | null;

  @OptionalNumber(0, 1000, 'Jw is a table value (0.05–1); Roundbook stores up to 1000.')
  jw: number | null;

  @OptionalNumber(0, 1000, 'SRF is a table value (0.5–400); Roundbook stores up to 1000.')
  srf: number | null;

  @Optional()
  @IsIn(Q_LOCATIONS)
  @ApiProperty({ enum: Q_LOCATIONS, enumName: 'QLocation', required: false })
  location?: (typeof Q_LOCATIONS)[number];

  @Optional()
  @IsBoolean()
  jrSpacingOver3m?: boolean;

  @Optional()
  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => QRowsDto)
  rows?: QRowsDto;

  /** True when the RQD came from Jv (a correlation) rather than a measurement */
  @Optional()
  @IsBoolean()
  rqdFromJv?: boolean;

  /** The joint (by id) whose Jr and Ja govern: the weakest significant discontinuity of the round */
  @IsOptional()
  @IsUUID()
  @ApiProperty({ type: String, format: 'uuid', nullable: true, required: false })
  governingJointId?: string | null;

  /** Or the set (by label) whose Jr and Ja govern */
  @IsOptional()
  @IsString()
  @MaxLength(20)
  @ApiProperty({ type: String, nullable: true, required: false })
  governingSetLabel?: string | null;

  /** True when random joints are present besides the sets (Jn is checked against sets + random) */
  @Optional()
  @IsBoolean()
  randomJoints?: boolean;
}

export class PointLoadStrengthDto {
  @Equals('point-load')
  @ApiProperty({ enum: ['point-load'] })
  kind: 'point-load';
  /** Point-load index Is50, MPa */
  @OptionalNumber(0, 30)
  is50: number | null;
}
export class UcsStrengthDto {
  @Equals('ucs')
  @ApiProperty({ enum: ['ucs'] })
  kind: 'ucs';
  /** Uniaxial compressive strength, MPa */
  @OptionalNumber(0, 1000)
  ucs: number | null;
}

export class SimpleConditionDto {
  @Equals('simple')
  @ApiProperty({ enum: ['simple'] })
  kind: 'simple';
  @IsOptional()
  @IsIn(SIMPLE_CONDITIONS)
  @ApiProperty({ enum: SIMPLE_CONDITIONS, enumName: 'Rmr89SimpleCondition', nullable: true })
  condition: string | null;
}

export class NoInfillingDto {
  @Equals('none')
  @ApiProperty({ enum: ['none'] })
  kind: 'none';
}
export class InfillingDto {
  @IsIn(['hard', 'soft'])
  @ApiProperty({ enum: ['hard', 'soft'] })
  kind: 'hard' | 'soft';
  @OptionalNumber(0, 5000)
  thicknessMm: number | null;
}

export class DetailedConditionDto {
  @Equals('detailed')
  @ApiProperty({ enum: ['detailed'] })
  kind: 'detailed';
  @OptionalNumber(0, 1000)
  persistenceM: number | null;
  @OptionalNumber(0, 5000)
  separationMm: number | null;
  @IsOptional()
  @IsIn(ROUGHNESS)
  @ApiProperty({ enum: ROUGHNESS, enumName: 'Rmr89Roughness', nullable: true })
  roughness: string | null;
  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => NoInfillingDto, {
    discriminator: {
      property: 'kind',
      subTypes: [
        { value: NoInfillingDto, name: 'none' },
        { value: InfillingDto, name: 'hard' },
        { value: InfillingDto, name: 'soft' },
      ],
    },
    keepDiscriminatorProperty: true,
  })
  @ApiProperty({ oneOf: [{ $ref: getSchemaPath(NoInfillingDto) }, { $ref: getSchemaPath(InfillingDto) }] })
  infilling: NoInfillingDto | InfillingDto;
  @IsOptional()
  @IsIn(WEATHERING)
  @ApiProperty({ enum: WEATHERING, enumName: 'Rmr89Weathering', nullable: true })
  weathering: string | null;
}

export class InflowGroundwaterDto {
  @Equals('inflow')
  @ApiProperty({ enum: ['inflow'] })
  kind: 'inflow';
  /** Inflow per 10 m of tunnel, l/min */
  @OptionalNumber(0, 100000)
  litresPerMinutePer10m: number | null;
}
export class PressureGroundwaterDto {
  @Equals('pressure-ratio')
  @ApiProperty({ enum: ['pressure-ratio'] })
  kind: 'pressure-ratio';
  @OptionalNumber(0, 10)
  ratio: number | null;
}
export class ConditionGroundwaterDto {
  @Equals('condition')
  @ApiProperty({ enum: ['condition'] })
  kind: 'condition';
  @IsOptional()
  @IsIn(WATER_CONDITIONS)
  @ApiProperty({ enum: WATER_CONDITIONS, enumName: 'Rmr89WaterCondition', nullable: true })
  condition: string | null;
}

export class AssessedOrientationDto {
  @Equals('assessment')
  @ApiProperty({ enum: ['assessment'] })
  kind: 'assessment';
  @IsIn(ASSESSMENTS)
  @ApiProperty({ enum: ASSESSMENTS, enumName: 'RmrOrientationAssessment' })
  assessment: string;
}
export class NotAssessedOrientationDto {
  @Equals('not assessed')
  @ApiProperty({ enum: ['not assessed'] })
  kind: 'not assessed';
}

/** RMR89 inputs (Bieniawski 1989, Table 4.1), the orientation adjustment as an assessment or not assessed. */
@ApiExtraModels(
  PointLoadStrengthDto,
  UcsStrengthDto,
  SimpleConditionDto,
  DetailedConditionDto,
  NoInfillingDto,
  InfillingDto,
  InflowGroundwaterDto,
  PressureGroundwaterDto,
  ConditionGroundwaterDto,
  AssessedOrientationDto,
  NotAssessedOrientationDto,
)
export class RmrInputDto {
  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => PointLoadStrengthDto, {
    discriminator: {
      property: 'kind',
      subTypes: [
        { value: PointLoadStrengthDto, name: 'point-load' },
        { value: UcsStrengthDto, name: 'ucs' },
      ],
    },
    keepDiscriminatorProperty: true,
  })
  @ApiProperty({
    oneOf: [{ $ref: getSchemaPath(PointLoadStrengthDto) }, { $ref: getSchemaPath(UcsStrengthDto) }],
  })
  strength: PointLoadStrengthDto | UcsStrengthDto;

  @OptionalNumber(0, 100, 'RQD is 0–100 %.')
  rqd: number | null;

  /** Mean spacing of the discontinuities, m */
  @OptionalNumber(0, 100)
  spacingM: number | null;

  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => SimpleConditionDto, {
    discriminator: {
      property: 'kind',
      subTypes: [
        { value: SimpleConditionDto, name: 'simple' },
        { value: DetailedConditionDto, name: 'detailed' },
      ],
    },
    keepDiscriminatorProperty: true,
  })
  @ApiProperty({
    oneOf: [{ $ref: getSchemaPath(SimpleConditionDto) }, { $ref: getSchemaPath(DetailedConditionDto) }],
  })
  condition: SimpleConditionDto | DetailedConditionDto;

  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => InflowGroundwaterDto, {
    discriminator: {
      property: 'kind',
      subTypes: [
        { value: InflowGroundwaterDto, name: 'inflow' },
        { value: PressureGroundwaterDto, name: 'pressure-ratio' },
        { value: ConditionGroundwaterDto, name: 'condition' },
      ],
    },
    keepDiscriminatorProperty: true,
  })
  @ApiProperty({
    oneOf: [
      { $ref: getSchemaPath(InflowGroundwaterDto) },
      { $ref: getSchemaPath(PressureGroundwaterDto) },
      { $ref: getSchemaPath(ConditionGroundwaterDto) },
    ],
  })
  groundwater: InflowGroundwaterDto | PressureGroundwaterDto | ConditionGroundwaterDto;

  @IsObject({ message: 'Give an object here.' })
  @ValidateNested()
  @Type(() => AssessedOrientationDto, {
    discriminator: {
      property: 'kind',
      subTypes: [
        { value: AssessedOrientationDto, name: 'assessment' },
        { value: NotAssessedOrientationDto, name: 'not assessed' },
      ],
    },
    keepDiscriminatorProperty: true,
  })
  @ApiProperty({
    oneOf: [
      { $ref: getSchemaPath(AssessedOrientationDto) },
      { $ref: getSchemaPath(NotAssessedOrientationDto) },
    ],
  })
  orientation: AssessedOrientationDto | NotAssessedOrientationDto;
}
