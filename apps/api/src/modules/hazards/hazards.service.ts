import { randomUUID } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { compareHazards, hazardRangeErrors, orderedRange } from '@roundbook/domain';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { definedOnly } from '../../common/dto/defined-only.js';
import { isDuplicateKey } from '../../common/errors/database-errors.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { priorResult, rememberResult } from '../../common/idempotency/idempotency.js';
import { auditDiff, auditSnapshot } from '../audit/audit-diff.js';
import { AuditService } from '../audit/audit.service.js';
import { Heading } from '../headings/heading.entity.js';
import { HeadingsService } from '../headings/headings.service.js';
import { User } from '../users/user.entity.js';
import type {
  CloseHazardDto,
  CreateHazardDto,
  HazardDto,
  HazardQueryDto,
  UpdateHazardDto,
} from './dto/hazard.dto.js';
import { Hazard } from './hazard.entity.js';

const AUDITED = [
  'kind',
  'fromChainage',
  'toChainage',
  'level',
  'description',
  'origin',
  'roundId',
  'handoverId',
  'photoIds',
  'status',
  'closedBy',
  'closeReason',
] as const satisfies ReadonlyArray<keyof Hazard>;
const CREATE_SCOPE = 'hazard:create';

/**
 * The hazard register of each heading. Rounds read the open hazards through openForHeading (the
 * open-red-hazard trigger rule), and so will the handover composer. Rounds and photos are read by id with
 * plain SQL (this module sits below rounds: rounds import it, never the other way).
 */
