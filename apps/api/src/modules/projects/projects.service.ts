import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, type EntityManager, type Repository } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { HEADING_PROGRESS, type HeadingProgressPort } from '../../common/ports/heading-progress.port.js';
import { AuditService } from '../audit/audit.service.js';
import type { CreateProjectDto, ProjectSummaryDto, UpdateProjectDto } from './dto/project.dto.js';
import { ProjectMember } from './project-member.entity.js';
import { Project } from './project.entity.js';
import { toProjectSummary, type HeadingProgress } from './projects.mapper.js';

@Injectable()
export class ProjectsService {
  constructor(
    @InjectRepository(ProjectMember) private readonly members: Repository<ProjectMember>,
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(HEADING_PROGRESS) private readonly headingProgress: HeadingProgressPort,
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

  /** Creates a project; the caller becomes its admin (and may invite the team). */
  async create(caller: AuthUser, dto: CreateProjectDto): Promise<ProjectSummaryDto> {
    const id = await this.dataSource.transaction(async (manager) => {
      if (await manager.exists(Project, { where: { code: dto.code } })) {
        throw new DomainException(ErrorCode.Conflict, `A project with code ${dto.code} already exists.`, {
          code: 'This code is already used.',
        });
      }
      const project = await manager.save(
        manager.create(Project, {
          code: dto.code,
          name: dto.name,
          client: dto.client ?? '',
          timeZone: dto.timeZone,
          qTableEdition: '2015',
          defaultNotation: dto.defaultNotation ?? 'dip-direction/dip',
          groundScale: dto.groundScale ?? 'isrm',
          distributionList: [],
          coordinateGrid: '',
        }),
      );
      await manager.save(
        manager.create(ProjectMember, { projectId: project.id, userId: caller.id, role: 'admin' }),
      );
      await this.audit.record(manager, {
        projectId: project.id,
        actorId: caller.id,
        entityType: 'project',
        entityId: project.id,
        action: 'create',
        after: { code: project.code, name: project.name, timeZone: project.timeZone },
      });
      return project.id;
    });
    return this.get({ projectId: id, role: 'admin' });
  }

  /** The project's settings, for another module (rounds read its time zone, notation and Q edition). */
  /** `manager`: the caller's transaction, so a read inside one never waits for a second pooled connection. */
  async findProject(projectId: string, manager: EntityManager = this.dataSource.manager): Promise<Project> {
    const project = await manager.getRepository(Project).findOneBy({ id: projectId });
    if (!project) throw DomainException.notFound('The project');
    return project;
  }

  async get(access: ProjectAccess): Promise<ProjectSummaryDto> {
    const project = await this.dataSource.getRepository(Project).findOne({
      where: { id: access.projectId },
      relations: { headings: true },
    });
    if (!project) throw DomainException.notFound('The project');
    return toProjectSummary(project, access.role, await this.progress(project.headings.map((h) => h.id)));
  }

  private progress(headingIds: string[]): Promise<Map<string, HeadingProgress>> {
    return this.headingProgress.progress(headingIds);
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
        'separationOfDuties',
        'handoverAckMinutes',
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
