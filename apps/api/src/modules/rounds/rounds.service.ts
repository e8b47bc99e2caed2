import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { PlaneNotation } from '@roundbook/geomath';
import { Brackets, DataSource, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { AuditService } from '../audit/audit.service.js';
import { Heading, type Stage } from '../headings/heading.entity.js';
import { Project } from '../projects/project.entity.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import { User } from '../users/user.entity.js';
import type {
  CreateRoundDto,
  NearbyJointDto,
  NearbyJointsQueryDto,
  NextRoundDto,
  RoundDto,
  RoundPageDto,
  RoundQueryDto,
  SaveRoundDto,
  SubmitRoundDto,
} from './dto/round.dto.js';
import { Joint } from './joint.entity.js';
import {
  computeRatings,
  inflowPer10m,
  readOrientation,
  roundWarnings,
  shiftOf,
  suggestClasses,
} from './round-computations.js';
import { assessRoundTriggers } from './round-triggers.js';
import { Round, type GroundRecord, type QRecord, type RmrRecord } from './round.entity.js';

const EDITABLE: ReadonlyArray<Round['status']> = ['draft', 'returned'];
const emptyGround = (): GroundRecord => ({
  units: [],
  pointLoadIs50: null,
  pointLoadFactor: null,
  inflowLpm: null,
  inflowLengthM: null,
  waterDescription: '',
  overbreakM3: null,
  notes: '',
});
const AUDITED = [
  'faceChainage',
  'previousChainage',
  'roundLength',
  'shiftDate',
  'shift',
  'distantParts',
  'ground',
  'qInput',
  'rmrInput',
  'gsiObserved',
  'recommendedClassId',
  'nextRoundLength',
  'recommendationReason',
] as const;

@Injectable()
export class RoundsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
  ) {}

  async next(access: ProjectAccess, headingId: string, stage: Stage): Promise<NextRoundDto> {
    const heading = await this.heading(this.dataSource.manager, access, headingId);
    return this.nextFor(this.dataSource.manager, heading, stage);
  }

  async create(
    caller: AuthUser,
    access: ProjectAccess,
    headingId: string,
    dto: CreateRoundDto,
  ): Promise<RoundDto> {
    const id = await this.dataSource.transaction(async (manager) => {
      const heading = await this.heading(manager, access, headingId, true);
      if (!heading.stages.includes(dto.stage)) {
        throw new DomainException(
          ErrorCode.ValidationFailed,
          `Heading ${heading.code} does not use the ${dto.stage} stage.`,
          {
            stage: `Choose one of: ${heading.stages.join(', ')}.`,
          },
        );
      }
      const next = await this.nextFor(manager, heading, dto.stage);
      const project = await manager.findOneByOrFail(Project, { id: access.projectId });
      const now = new Date();
      const round = manager.create(Round, {
        projectId: access.projectId,
        headingId,
        stage: dto.stage,
        roundNumber: next.roundNumber,
        faceChainage: dto.faceChainage,
        previousChainage: next.previousChainage,
        roundLength: Math.round((dto.faceChainage - next.previousChainage) * 1000) / 1000,
        ...shiftOf(now, project.timeZone),
        mappedBy: caller.id,
        mappedAt: now,
        distantParts: '',
        ground: emptyGround(),
        qInput: null,
        rmrInput: null,
        gsiObserved: null,
        q: null,
        rmr: null,
        gsi: null,
        recommendedClassId: null,
        nextRoundLength: null,
        recommendationReason: '',
        status: 'draft',
        revision: 1,
        submittedAt: null,
      });
      const saved = await manager.save(round);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: saved.id,
        action: 'create',
        after: {
          headingId,
          stage: saved.stage,
          roundNumber: saved.roundNumber,
          faceChainage: saved.faceChainage,
        },
      });
      return saved.id;
    });
    return this.get(access, id);
  }

  async get(access: ProjectAccess, roundId: string): Promise<RoundDto> {
    const manager = this.dataSource.manager;
    const round = await this.find(manager, access, roundId);
    return this.toDto(manager, round);
  }

  /** Saves the whole editable record (drafts save as you go). Optimistic locking by version. */
  async save(caller: AuthUser, access: ProjectAccess, roundId: string, dto: SaveRoundDto): Promise<RoundDto> {
    await this.dataSource.transaction(async (manager) => {
      const round = await this.find(manager, access, roundId, true);
      await this.assertCurrent(manager, round, dto.version);
      if (!EDITABLE.includes(round.status)) {
        throw new DomainException(
          ErrorCode.Conflict,
          `This round is ${round.status}; it can no longer be edited here.`,
        );
      }
      const project = await manager.findOneByOrFail(Project, { id: access.projectId });
      if (dto.recommendedClassId) await this.supportClass(manager, access, dto.recommendedClassId);
      const before = Object.fromEntries(AUDITED.map((f) => [f, round[f]]));
      Object.assign(round, {
        faceChainage: dto.faceChainage,
        previousChainage: dto.previousChainage ?? null,
        roundLength: dto.roundLength ?? null,
        shiftDate: dto.shiftDate,
        shift: dto.shift,
        distantParts: dto.distantParts,
        ground: { ...emptyGround(), ...dto.ground },
        qInput: (dto.qInput as QRecord | null) ?? null,
        rmrInput: (dto.rmrInput as RmrRecord | null) ?? null,
        gsiObserved: dto.gsiObserved ?? null,
        recommendedClassId: dto.recommendedClassId ?? null,
        nextRoundLength: dto.nextRoundLength ?? null,
        recommendationReason: dto.recommendationReason,
      });
      const ratings = computeRatings(round);
      round.q = ratings.q.value;
      round.rmr = ratings.rmr.value;
      round.gsi = ratings.gsi.value;
      const joints = dto.joints.map((j, i) => {
        const reading = readOrientation(j.orientationText, j.notation ?? project.defaultNotation);
        return manager.create(Joint, {
          roundId,
          headingId: round.headingId,
          faceChainage: round.faceChainage,
          seq: i + 1,
          kind: j.kind,
          orientationText: j.orientationText,
          notation: j.notation,
          dipDirection: 'error' in reading ? null : reading.dipDirection,
          dip: 'error' in reading ? null : reading.dip,
          orientationError: 'error' in reading ? reading.error.slice(0, 300) : null,
          setLabel: j.setLabel ?? null,
          setOverride: j.setOverride ?? false,
          spacingM: j.spacingM ?? null,
          persistenceM: j.persistenceM ?? null,
          apertureMm: j.apertureMm ?? null,
          jr: j.jr ?? null,
          jrc: j.jrc ?? null,
          jrcMethod: j.jrcMethod ?? null,
          infill: j.infill,
          ja: j.ja ?? null,
          water: j.water ?? null,
          thicknessM: j.thicknessM ?? null,
          notes: j.notes,
        });
      });
      // The trigger level is worked out before saving, so one save is one version.
      const triggers = await assessRoundTriggers(manager, round, joints);
      round.triggerLevel = triggers.level;
      round.triggerFirings = triggers.firings;
      await manager.save(round);
      await manager.delete(Joint, { roundId });
      if (joints.length) await manager.insert(Joint, joints);
      const after = Object.fromEntries(AUDITED.map((f) => [f, round[f]]));
      const changed = AUDITED.filter((f) => JSON.stringify(before[f]) !== JSON.stringify(after[f]));
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'save',
        before: Object.fromEntries(changed.map((f) => [f, before[f]])),
        after: { ...Object.fromEntries(changed.map((f) => [f, after[f]])), joints: joints.length },
      });
    });
    return this.get(access, roundId);
  }

  /** Draft (or returned) → submitted, when the record is complete enough for the engineer. */
  async submit(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    dto: SubmitRoundDto,
  ): Promise<RoundDto> {
    await this.dataSource.transaction(async (manager) => {
      const round = await this.find(manager, access, roundId, true);
      await this.assertCurrent(manager, round, dto.version);
      if (!EDITABLE.includes(round.status))
        throw new DomainException(ErrorCode.Conflict, `This round is already ${round.status}.`);
      const current = await this.toDto(manager, round);
      const fields: Record<string, string> = {};
      const badJoints = current.joints.filter((j) => j.orientationError);
      if (badJoints.length)
        fields.joints = `Fix the orientation of joint ${badJoints.map((j) => j.seq).join(', ')} before submitting.`;
      if (current.ratings.q.value === null && current.ratings.rmr.value === null) {
        fields.ratings =
          current.ratings.q.error ??
          current.ratings.rmr.error ??
          'Rate the rock mass (Q or RMR89) before submitting.';
      }
      if (!round.recommendedClassId) fields.recommendedClassId = 'Choose the support class you recommend.';
      if (round.nextRoundLength === null) fields.nextRoundLength = 'Give the length of the next round.';
      if (round.recommendedClassId) {
        const c = await this.supportClass(manager, access, round.recommendedClassId);
        if (c.retired) fields.recommendedClassId = `${c.code} is retired; choose an active class.`;
        if (round.nextRoundLength !== null && round.nextRoundLength > c.maxRoundLength) {
          fields.nextRoundLength = `${c.code} allows rounds of up to ${c.maxRoundLength} m.`;
        }
        if (!current.suggestedClassIds.includes(c.id) && round.recommendationReason.trim().length < 5) {
          fields.recommendationReason = `${c.code} is outside the classes the ratings suggest: say why you recommend it.`;
        }
      }
      if (Object.keys(fields).length) {
        throw new DomainException(
          ErrorCode.ValidationFailed,
          `The round is not ready to submit: ${Object.values(fields)[0]}`,
          fields,
        );
      }
      round.status = 'submitted';
      round.submittedAt = new Date();
      await manager.save(round);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'submit',
        before: { status: 'draft' },
        after: {
          status: 'submitted',
          recommendedClassId: round.recommendedClassId,
          nextRoundLength: round.nextRoundLength,
        },
      });
    });
    return this.get(access, roundId);
  }

  /** A page of a heading's rounds; sorting and filters run in the database on indexed columns. */
  async list(access: ProjectAccess, headingId: string, query: RoundQueryDto): Promise<RoundPageDto> {
    await this.heading(this.dataSource.manager, access, headingId);
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 50;
    const sort = query.sort ?? '-faceChainage';
    const column = {
      faceChainage: 'r.face_chainage',
      shiftDate: 'r.shift_date',
      q: 'r.q',
      rmr: 'r.rmr',
      roundNumber: 'r.round_number',
    }[sort.replace('-', '') as 'q'];
    const qb = this.dataSource
      .createQueryBuilder()
      .from(Round, 'r')
      .leftJoin(User, 'u', 'u.id = r.mapped_by')
      .leftJoin(SupportClass, 'c', 'c.id = r.recommended_class_id')
      .where('r.heading_id = :headingId', { headingId });
    if (query.status) qb.andWhere('r.status = :status', { status: query.status });
    if (query.stage) qb.andWhere('r.stage = :stage', { stage: query.stage });
    if (query.fromChainage !== undefined || query.toChainage !== undefined) {
      qb.andWhere(
        new Brackets((b) => {
          b.where('r.face_chainage >= :from', { from: query.fromChainage ?? -1e9 }).andWhere(
            'r.face_chainage <= :to',
            { to: query.toChainage ?? 1e9 },
          );
        }),
      );
    }
    const total = await qb.clone().select('COUNT(*)', 'n').getRawOne<{ n: string }>();
    const rows = await qb
      .select([
        'r.id AS id',
        'r.round_number AS roundNumber',
        'r.stage AS stage',
        'r.face_chainage AS faceChainage',
        "DATE_FORMAT(r.shift_date, '%Y-%m-%d') AS shiftDate",
        'r.shift AS shift',
        'u.name AS mapperName',
        'r.q AS q',
        'r.rmr AS rmr',
        'c.code AS recommendedClassCode',
        'r.status AS status',
        'r.trigger_level AS triggerLevel',
      ])
      .orderBy(column, sort.startsWith('-') ? 'DESC' : 'ASC')
      .addOrderBy('r.id', sort.startsWith('-') ? 'DESC' : 'ASC') // same direction, so the index order serves both keys
      .offset((page - 1) * pageSize)
      .limit(pageSize)
      .getRawMany<Record<string, string | number | null>>();
    return {
      items: rows.map((r) => ({
        id: String(r.id),
        roundNumber: Number(r.roundNumber),
        stage: r.stage as Stage,
        faceChainage: Number(r.faceChainage),
        shiftDate: String(r.shiftDate),
        shift: r.shift as 'day' | 'night',
        mapperName: String(r.mapperName ?? ''),
        q: r.q === null ? null : Number(r.q),
        rmr: r.rmr === null ? null : Number(r.rmr),
        recommendedClassCode: r.recommendedClassCode === null ? null : String(r.recommendedClassCode),
        status: r.status as Round['status'],
        triggerLevel: (r.triggerLevel ?? null) as Round['triggerLevel'],
      })),
      total: Number(total?.n ?? 0),
      page,
      pageSize,
    };
  }

  /** Readable joints of a heading over a chainage window (sets are found over this and earlier rounds). */
  async nearbyJoints(
    access: ProjectAccess,
    headingId: string,
    query: NearbyJointsQueryDto,
  ): Promise<NearbyJointDto[]> {
    await this.heading(this.dataSource.manager, access, headingId);
    const qb = this.dataSource
      .getRepository(Joint)
      .createQueryBuilder('j')
      .innerJoin(Round, 'r', 'r.id = j.round_id')
      .select([
        'j.round_id AS roundId',
        'r.round_number AS roundNumber',
        'j.face_chainage AS faceChainage',
        'j.kind AS kind',
        'j.dip_direction AS dipDirection',
        'j.dip AS dip',
        'j.set_label AS setLabel',
      ])
      .where('j.heading_id = :headingId', { headingId })
      .andWhere('j.face_chainage BETWEEN :from AND :to', {
        from: Math.min(query.fromChainage, query.toChainage),
        to: Math.max(query.fromChainage, query.toChainage),
      })
      .andWhere('j.dip IS NOT NULL')
      .orderBy('j.face_chainage', 'DESC')
      .addOrderBy('j.seq', 'ASC')
      .limit(5000);
    if (query.excludeRoundId) qb.andWhere('j.round_id <> :exclude', { exclude: query.excludeRoundId });
    const rows = await qb.getRawMany<Record<string, string | number | null>>();
    return rows.map((r) => ({
      roundId: String(r.roundId),
      roundNumber: Number(r.roundNumber),
      faceChainage: Number(r.faceChainage),
      kind: r.kind as NearbyJointDto['kind'],
      dipDirection: Number(r.dipDirection),
      dip: Number(r.dip),
      setLabel: r.setLabel === null ? null : String(r.setLabel),
    }));
  }

  private async toDto(manager: EntityManager, round: Round): Promise<RoundDto> {
    const [joints, heading, mapper, classes] = await Promise.all([
      manager.find(Joint, { where: { roundId: round.id }, order: { seq: 'ASC' } }),
      manager.findOneByOrFail(Heading, { id: round.headingId }),
      manager.findOneBy(User, { id: round.mappedBy }),
      manager.find(SupportClass, { where: { projectId: round.projectId }, order: { sortOrder: 'ASC' } }),
    ]);
    const ratings = computeRatings(round);
    const previous = await manager.findOne(Round, {
      where: { headingId: round.headingId, stage: round.stage, roundNumber: round.roundNumber - 1 },
    });
    const previousClass = previous?.recommendedClassId
      ? classes.find((c) => c.id === previous.recommendedClassId)
      : undefined;
    return {
      id: round.id,
      headingId: round.headingId,
      stage: round.stage,
      roundNumber: round.roundNumber,
      faceChainage: round.faceChainage,
      previousChainage: round.previousChainage,
      roundLength: round.roundLength,
      shiftDate: round.shiftDate,
      shift: round.shift,
      mappedBy: round.mappedBy,
      mappedByName: mapper?.name ?? '',
      mappedAt: round.mappedAt.toISOString(),
      distantParts: round.distantParts,
      ground: round.ground,
      joints: joints.map((j) => ({
        id: j.id,
        seq: j.seq,
        kind: j.kind,
        orientationText: j.orientationText,
        notation: j.notation as PlaneNotation,
        dipDirection: j.dipDirection,
        dip: j.dip,
        orientationError: j.orientationError,
        setLabel: j.setLabel,
        setOverride: j.setOverride,
        spacingM: j.spacingM,
        persistenceM: j.persistenceM,
        apertureMm: j.apertureMm,
        jr: j.jr,
        jrc: j.jrc,
        jrcMethod: j.jrcMethod,
        infill: j.infill,
        ja: j.ja,
        water: j.water,
        thicknessM: j.thicknessM,
        notes: j.notes,
      })),
      qInput: round.qInput as Record<string, unknown> | null,
      rmrInput: round.rmrInput as Record<string, unknown> | null,
      gsiObserved: round.gsiObserved,
      ratings,
      inflowPer10m: inflowPer10m(round.ground.inflowLpm, round.ground.inflowLengthM ?? round.roundLength),
      suggestedClassIds: suggestClasses(classes, ratings.q.value, ratings.rmr.value),
      recommendedClassId: round.recommendedClassId,
      nextRoundLength: round.nextRoundLength,
      recommendationReason: round.recommendationReason,
      status: round.status,
      triggerLevel: round.triggerLevel,
      triggerFirings: round.triggerFirings ?? [],
      revision: round.revision,
      submittedAt: round.submittedAt?.toISOString() ?? null,
      warnings: roundWarnings(round, heading.plannedRoundLength, previousClass?.maxRoundLength ?? null),
      plannedRoundLength: heading.plannedRoundLength,
      version: round.version,
    };
  }

  private async nextFor(manager: EntityManager, heading: Heading, stage: Stage): Promise<NextRoundDto> {
    const last = await manager.findOne(Round, {
      where: { headingId: heading.id, stage },
      order: { roundNumber: 'DESC' },
    });
    const previousChainage = last?.faceChainage ?? heading.startChainage;
    return {
      stage,
      roundNumber: (last?.roundNumber ?? 0) + 1,
      previousChainage,
      plannedRoundLength: heading.plannedRoundLength,
      suggestedFaceChainage: Math.round((previousChainage + heading.plannedRoundLength) * 1000) / 1000,
    };
  }

  private async assertCurrent(manager: EntityManager, round: Round, version: number): Promise<void> {
    if (round.version !== version) {
      throw new DomainException(
        ErrorCode.StaleVersion,
        'Someone else saved this round since you opened it. Your typing is kept on this screen: compare it with their version, then save again.',
        undefined,
        { current: await this.toDto(manager, round) },
      );
    }
  }

  private async heading(
    manager: EntityManager,
    access: ProjectAccess,
    headingId: string,
    lock = false,
  ): Promise<Heading> {
    const heading = await manager.findOne(Heading, {
      where: { id: headingId, projectId: access.projectId },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    if (!heading) throw DomainException.notFound('The heading');
    return heading;
  }

  private async find(
    manager: EntityManager,
    access: ProjectAccess,
    roundId: string,
    lock = false,
  ): Promise<Round> {
    const round = await manager.findOne(Round, {
      where: { id: roundId, projectId: access.projectId },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    if (!round) throw DomainException.notFound('The round');
    return round;
  }

  private async supportClass(
    manager: EntityManager,
    access: ProjectAccess,
    id: string,
  ): Promise<SupportClass> {
    const c = await manager.findOne(SupportClass, { where: { id, projectId: access.projectId } });
    if (!c)
      throw new DomainException(ErrorCode.ValidationFailed, 'That support class is not in this project.', {
        recommendedClassId: 'Choose a class of this project.',
      });
    return c;
  }
}