@Injectable()
export class HazardsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(HeadingsService) private readonly headings: HeadingsService,
  ) {}

  /**
   * The heading's open hazards, red first, then amber, then green; within a level by chainage in the drive
   * order (start-side first). The shape is HazardDto, which carries the domain's HazardFact fields.
   */
  async openForHeading(
    headingId: string,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<HazardDto[]> {
    const [heading, hazards] = await Promise.all([
      manager.findOne(Heading, { where: { id: headingId }, select: { id: true, chainageSense: true } }),
      manager.find(Hazard, { where: { headingId, status: 'open' }, order: { createdAt: 'ASC' } }),
    ]);
    const sense = heading?.chainageSense ?? 'increasing';
    return (await this.toDtos(hazards, manager)).sort((a, b) => compareHazards(a, b, sense));
  }

  /** The heading's register: open hazards first (by level, then chainage), then closed ones, latest first. */
  async list(access: ProjectAccess, headingId: string, query: HazardQueryDto): Promise<HazardDto[]> {
    const heading = await this.heading(access, headingId);
    const status = query.status ?? 'all';
    const hazards = await this.dataSource.getRepository(Hazard).find({
      where: { headingId, ...(status === 'all' ? {} : { status }) },
      order: { createdAt: 'ASC' },
    });
    const dtos = await this.toDtos(hazards);
    const open = dtos
      .filter((h) => h.status === 'open')
      .sort((a, b) => compareHazards(a, b, heading.chainageSense));
    const closed = dtos
      .filter((h) => h.status === 'closed')
      .sort((a, b) => (b.closedAt ?? '').localeCompare(a.closedAt ?? ''));
    return [...open, ...closed];
  }

  async get(access: ProjectAccess, headingId: string, hazardId: string): Promise<HazardDto> {
    await this.heading(access, headingId);
    const hazard = await this.find(this.dataSource.manager, access, headingId, hazardId);
    return (await this.toDtos([hazard]))[0];
  }

  /** Raises a hazard. Idempotent: a retry with the same Idempotency-Key, or the same hazard id, returns it. */
  async create(
    caller: AuthUser,
    access: ProjectAccess,
    headingId: string,
    dto: CreateHazardDto,
    idempotencyKey: string | null = null,
  ): Promise<HazardDto> {
    try {
      return await this.createOnce(caller, access, headingId, dto, idempotencyKey);
    } catch (error) {
      // Two copies of one request raced: the loser finds what the winner made.
      if (isDuplicateKey(error) && (idempotencyKey !== null || dto.id !== undefined))
        return this.createOnce(caller, access, headingId, dto, idempotencyKey);
      throw error;
    }
  }

  private async createOnce(
    caller: AuthUser,
    access: ProjectAccess,
    headingId: string,
    dto: CreateHazardDto,
    idempotencyKey: string | null,
  ): Promise<HazardDto> {
    const id = await this.dataSource.transaction(async (manager) => {
      if (idempotencyKey !== null) {
        const prior = await priorResult(manager, caller.id, idempotencyKey, CREATE_SCOPE);
        if (prior !== null) return prior;
      }
      if (dto.id !== undefined) {
        const existing = await manager.findOne(Hazard, { where: { id: dto.id } });
        if (existing) {
          if (existing.projectId !== access.projectId || existing.headingId !== headingId)
            throw new DomainException(ErrorCode.Conflict, 'A hazard with this id already exists elsewhere.');
          return existing.id;
        }
      }
      const heading = await this.heading(access, headingId, manager);
      const origin = dto.origin ?? (dto.roundId ? 'round' : dto.handoverId ? 'handover' : 'direct');
      const roundId = dto.roundId ?? null;
      const handoverId = dto.handoverId ?? null;
      if (origin === 'round' && roundId === null)
        throw new DomainException(ErrorCode.ValidationFailed, 'Say which round the hazard was raised on.', {
          roundId: 'Give the round’s id.',
        });
      if (origin === 'handover' && handoverId === null)
        throw new DomainException(
          ErrorCode.ValidationFailed,
          'Say which handover the hazard was raised on.',
          { handoverId: 'Give the handover’s id.' },
        );
      if (origin !== 'round' && roundId !== null)
        throw new DomainException(
          ErrorCode.ValidationFailed,
          'A round is given only for a hazard raised on a round.',
          { roundId: 'Leave this out, or raise the hazard from the round.' },
        );
      if (origin !== 'handover' && handoverId !== null)
        throw new DomainException(
          ErrorCode.ValidationFailed,
          'A handover is given only for a hazard raised on a handover.',
          { handoverId: 'Leave this out, or raise the hazard from the handover.' },
        );
      if (roundId !== null) await this.assertRoundOfHeading(manager, access, heading, roundId);
      const photoIds = await this.checkedPhotos(manager, access, heading, dto.photoIds ?? []);
      const range = await this.checkedRange(manager, heading, dto.fromChainage, dto.toChainage);
      const hazard = manager.create(Hazard, {
        id: dto.id ?? randomUUID(),
        projectId: access.projectId,
        headingId,
        kind: dto.kind,
        ...range,
        level: dto.level,
        description: dto.description.trim(),
        origin,
        roundId,
        handoverId,
        photoIds,
        status: 'open',
        raisedBy: caller.id,
        closedBy: null,
        closedAt: null,
        closeReason: null,
      });
      const saved = await manager.save(hazard);
      if (idempotencyKey !== null)
        await rememberResult(manager, caller.id, idempotencyKey, CREATE_SCOPE, saved.id);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'hazard',
        entityId: saved.id,
        action: 'create',
        after: { headingId, ...auditSnapshot(saved, AUDITED) },
      });
      return saved.id;
    });
    return this.get(access, headingId, id);
  }

  /** Changes an open hazard; a closed one is kept as it was closed. Optimistic locking by version. */
  async update(
    caller: AuthUser,
    access: ProjectAccess,
    headingId: string,
    hazardId: string,
    dto: UpdateHazardDto,
  ): Promise<HazardDto> {
    await this.dataSource.transaction(async (manager) => {
      const heading = await this.heading(access, headingId, manager);
      const hazard = await this.find(manager, access, headingId, hazardId, true);
      await this.assertCurrent(hazard, dto.version);
      if (hazard.status !== 'open')
        throw new DomainException(
          ErrorCode.Conflict,
          'This hazard is closed and kept as it was closed. Raise a new hazard if the ground calls for one.',
        );
      const before = { ...hazard, photoIds: [...hazard.photoIds] };
      const { version: _v, fromChainage, toChainage, photoIds, description, ...rest } = definedOnly(dto);
      Object.assign(hazard, rest);
      if (description !== undefined) hazard.description = description.trim();
      if (fromChainage !== undefined || toChainage !== undefined)
        Object.assign(
          hazard,
          await this.checkedRange(
            manager,
            heading,
            fromChainage ?? hazard.fromChainage,
            toChainage ?? hazard.toChainage,
          ),
        );
      if (photoIds !== undefined)
        hazard.photoIds = await this.checkedPhotos(manager, access, heading, photoIds);
      const diff = auditDiff(before, hazard, AUDITED);
      if (!diff) return;
      await manager.save(hazard);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'hazard',
        entityId: hazardId,
        action: 'update',
        ...diff,
      });
    });
    return this.get(access, headingId, hazardId);
  }

  /** Closes an open hazard with the reason (engineers, supervisors, admins: the route says who). */
  async close(
    caller: AuthUser,
    access: ProjectAccess,
    headingId: string,
    hazardId: string,
    dto: CloseHazardDto,
  ): Promise<HazardDto> {
    await this.dataSource.transaction(async (manager) => {
      await this.heading(access, headingId, manager);
      const hazard = await this.find(manager, access, headingId, hazardId, true);
      await this.assertCurrent(hazard, dto.version);
      if (hazard.status !== 'open')
        throw new DomainException(ErrorCode.Conflict, 'This hazard is already closed.');
      const reason = dto.reason.trim();
      if (reason.length < 3)
        throw new DomainException(ErrorCode.ValidationFailed, 'Say why the hazard is closed.', {
          reason: 'Give the reason (3 to 2000 characters).',
        });
      Object.assign(hazard, {
        status: 'closed',
        closedBy: caller.id,
        closedAt: new Date(),
        closeReason: reason,
      });
      await manager.save(hazard);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'hazard',
        entityId: hazardId,
        action: 'close',
        before: { status: 'open' },
        after: { status: 'closed', closedBy: caller.id, closeReason: reason, role: access.role },
      });
    });
    return this.get(access, headingId, hazardId);
  }

  private async heading(
    access: ProjectAccess,
    headingId: string,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<Heading> {
    const heading = await this.headings.findForProject(access.projectId, headingId, manager);
    if (!heading) throw DomainException.notFound('The heading');
    return heading;
  }

  private async find(
    manager: EntityManager,
    access: ProjectAccess,
    headingId: string,
    hazardId: string,
    lock = false,
  ): Promise<Hazard> {
    const hazard = await manager.findOne(Hazard, {
      where: { id: hazardId, projectId: access.projectId, headingId },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    if (!hazard) throw DomainException.notFound('The hazard');
    return hazard;
  }

  private async assertCurrent(hazard: Hazard, version: number): Promise<void> {
    if (hazard.version !== version)
      throw new DomainException(
        ErrorCode.StaleVersion,
        'Someone else changed this hazard since you opened it. Review their version, then apply your change again.',
        undefined,
        { current: (await this.toDtos([hazard]))[0] },
      );
  }

  /** The range in drive order, checked against the heading's start and its furthest face. */
  private async checkedRange(
    manager: EntityManager,
    heading: Heading,
    from: number,
    to: number,
  ): Promise<{ fromChainage: number; toChainage: number }> {
    const range = orderedRange(from, to, heading.chainageSense);
    const errors = hazardRangeErrors(range, heading, await this.furthestFace(manager, heading));
    if (Object.keys(errors).length)
      throw new DomainException(ErrorCode.ValidationFailed, Object.values(errors)[0], errors);
    return range;
  }

  /** The face furthest along the drive among the heading's rounds (any status: a draft is mapped ground). */
  private async furthestFace(manager: EntityManager, heading: Heading): Promise<number | null> {
    const rows = await manager.query<Array<{ hi: string | null; lo: string | null }>>(
      'SELECT MAX(face_chainage) AS hi, MIN(face_chainage) AS lo FROM rounds WHERE heading_id = ?',
      [heading.id],
    );
    const pick = heading.chainageSense === 'decreasing' ? rows[0]?.lo : rows[0]?.hi;
    return pick === null || pick === undefined ? null : Number(pick);
  }

  private async assertRoundOfHeading(
    manager: EntityManager,
    access: ProjectAccess,
    heading: Heading,
    roundId: string,
  ): Promise<void> {
    const rows = await manager.query<Array<{ heading_id: string }>>(
      'SELECT heading_id FROM rounds WHERE id = ? AND project_id = ?',
      [roundId, access.projectId],
    );
    if (!rows[0] || rows[0].heading_id !== heading.id)
      throw new DomainException(
        ErrorCode.ValidationFailed,
        `The round given is not a round of heading ${heading.code}.`,
        { roundId: 'Raise the hazard from a round of this heading.' },
      );
  }

  /** Photo ids, each a stored photo of a round of this heading (duplicates dropped, order kept). */
  private async checkedPhotos(
    manager: EntityManager,
    access: ProjectAccess,
    heading: Heading,
    ids: string[],
  ): Promise<string[]> {
    const unique = [...new Set(ids)];
    if (unique.length === 0) return [];
    const rows = await manager.query<Array<{ id: string }>>(
      `SELECT p.id AS id FROM photos p JOIN rounds r ON r.id = p.round_id
       WHERE p.id IN (?) AND p.project_id = ? AND r.heading_id = ? AND p.upload_state = 'stored' AND p.deleted_at IS NULL`,
      [unique, access.projectId, heading.id],
    );
    const found = new Set(rows.map((r) => String(r.id)));
    const missing = unique.filter((id) => !found.has(id));
    if (missing.length)
      throw new DomainException(
        ErrorCode.ValidationFailed,
        `${missing.length === 1 ? 'A photo given is' : `${missing.length} photos given are`} not a stored photo of heading ${heading.code}.`,
        { photoIds: `Link photos of this heading’s rounds only (not found: ${missing.join(', ')}).` },
      );
    return unique;
  }

  private async toDtos(
    hazards: Hazard[],
    manager: EntityManager = this.dataSource.manager,
  ): Promise<HazardDto[]> {
    if (hazards.length === 0) return [];
    const userIds = [
      ...new Set(hazards.flatMap((h) => [h.raisedBy, h.closedBy]).filter((x): x is string => !!x)),
    ];
    const roundIds = [...new Set(hazards.map((h) => h.roundId).filter((x): x is string => !!x))];
    const [users, rounds] = await Promise.all([
      manager.find(User, { where: { id: In(userIds) }, select: { id: true, name: true } }),
      roundIds.length
        ? manager.query<Array<{ id: string; round_number: number }>>(
            'SELECT id, round_number FROM rounds WHERE id IN (?)',
            [roundIds],
          )
        : Promise.resolve([]),
    ]);
    const names = new Map(users.map((u) => [u.id, u.name]));
    const numbers = new Map(rounds.map((r) => [String(r.id), Number(r.round_number)]));
    return hazards.map((h) => ({
      id: h.id,
      headingId: h.headingId,
      kind: h.kind,
      fromChainage: h.fromChainage,
      toChainage: h.toChainage,
      level: h.level,
      description: h.description,
      origin: h.origin,
      roundId: h.roundId,
      roundNumber: h.roundId ? (numbers.get(h.roundId) ?? null) : null,
      handoverId: h.handoverId,
      photoIds: h.photoIds ?? [],
      status: h.status,
      raisedBy: h.raisedBy,
      raisedByName: names.get(h.raisedBy) ?? null,
      raisedAt: h.createdAt.toISOString(),
      closedBy: h.closedBy,
      closedByName: h.closedBy ? (names.get(h.closedBy) ?? null) : null,
      closedAt: h.closedAt ? h.closedAt.toISOString() : null,
      closeReason: h.closeReason,
      version: h.version,
    }));
  }
}
