import { Inject, Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { InjectRepository } from '@nestjs/typeorm';
import type { Repository } from 'typeorm';
import { ProjectMember } from '../../modules/projects/project-member.entity.js';
import { DomainException } from '../errors/domain.exception.js';
import {
  UUID,
  type AuthUser,
  type MembershipOfRequest,
  type ProjectAccess,
  type ProjectRole,
} from './auth-user.js';

/** 404 to a non-member (the project's existence is not revealed), 403 to a member without the role. */
/** Metadata key of the roles a project-scoped route is open to (set by @ProjectRoles). */
export const PROJECT_ROLES_KEY = 'projectRoles';

@Injectable()
export class ProjectAccessGuard implements CanActivate {
  constructor(
    @Inject(Reflector) private readonly reflector: Reflector,
    @InjectRepository(ProjectMember) private readonly members: Repository<ProjectMember>,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const req = context.switchToHttp().getRequest<{
      user: AuthUser;
      params: Record<string, string>;
      projectAccess?: ProjectAccess;
      membershipOfRequest?: MembershipOfRequest;
    }>();
    const projectId = req.params.projectId;
    if (!projectId || !UUID.test(projectId)) throw DomainException.notFound('The project');
    // Read with the account by the JWT strategy in this same request when it could (same project): no second
    // statement. Otherwise (another caller of this guard) asked here.
    const pre = req.membershipOfRequest;
    const member =
      pre && pre.projectId === projectId
        ? pre.role && { role: pre.role }
        : await this.members.findOne({ where: { projectId, userId: req.user.id } });
    if (!member) throw DomainException.notFound('The project');
    const roles = this.reflector.getAllAndOverride<ProjectRole[] | undefined>(PROJECT_ROLES_KEY, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (roles && roles.length > 0 && !roles.includes(member.role)) {
      throw DomainException.forbidden(
        `Your role in this project (${member.role}) does not allow this. It needs: ${roles.join(' or ')}.`,
      );
    }
    req.projectAccess = { projectId, role: member.role };
    return true;
  }
}
