import { applyDecorators, SetMetadata, UseGuards } from '@nestjs/common';
import { ApiForbiddenResponse, ApiNotFoundResponse } from '@nestjs/swagger';
import type { ProjectRole } from './auth-user.js';
import { PROJECT_ROLES_KEY, ProjectAccessGuard } from './project-access.guard.js';

export { PROJECT_ROLES_KEY };

/**
 * A project-scoped route (`:projectId` in its path) open to the listed roles. A non-member gets 404 (the
 * project's existence is not revealed); a member without one of the roles gets 403.
 * With no roles listed, any member may call it.
 */
export const ProjectRoles = (...roles: ProjectRole[]): MethodDecorator & ClassDecorator =>
  applyDecorators(
    SetMetadata(PROJECT_ROLES_KEY, roles),
    UseGuards(ProjectAccessGuard),
    ApiNotFoundResponse({ description: 'Not a member of this project, or no such project' }),
    ApiForbiddenResponse({ description: 'Member without one of the roles: ' + (roles.join(', ') || 'any') }),
  );
