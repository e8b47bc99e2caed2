import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { definedOnly } from '../../common/dto/defined-only.js';
import { isRowReferenced } from '../../common/errors/database-errors.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { auditDiff, auditSnapshot } from '../audit/audit-diff.js';
import { AuditService } from '../audit/audit.service.js';
import { Project } from '../projects/project.entity.js';
import { supportClassWarnings } from './coverage.js';
import type {
  CreateSupportClassDto,
  ReorderSupportClassesDto,
  SupportClassDto,
  SupportClassLibraryDto,
  UpdateSupportClassDto,
} from './dto/support-class.dto.js';
import { SupportClass } from './support-class.entity.js';

const FIELDS = [
  'code',
  'name',
  'sortOrder',
  'qMin',
  'qMax',
  'rmrMin',
  'rmrMax',
  'maxRoundLength',
  'boltType',
  'boltLength',
  'boltPattern',
  'shotcreteMm',
  'steelSupport',
  'probingRequired',
  'notes',
  'retired',
] as const satisfies ReadonlyArray<keyof SupportClass>;

const toDto = (c: SupportClass): SupportClassDto =>
  ({ id: c.id, ...auditSnapshot(c, FIELDS), version: c.version }) as SupportClassDto;

function rangeErrors(c: Pick<SupportClass, 'qMin' | 'qMax' | 'rmrMin' | 'rmrMax'>): Record<string, string> {
  const fields: Record<string, string> = {};
  if (c.qMin != null && c.qMax != null && c.qMin >= c.qMax)
    fields.qMax = 'The upper Q bound must be above the lower one.';
  if (c.rmrMin != null && c.rmrMax != null && c.rmrMin > c.rmrMax)
    fields.rmrMax = 'The upper RMR89 bound must not be below the lower one.';
  if (c.qMin == null && c.qMax == null && c.rmrMin == null && c.rmrMax == null) {
    fields.qMin = 'Give a Q range, an RMR89 range, or both.';
  }
  return fields;
}

