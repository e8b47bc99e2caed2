import { ApiProperty } from '@nestjs/swagger';

export class ComponentHealthDto {
  ok: boolean;
  /** What was checked, or why it failed */
  detail: string;
}

export class HealthDto {
  @ApiProperty({ enum: ['ok', 'degraded'], enumName: 'HealthStatus' })
  status: 'ok' | 'degraded';
  database: ComponentHealthDto;
  storage: ComponentHealthDto;
  mail: ComponentHealthDto;
}
