import { Body, Controller, Get, Inject, Param, Put } from '@nestjs/common';
import { ApiBadRequestResponse, ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { NoticeSettingsDto, UpdateNoticeSettingsDto } from './dto/notice-settings.dto.js';
import { NoticeSettingsService } from './notice-settings.service.js';

@ApiTags('notice-settings')
@ApiBearerAuth()
@Controller('projects/:projectId/notice-settings')
export class NoticeSettingsController {
  constructor(@Inject(NoticeSettingsService) private readonly settings: NoticeSettingsService) {}

  /** Which review notices the caller receives in this project (any member; their own choice only) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: NoticeSettingsDto })
  get(
    @Param('projectId') _p: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<NoticeSettingsDto> {
    return this.settings.get(user, access);
  }

  /** Sets which review notices the caller receives in this project; red notices cannot be switched off */
  @Put()
  @ProjectRoles()
  @ApiOkResponse({ type: NoticeSettingsDto })
  @ApiBadRequestResponse({ type: ErrorResponseDto, description: 'Red notices cannot be switched off' })
  update(
    @Param('projectId') _p: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: UpdateNoticeSettingsDto,
  ): Promise<NoticeSettingsDto> {
    return this.settings.update(user, access, body);
  }
}
