import { ApiProperty } from '@nestjs/swagger';

export class ComponentHealthDto {
  ok: boolean;
  /** `answering`, or that it is not (the reason is in the server log) */
  detail: string;
}

export class HealthDto {
  @ApiProperty({ enum: ['ok', 'degraded'], enumName: 'HealthStatus' })
  status: 'ok' | 'degraded';
  /** When the checks ran (they are cached a few seconds) */
  checkedAt: string;
  database: ComponentHealthDto;
  storage: ComponentHealthDto;
  mail: ComponentHealthDto;
}

export class LivenessDto {
  @ApiProperty({ enum: ['ok'] })
  status: 'ok';
}
