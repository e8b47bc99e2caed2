import { Body, Controller, Get, Inject, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
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
import { CreateHeadingDto, HeadingDto, UpdateHeadingDto } from './dto/heading.dto.js';
import { HeadingsService } from './headings.service.js';

@ApiTags('headings')
@ApiBearerAuth()
@Controller('projects/:projectId/headings')
export class HeadingsController {
  constructor(@Inject(HeadingsService) private readonly headings: HeadingsService) {}

  /** The project's headings (any member) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: [HeadingDto] })
  list(
    @Param('projectId') _projectId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<HeadingDto[]> {
    return this.headings.list(access);
  }

  /** One heading with its alignment and profile (any member) */
  @Get(':headingId')
  @ProjectRoles()
  @ApiOkResponse({ type: HeadingDto })
  get(
    @Param('projectId') _projectId: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<HeadingDto> {
    return this.headings.get(access, headingId);
  }

  /** Adds a heading (project admins) */
  @Post()
  @ProjectRoles('admin')
  @ApiCreatedResponse({ type: HeadingDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'CONFLICT: the code is taken' })
  create(
    @Param('projectId') _projectId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: CreateHeadingDto,
  ): Promise<HeadingDto> {
    return this.headings.create(user, access, body);
  }

  /** Changes a heading (project admins); optimistic locking by version */
  @Patch(':headingId')
  @ProjectRoles('admin')
  @ApiOkResponse({ type: HeadingDto })
  @ApiConflictResponse({ type: ErrorResponseDto, description: 'STALE_VERSION or CONFLICT' })
  update(
    @Param('projectId') _projectId: string,
    @Param('headingId', ParseUUIDPipe) headingId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: UpdateHeadingDto,
  ): Promise<HeadingDto> {
    return this.headings.update(user, access, headingId, body);
  }
}
