import { Controller, Get, Inject } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Public } from '../../common/auth/public.decorator.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { AppInfoDto } from './app-info.dto.js';

export const APP_VERSION = '0.1.0';

@ApiTags('config')
@Controller('config')
export class AppInfoController {
  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  /** What the web app needs to know before sign-in */
  @Public()
  @Get()
  @ApiOkResponse({ type: AppInfoDto })
  get(): AppInfoDto {
    return { localMode: this.config.localMode, version: APP_VERSION };
  }
}
