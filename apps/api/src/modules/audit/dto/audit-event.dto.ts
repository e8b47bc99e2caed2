import { ApiProperty } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsString, IsUUID, Max, Min } from 'class-validator';
import { Optional } from '../../../common/dto/optional.js';

export class AuditEventDto {
  id: string;
  entityType: string;
  entityId: string;
  action: string;
  @ApiProperty({ type: 'object', additionalProperties: true, nullable: true })
  before: Record<string, unknown> | null;
  @ApiProperty({ type: 'object', additionalProperties: true, nullable: true })
  after: Record<string, unknown> | null;
  @ApiProperty({ type: String, nullable: true })
  actorId: string | null;
  /** The person's name, kept even after they left the project */
  actorName: string;
  at: string;
  /** For an autosave run held as one event: the time of its last save (null for a single change) */
  @ApiProperty({ type: String, nullable: true })
  lastAt: string | null;
  /** Saves of the run beyond the first (0 for a single change) */
  coalesced: number;
}

export class AuditQueryDto {
  @Optional()
  @IsString()
  entityType?: string;

  @Optional()
  @IsUUID()
  entityId?: string;

  @Optional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(500)
  limit?: number;
}
