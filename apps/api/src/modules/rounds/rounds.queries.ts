import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { RoundAssessment, Stage } from '@roundbook/domain';
import {
  Brackets,
  DataSource,
  type EntityManager,
  type ObjectLiteral,
  type SelectQueryBuilder,
} from 'typeorm';
import type { ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException } from '../../common/errors/domain.exception.js';
import type { Heading } from '../headings/heading.entity.js';
import { HeadingsService } from '../headings/headings.service.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import { User } from '../users/user.entity.js';
import type {
  NearbyJointDto,
  NearbyJointsQueryDto,
  RoundDto,
  RoundPageDto,
  RoundQueryDto,
  RoundRevisionDto,
} from './dto/round.dto.js';
import { Joint } from './joint.entity.js';
import { RoundAssessor } from './round-assessor.service.js';
import { RoundRevision } from './round-revision.entity.js';
import { isEditable } from './round-status.js';
import { Round } from './round.entity.js';
import { toRoundDto } from './rounds.mapper.js';

/** Reads of rounds: one round, its revisions, pages of a heading's rounds, nearby joints. */
@Injectable()
export class RoundsQueries {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(HeadingsService) private readonly headings: HeadingsService,
    @Inject(RoundAssessor) private readonly assessor: RoundAssessor,
  ) {}

  /**
   * One round as a DTO. A draft (or returned round) is assessed against today's context, so its suggestion
   * follows a class edited in Setup; a submitted or confirmed round shows what was frozen when it left the
   * geologist and is never recomputed.
   */
  async dto(manager: EntityManager, round: Round, heading?: Heading): Promise<RoundDto> {
    const [joints, mapper, h] = await Promise.all([
      manager.find(Joint, { where: { roundId: round.id }, order: { seq: 'ASC' } }),
      manager.findOne(User, { where: { id: round.mappedBy }, select: { id: true, name: true } }),
      heading ?? this.headings.findForProject(round.projectId, round.headingId, manager),
    ]);
    const assessment: RoundAssessment =
      isEditable(round.status) || round.assessment === null
        ? await this.assessor.assess(round, joints, manager, h ?? undefined)
        : round.assessment;
    return toRoundDto(round, joints, assessment, {
      mapperName: mapper?.name ?? '',
      plannedRoundLength: h?.plannedRoundLength ?? 0,
    });
  }

  async get(access: ProjectAccess, roundId: string): Promise<RoundDto> {
    const manager = this.dataSource.manager;
    return this.dto(manager, await this.find(manager, access, roundId));
  }

  async find(manager: EntityManager, access: ProjectAccess, roundId: string, lock = false): Promise<Round> {
    const round = await manager.findOne(Round, {
      where: { id: roundId, projectId: access.projectId },
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    if (!round) throw DomainException.notFound('The round');
    return round;
  }

  async heading(
    access: ProjectAccess,
    headingId: string,
    manager?: EntityManager,
    lock = false,
  ): Promise<Heading> {
    const heading = await this.headings.findForProject(access.projectId, headingId, manager, lock);
    if (!heading) throw DomainException.notFound('The heading');
    return heading;
  }

  /** Every frozen revision of the round, oldest first. */
  async revisions(access: ProjectAccess, roundId: string): Promise<RoundRevisionDto[]> {
    const round = await this.find(this.dataSource.manager, access, roundId);
    const rows = await this.dataSource
      .getRepository(RoundRevision)
      .find({ where: { roundId: round.id }, order: { createdAt: 'ASC' } });
    return rows.map((r) => ({
      id: r.id,
      revision: r.revision,
      event: r.event,
      status: r.status,
      createdBy: r.createdBy,
      createdAt: r.createdAt.toISOString(),
      record: r.record,
      assessment: r.assessment as unknown as Record<string, unknown>,
      assessmentVersion: r.assessmentVersion,
    }));
  }

  /** A page of a heading's rounds; sorting and filters run in the database on indexed columns. */
  async list(access: ProjectAccess, headingId: string, query: RoundQueryDto): Promise<RoundPageDto> {
    const heading = await this.heading(access, headingId);
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 50;
    // By default the furthest face along the drive comes first, whichever way the chainage runs.
    const sort = query.sort ?? (heading.chainageSense === 'decreasing' ? 'faceChainage' : '-faceChainage');
    const column = {
      faceChainage: 'face_chainage',
      shiftDate: 'shift_date',
      q: 'q',
      rmr: 'rmr',
      roundNumber: 'round_number',
    }[sort.replace('-', '') as 'q'];
    const direction = sort.startsWith('-') ? 'DESC' : 'ASC';
    // The page's ids first, from the heading's index alone (sort column, then id, in the index's direction),
    // and only those 50 rows read in full with their names (`npm run load`: with the joins in the same query
    // an offset of 2,000 read 2,050 rows of a 600 MB table and their users and classes to throw away all
    // but 50). The count reads the index only, without joins that cannot change it.
    const filtered = <T extends ObjectLiteral>(qb: SelectQueryBuilder<T>) => {
      qb.from(Round, 'k').where('k.heading_id = :headingId', { headingId });
      if (query.status) qb.andWhere('k.status = :status', { status: query.status });
      if (query.stage) qb.andWhere('k.stage = :stage', { stage: query.stage });
      if (query.fromChainage !== undefined || query.toChainage !== undefined) {
        qb.andWhere(
          new Brackets((b) => {
            b.where('k.face_chainage >= :from', { from: query.fromChainage ?? -1e9 }).andWhere(
              'k.face_chainage <= :to',
              { to: query.toChainage ?? 1e9 },
            );
          }),
        );
      }
      return qb;
    };
    const total = await filtered(this.dataSource.createQueryBuilder())
      .select('COUNT(*)', 'n')
      .getRawOne<{ n: string }>();
    const rows = await this.dataSource
      .createQueryBuilder()
      .from(
        (sub) =>
          filtered(sub)
            .select('k.id', 'id')
            .orderBy(`k.${column}`, direction)
            .addOrderBy('k.id', direction)
            .offset((page - 1) * pageSize)
            .limit(pageSize),
        'page',
      )
      .innerJoin(Round, 'r', 'r.id = page.id')
      .leftJoin(User, 'u', 'u.id = r.mapped_by')
      .leftJoin(SupportClass, 'c', 'c.id = r.recommended_class_id')
      .leftJoin(SupportClass, 'cc', 'cc.id = r.confirmed_class_id')
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
        'cc.code AS confirmedClassCode',
        'r.status AS status',
        'r.trigger_level AS triggerLevel',
        'r.triggers_not_evaluated AS triggersNotEvaluated',
      ])
      .orderBy(`r.${column}`, direction)
      .addOrderBy('r.id', direction)
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
        confirmedClassCode: r.confirmedClassCode === null ? null : String(r.confirmedClassCode),
        status: r.status as Round['status'],
        triggerLevel: (r.triggerLevel ?? null) as Round['triggerLevel'],
        triggersNotEvaluated: Number(r.triggersNotEvaluated ?? 0),
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
    await this.heading(access, headingId);
    const qb = this.dataSource
      .getRepository(Joint)
      .createQueryBuilder('j')
      .innerJoin(Round, 'r', 'r.id = j.round_id')
      .select([
        'j.id AS id',
        'j.round_id AS roundId',
        'r.round_number AS roundNumber',
        'j.face_chainage AS faceChainage',
        'j.kind AS kind',
        'j.dip_direction AS dipDirection',
        'j.dip AS dip',
        'j.set_label AS setLabel',
        'j.same_as_joint_id AS sameAsJointId',
        'j.notes AS notes',
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
      id: String(r.id),
      roundId: String(r.roundId),
      roundNumber: Number(r.roundNumber),
      faceChainage: Number(r.faceChainage),
      kind: r.kind as NearbyJointDto['kind'],
      dipDirection: Number(r.dipDirection),
      dip: Number(r.dip),
      setLabel: r.setLabel === null ? null : String(r.setLabel),
      sameAsJointId: r.sameAsJointId === null ? null : String(r.sameAsJointId),
      notes: String(r.notes ?? ''),
    }));
  }
}
