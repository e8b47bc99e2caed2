import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Inject,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
} from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import {
  CreateTriggerRuleDto,
  TriggerPreviewDto,
  TriggerRuleDto,
  UpdateTriggerRuleDto,
} from './dto/trigger-rule.dto.js';
import { TriggerRulesService } from './trigger-rules.service.js';

@ApiTags('trigger-rules')
@ApiBearerAuth()
@Controller('projects/:projectId/trigger-rules')
export class TriggerRulesController {
  constructor(@Inject(TriggerRulesService) private readonly rules: TriggerRulesService) {}

  /** The project's trigger rules, red first (any member) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: [TriggerRuleDto] })
  list(@Param('projectId') _p: string, @CurrentAccess() access: ProjectAccess): Promise<TriggerRuleDto[]> {
    return this.rules.list(access);
  }

  /** Adds a rule (admins and engineers) */
  @Post()
  @ProjectRoles('admin', 'engineer')
  @ApiCreatedResponse({ type: TriggerRuleDto })
  create(
    @Param('projectId') _p: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: CreateTriggerRuleDto,
  ): Promise<TriggerRuleDto> {
    return this.rules.create(user, access, body);
  }

  /** How a rule (saved or not) would fire on the project's latest rounds (admins and engineers) */
  @Post('preview')
  @HttpCode(200)
  @ProjectRoles('admin', 'engineer')
  @ApiOkResponse({ type: TriggerPreviewDto })
  preview(
    @Param('projectId') _p: string,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: CreateTriggerRuleDto,
  ): Promise<TriggerPreviewDto> {
    return this.rules.preview(access, body);
  }

  /** Changes a rule (admins and engineers) */
  @Patch(':ruleId')
  @ProjectRoles('admin', 'engineer')
  @ApiOkResponse({ type: TriggerRuleDto })
  update(
    @Param('projectId') _p: string,
    @Param('ruleId', ParseUUIDPipe) ruleId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: UpdateTriggerRuleDto,
  ): Promise<TriggerRuleDto> {
    return this.rules.update(user, access, ruleId, body);
  }

  /** Deletes a rule (admins and engineers) */
  @Delete(':ruleId')
  @HttpCode(204)
  @ProjectRoles('admin', 'engineer')
  @ApiNoContentResponse()
  remove(
    @Param('projectId') _p: string,
    @Param('ruleId', ParseUUIDPipe) ruleId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<void> {
    return this.rules.remove(user, access, ruleId);
  }
}
