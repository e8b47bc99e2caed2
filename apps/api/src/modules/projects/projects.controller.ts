import { Body, Controller, Get, Inject, Param, ParseUUIDPipe, Patch, Post, UseGuards } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess, CurrentUser } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { ErrorResponseDto } from '../../common/dto/error-response.dto.js';
import { ProjectCreationGuard } from '../users/project-creation.guard.js';
import { CreateProjectDto, ProjectSummaryDto, UpdateProjectDto } from './dto/project.dto.js';
import { ProjectsService } from './projects.service.js';

@ApiTags('projects')
@ApiBearerAuth()
@Controller('projects')
export class ProjectsController {
  constructor(@Inject(ProjectsService) private readonly projects: ProjectsService) {}

  /** The caller's projects with their headings and the caller's role in each */
  @Get()
  @ApiOkResponse({ type: [ProjectSummaryDto] })
  list(@CurrentUser() user: AuthUser): Promise<ProjectSummaryDto[]> {
    return this.projects.listForUser(user);
  }

  /** Creates a project; the caller becomes its admin (PROJECT_CREATION: anyone, or operators only) */
  @Post()
  @UseGuards(ProjectCreationGuard)
  @ApiCreatedResponse({ type: ProjectSummaryDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'CONFLICT: the code is taken' })
  create(@CurrentUser() user: AuthUser, @Body() body: CreateProjectDto): Promise<ProjectSummaryDto> {
    return this.projects.create(user, body);
  }

  /** One project (members only) */
  @Get(':projectId')
  @ProjectRoles()
  @ApiOkResponse({ type: ProjectSummaryDto })
  get(
    @Param('projectId', ParseUUIDPipe) _projectId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<ProjectSummaryDto> {
    return this.projects.get(access);
  }

  /** Changes the project's settings (project admins) */
  @Patch(':projectId')
  @ProjectRoles('admin')
  @ApiOkResponse({ type: ProjectSummaryDto })
  @ApiConflictResponse({
    type: ErrorResponseDto,
    description: 'STALE_VERSION: someone else changed it first',
  })
  update(
    @Param('projectId', ParseUUIDPipe) _projectId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: UpdateProjectDto,
  ): Promise<ProjectSummaryDto> {
    return this.projects.update(user, access, body);
  }
}
