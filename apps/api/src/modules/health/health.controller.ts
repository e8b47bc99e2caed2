import { Controller, Get, Header, Inject, Res, UseGuards } from '@nestjs/common';
import { ApiOkResponse, ApiServiceUnavailableResponse, ApiTags } from '@nestjs/swagger';
import { SkipThrottle, ThrottlerGuard } from '@nestjs/throttler';
import type { Response } from 'express';
import { Public } from '../../common/auth/public.decorator.js';
import { HealthDto, LivenessDto } from './health.dto.js';
import { HealthService } from './health.service.js';

@ApiTags('health')
@Controller('health')
@Public()
@UseGuards(ThrottlerGuard)
@SkipThrottle({ login: true })
export class HealthController {
  constructor(@Inject(HealthService) private readonly health: HealthService) {}

  /** Readiness: database, object storage and mail transport (checks cached a few seconds); 503 when any fails */
  @Get()
  @Header('Cache-Control', 'no-store')
  @ApiOkResponse({ type: HealthDto })
  @ApiServiceUnavailableResponse({ type: HealthDto })
  async get(@Res({ passthrough: true }) res: Response): Promise<HealthDto> {
    const result = await this.health.check();
    if (result.status !== 'ok') res.status(503).setHeader('Retry-After', '10');
    return result;
  }

  /** Liveness: the process answers. Touches no database, storage or mail. */
  @Get('live')
  @Header('Cache-Control', 'no-store')
  @ApiOkResponse({ type: LivenessDto })
  live(): LivenessDto {
    return { status: 'ok' };
  }
}
