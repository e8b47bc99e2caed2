import { Controller, Get, Inject } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { CurrentUser } from '../../common/auth/current-user.decorator.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { isOperator } from '../users/operators.js';
import { LocalAccessDto } from './dto/local-access.dto.js';

@ApiTags('local-mail')
@ApiBearerAuth()
@Controller('local')
export class LocalAccessController {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  /** Whether the caller may open the local mail and jobs view (local mode and instance operator) */
  @Get('access')
  @ApiOkResponse({ type: LocalAccessDto })
  async access(@CurrentUser() user: AuthUser): Promise<LocalAccessDto> {
    const localMode = this.config.localMode && Boolean(this.config.mail.localInboxDir);
    return { localMode, operator: await isOperator(this.dataSource, user.id) };
  }
}
