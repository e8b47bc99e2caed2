import { Controller, Get, Param, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { ProjectAccess } from '../../common/auth/auth-user.js';
import { CurrentAccess } from '../../common/auth/current-user.decorator.js';
import { ProjectRoles } from '../../common/auth/project-roles.decorator.js';
import { User } from '../users/user.entity.js';
import { AuditEvent } from './audit-event.entity.js';
import { AuditEventDto, AuditQueryDto } from './dto/audit-event.dto.js';

@ApiTags('audit')
@ApiBearerAuth()
@Controller('projects/:projectId/audit')
export class AuditController {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  /** The project's audit trail, newest first (any member) */
  @Get()
  @ProjectRoles()
  @ApiOkResponse({ type: [AuditEventDto] })
  async list(
    @Param('projectId') _p: string,
    @CurrentAccess() access: ProjectAccess,
    @Query() query: AuditQueryDto,
  ): Promise<AuditEventDto[]> {
    const events = await this.dataSource.getRepository(AuditEvent).find({
      where: {
        projectId: access.projectId,
        ...(query.entityType ? { entityType: query.entityType } : {}),
        ...(query.entityId ? { entityId: query.entityId } : {}),
      },
      order: { createdAt: 'DESC' },
      take: query.limit ?? 100,
    });
    const ids = [...new Set(events.map((e) => e.actorId).filter((x): x is string => !!x))];
    const users = ids.length
      ? await this.dataSource.getRepository(User).findBy(ids.map((id) => ({ id })))
      : [];
    const names = new Map(users.map((u) => [u.id, u.name]));
    return events.map((e) => ({
      id: e.id,
      entityType: e.entityType,
      entityId: e.entityId,
      action: e.action,
      before: e.before,
      after: e.after,
      actorId: e.actorId,
      actorName: (e.actorId && names.get(e.actorId)) || 'Roundbook',
      at: e.createdAt.toISOString(),
      lastAt: e.lastAt ? e.lastAt.toISOString() : null,
      coalesced: e.coalesced,
    }));
  }
}
