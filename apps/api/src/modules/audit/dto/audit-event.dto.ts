import { ApiProperty } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, IsString, IsUUID, Max, Min } from 'class-validator';

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
}

export class AuditQueryDto {
  @IsOptional()
  @IsString()
  entityType?: string;

  @IsOptional()
  @IsUUID()
  entityId?: string;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(500)
  limit?: number;
}