@Injectable()
export class SupportClassesService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
  ) {}

  /** The project's classes in library order, for another module (rounds' suggestions). */
  /** `manager`: the caller's transaction (see ProjectsService.findProject). */
  classesOf(projectId: string, manager: EntityManager = this.dataSource.manager): Promise<SupportClass[]> {
    return manager.getRepository(SupportClass).find({ where: { projectId }, order: { sortOrder: 'ASC' } });
  }

  async library(access: ProjectAccess): Promise<SupportClassLibraryDto> {
    const classes = await this.dataSource
      .getRepository(SupportClass)
      .find({ where: { projectId: access.projectId }, order: { sortOrder: 'ASC' } });
    return { classes: classes.map(toDto), warnings: supportClassWarnings(classes) };
  }

  async create(
    caller: AuthUser,
    access: ProjectAccess,
    dto: CreateSupportClassDto,
  ): Promise<SupportClassLibraryDto> {
    await this.dataSource.transaction(async (manager) => {
      // The project row locked first: classes created at once are numbered one after the other (twenty
      // concurrent creates got duplicate sort orders when each read the same last one).
      await manager.findOne(Project, {
        where: { id: access.projectId },
        lock: { mode: 'pessimistic_write' },
      });
      const draft = manager.create(SupportClass, {
        qMin: null,
        qMax: null,
        rmrMin: null,
        rmrMax: null,
        boltType: '',
        boltLength: null,
        boltPattern: '',
        shotcreteMm: 0,
        steelSupport: '',
        probingRequired: false,
        notes: '',
        ...definedOnly(dto),
        projectId: access.projectId,
        retired: false,
      });
      this.assertRanges(draft);
      await this.assertCodeFree(manager, access.projectId, dto.code);
      const last = await manager.findOne(SupportClass, {
        where: { projectId: access.projectId },
        order: { sortOrder: 'DESC' },
      });
      draft.sortOrder = (last?.sortOrder ?? 0) + 1;
      const saved = await manager.save(draft);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'support-class',
        entityId: saved.id,
        action: 'create',
        after: auditSnapshot(saved, FIELDS),
      });
    });
    return this.library(access);
  }

  async update(
    caller: AuthUser,
    access: ProjectAccess,
    id: string,
    dto: UpdateSupportClassDto,
  ): Promise<SupportClassLibraryDto> {
    await this.dataSource.transaction(async (manager) => {
      const found = await this.find(manager, access, id);
      if (found.version !== dto.version) {
        throw new DomainException(
          ErrorCode.StaleVersion,
          `Someone else changed ${found.code} since you opened it. Review their version, then apply your change again.`,
          undefined,
          {
            current: toDto(found),
          },
        );
      }
      const before = { ...found };
      const { version: _v, ...changes } = definedOnly(dto);
      Object.assign(found, changes);
      this.assertRanges(found);
      if (changes.code && changes.code !== before.code)
        await this.assertCodeFree(manager, access.projectId, changes.code);
      const diff = auditDiff(before, found, FIELDS);
      if (!diff) return;
      await manager.save(found);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'support-class',
        entityId: found.id,
        action: changes.retired === true && !before.retired ? 'retire' : 'update',
        ...diff,
      });
    });
    return this.library(access);
  }

  async reorder(
    caller: AuthUser,
    access: ProjectAccess,
    dto: ReorderSupportClassesDto,
  ): Promise<SupportClassLibraryDto> {
    await this.dataSource.transaction(async (manager) => {
      const classes = await manager.find(SupportClass, {
        where: { projectId: access.projectId },
        lock: { mode: 'pessimistic_write' },
      });
      const ids = new Set(classes.map((c) => c.id));
      if (dto.ids.length !== classes.length || dto.ids.some((i) => !ids.has(i))) {
        throw new DomainException(
          ErrorCode.Conflict,
          'The list changed while you were ordering it. Reload and order it again.',
        );
      }
      const before = Object.fromEntries(classes.map((c) => [c.code, c.sortOrder]));
      const byId = new Map(classes.map((c) => [c.id, c]));
      const after: Record<string, number> = {};
      for (const [i, id] of dto.ids.entries()) {
        const c = byId.get(id)!;
        after[c.code] = i + 1;
        if (c.sortOrder !== i + 1)
          await manager.update(
            SupportClass,
            { id },
            { sortOrder: i + 1, updatedAt: () => 'CURRENT_TIMESTAMP(3)' },
          );
      }
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'support-class',
        entityId: access.projectId,
        action: 'reorder',
        before,
        after,
      });
    });
    return this.library(access);
  }

  /** Deletes a class no round uses (rounds hold it by foreign key, ON DELETE RESTRICT); one in use can only be retired. */
  async remove(caller: AuthUser, access: ProjectAccess, id: string): Promise<SupportClassLibraryDto> {
    await this.dataSource.transaction(async (manager) => {
      const found = await this.find(manager, access, id);
      try {
        await manager.delete(SupportClass, { id });
      } catch (error) {
        // Rounds hold their class by foreign key (ON DELETE RESTRICT): the database is the one check.
        if (isRowReferenced(error)) {
          throw new DomainException(
            ErrorCode.Conflict,
            `${found.code} is recommended on round records, so it cannot be deleted. Retire it instead: it stays on those records and is no longer offered.`,
          );
        }
        throw error;
      }
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'support-class',
        entityId: id,
        action: 'delete',
        before: auditSnapshot(found, FIELDS),
      });
    });
    return this.library(access);
  }

  private assertRanges(c: SupportClass): void {
    const errors = rangeErrors(c);
    if (Object.keys(errors).length)
      throw new DomainException(ErrorCode.ValidationFailed, Object.values(errors)[0], errors);
  }

  private async find(manager: EntityManager, access: ProjectAccess, id: string): Promise<SupportClass> {
    const found = await manager.findOne(SupportClass, {
      where: { id, projectId: access.projectId },
      lock: { mode: 'pessimistic_write' },
    });
    if (!found) throw DomainException.notFound('The support class');
    return found;
  }

  private async assertCodeFree(manager: EntityManager, projectId: string, code: string): Promise<void> {
    if (await manager.exists(SupportClass, { where: { projectId, code } })) {
      throw new DomainException(ErrorCode.Conflict, `A support class with code ${code} already exists.`, {
        code: 'This code is already used.',
      });
    }
  }
}
