import { ApiProperty, PartialType } from '@nestjs/swagger';
import { IsBoolean, IsIn, IsInt, IsNumber, IsOptional, IsString, Length, Max, Min } from 'class-validator';
import { PROJECT_ROLES } from '../../../common/auth/auth-user.js';
import { Optional } from '../../../common/dto/optional.js';
import { COMPARISONS, FIRES, LEVELS, WATCHED } from '../trigger-rule.entity.js';

export class TriggerRuleDto {
  id: string;
  @ApiProperty({ enum: WATCHED, enumName: 'WatchedQuantity' })
  watch: (typeof WATCHED)[number];
  @ApiProperty({ enum: COMPARISONS, enumName: 'Comparison', nullable: true })
  comparison: (typeof COMPARISONS)[number] | null;
  @ApiProperty({ type: Number, nullable: true })
  threshold: number | null;
  /**
   * How it fires: 'value' on the round's own value, 'change' on the change from the previous round of the
   * same heading and stage (Q in percent of the last Q, RMR89, inflow and overbreak in their unit; a yes/no
   * condition only when it newly appears)
   */
  @ApiProperty({ enum: FIRES, enumName: 'TriggerFires' })
  fires: (typeof FIRES)[number];
  @ApiProperty({ enum: LEVELS, enumName: 'TriggerLevel' })
  level: (typeof LEVELS)[number];
  action: string;
  @ApiProperty({ enum: PROJECT_ROLES, enumName: 'ProjectRole' })
  ownerRole: (typeof PROJECT_ROLES)[number];
  /** Time allowed to act, hours */
  timeAllowedHours: number;
  enabled: boolean;
  /** The rule in words, e.g. "Q < 0.1 → red" */
  summary: string;
  version: number;
}

export class CreateTriggerRuleDto {
  @IsIn(WATCHED)
  @ApiProperty({ enum: WATCHED, enumName: 'WatchedQuantity' })
  watch: (typeof WATCHED)[number];

  @IsOptional()
  @IsIn(COMPARISONS)
  @ApiProperty({ enum: COMPARISONS, enumName: 'Comparison', required: false, nullable: true })
  comparison?: (typeof COMPARISONS)[number] | null;

  @IsOptional()
  @IsNumber()
  @Min(-1e6)
  @Max(1e6)
  threshold?: number | null;

  /** How it fires (default 'value'); 'change' suits Q, RMR89, inflow, overbreak and the yes/no conditions that can newly appear */
  @Optional()
  @IsIn(FIRES, { message: "fires is 'value' or 'change'." })
  @ApiProperty({ enum: FIRES, enumName: 'TriggerFires', required: false })
  fires?: (typeof FIRES)[number];

  @IsIn(LEVELS)
  @ApiProperty({ enum: LEVELS, enumName: 'TriggerLevel' })
  level: (typeof LEVELS)[number];

  @IsString()
  @Length(3, 2000, { message: 'Say what is to be done when the rule fires.' })
  action: string;

  @IsIn(PROJECT_ROLES)
  @ApiProperty({ enum: PROJECT_ROLES, enumName: 'ProjectRole' })
  ownerRole: (typeof PROJECT_ROLES)[number];

  @IsNumber()
  @Min(0, { message: 'Time allowed is 0 to 720 hours.' })
  @Max(720, { message: 'Time allowed is 0 to 720 hours.' })
  timeAllowedHours: number;

  @Optional()
  @IsBoolean()
  enabled?: boolean;
}

export class UpdateTriggerRuleDto extends PartialType(CreateTriggerRuleDto, { skipNullProperties: false }) {
  @IsInt()
  @Min(1)
  version: number;
}

export class TriggerPreviewMatchDto {
  roundId: string;
  headingCode: string;
  roundNumber: number;
  stage: string;
  faceChainage: number;
  shiftDate: string;
  @ApiProperty({ type: Number, nullable: true })
  value: number | null;
  /** Why the rule fires on this round, in words */
  detail: string;
}

export class TriggerPreviewDto {
  /** How many of the project's latest rounds were checked */
  evaluatedRounds: number;
  matches: TriggerPreviewMatchDto[];
  /** Set when the rule cannot be checked against records yet, with the reason */
  @ApiProperty({ type: String, nullable: true })
  notEvaluated: string | null;
}
