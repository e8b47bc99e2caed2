import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, type Repository } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { AuditService } from '../audit/audit.service.js';
import { Round } from '../rounds/round.entity.js';
import type { ProjectSummaryDto, UpdateProjectDto } from './dto/project.dto.js';
import { ProjectMember } from './project-member.entity.js';
import { Project } from './project.entity.js';
import { toProjectSummary, type HeadingProgress } from './projects.mapper.js';

@Injectable()
export class ProjectsService {
  constructor(
    @InjectRepository(ProjectMember) private readonly members: Repository<ProjectMember>,
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
  ) {}

  /** Only the caller's projects, each with the caller's role there. */
  async listForUser(caller: AuthUser): Promise<ProjectSummaryDto[]> {
    const memberships = await this.members.find({
      where: { userId: caller.id },
      relations: { project: { headings: true } },
      order: { project: { name: 'ASC' } },
    });
    const progress = await this.progress(memberships.flatMap((m) => m.project.headings.map((h) => h.id)));
    return memberships.map((m) => toProjectSummary(m.project, m.role, progress));
  }

  async get(access: ProjectAccess): Promise<ProjectSummaryDto> {
    const project = await this.dataSource.getRepository(Project).findOne({
      where: { id: access.projectId },
      relations: { headings: true },
    });
    if (!project) throw DomainException.notFound('The project');
    return toProjectSummary(project, access.role, await this.progress(project.headings.map((h) => h.id)));
  }

  /** Face chainage (furthest round), last round time and rounds waiting for review, per heading, in one query. */
  private async progress(headingIds: string[]): Promise<Map<string, HeadingProgress>> {
    if (headingIds.length === 0) return new Map();
    const rows = await this.dataSource
      .createQueryBuilder()
      .from(Round, 'r')
      .select('r.heading_id', 'headingId')
      .addSelect('MAX(r.face_chainage)', 'faceChainage')
      .addSelect('MAX(r.mapped_at)', 'lastRoundAt')
      .addSelect("SUM(r.status = 'submitted')", 'toConfirm')
      .where('r.heading_id IN (:...headingIds)', { headingIds })
      .groupBy('r.heading_id')
      .getRawMany<{
        headingId: string;
        faceChainage: string;
        lastRoundAt: Date | string;
        toConfirm: string;
      }>();
    return new Map(
      rows.map((r) => [
        r.headingId,
        {
          faceChainage: Number(r.faceChainage),
          lastRoundAt: new Date(r.lastRoundAt).toISOString(),
          roundsToConfirm: Number(r.toConfirm),
        },
      ]),
    );
  }

  /** Changes the project's settings with optimistic locking; the change goes to the audit trail. */
  async update(caller: AuthUser, access: ProjectAccess, dto: UpdateProjectDto): Promise<ProjectSummaryDto> {
    await this.dataSource.transaction(async (manager) => {
      const project = await manager.findOne(Project, {
        where: { id: access.projectId },
        lock: { mode: 'pessimistic_write' },
      });
      if (!project) throw DomainException.notFound('The project');
      if (project.version !== dto.version) {
        throw new DomainException(
          ErrorCode.StaleVersion,
          'Someone else changed this project since you opened it. Review their version, then apply your change again.',
          undefined,
          { currentVersion: project.version },
        );
      }
      const fields = [
        'name',
        'client',
        'timeZone',
        'defaultNotation',
        'qTableEdition',
        'groundScale',
        'distributionList',
        'coordinateGrid',
      ] as const;
      const before: Record<string, unknown> = {};
      const after: Record<string, unknown> = {};
      for (const f of fields) {
        const next = dto[f];
        if (next !== undefined && JSON.stringify(next) !== JSON.stringify(project[f])) {
          before[f] = project[f];
          after[f] = next;
          Object.assign(project, { [f]: next });
        }
      }
      if (Object.keys(after).length === 0) return;
      await manager.save(project);
      await this.audit.record(manager, {
        projectId: project.id,
        actorId: caller.id,
        entityType: 'project',
        entityId: project.id,
        action: 'update',
        before,
        after,
      });
    });
    return this.get(access);
  }
}
