import {
  Body,
  Controller,
  Delete,
  Get,
  Inject,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Put,
} from '@nestjs/common';
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
import {
  CreateSupportClassDto,
  ReorderSupportClassesDto,
  SupportClassLibraryDto,
  UpdateSupportClassDto,
} from './dto/support-class.dto.js';
import { SupportClassesService } from './support-classes.service.js';

@ApiTags('support-classes')
@ApiBearerAuth()
@Controller('projects/:projectId/support-classes')
export class SupportClassesController {
  constructor(@Inject(SupportClassesService) private readonly classes: SupportClassesService) {}

  /** The project's support classes, best ground first, with range warnings (any member) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: SupportClassLibraryDto })
  list(
    @Param('projectId') _p: string,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<SupportClassLibraryDto> {
    return this.classes.library(access);
  }

  /** Adds a class at the end of the list (project admins) */
  @Post()
  @ProjectRoles('admin')
  @ApiCreatedResponse({ type: SupportClassLibraryDto })
  @ApiConflictResponse({ type: ErrorResponseDto })
  create(
    @Param('projectId') _p: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: CreateSupportClassDto,
  ): Promise<SupportClassLibraryDto> {
    return this.classes.create(user, access, body);
  }

  /** Sets the order of the whole library, best ground first (project admins) */
  @Put('order')
  @ProjectRoles('admin')
  @ApiOkResponse({ type: SupportClassLibraryDto })
  reorder(
    @Param('projectId') _p: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: ReorderSupportClassesDto,
  ): Promise<SupportClassLibraryDto> {
    return this.classes.reorder(user, access, body);
  }

  /** Changes or retires a class (project admins) */
  @Patch(':classId')
  @ProjectRoles('admin')
  @ApiOkResponse({ type: SupportClassLibraryDto })
  @ApiConflictResponse({ type: ErrorResponseDto })
  update(
    @Param('projectId') _p: string,
    @Param('classId', ParseUUIDPipe) classId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
    @Body() body: UpdateSupportClassDto,
  ): Promise<SupportClassLibraryDto> {
    return this.classes.update(user, access, classId, body);
  }

  /** Deletes a class no record uses (project admins); a class in use can only be retired */
  @Delete(':classId')
  @ProjectRoles('admin')
  @ApiOkResponse({ type: SupportClassLibraryDto })
  @ApiConflictResponse({ type: ErrorResponseDto })
  remove(
    @Param('projectId') _p: string,
    @Param('classId', ParseUUIDPipe) classId: string,
    @CurrentUser() user: AuthUser,
    @CurrentAccess() access: ProjectAccess,
  ): Promise<SupportClassLibraryDto> {
    return this.classes.remove(user, access, classId);
  }
}
