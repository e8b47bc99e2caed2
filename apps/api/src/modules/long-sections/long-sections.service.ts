import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { SINGLE_FEATURE_KINDS } from '@roundbook/domain';
import { DataSource } from 'typeorm';
import type { ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException } from '../../common/errors/domain.exception.js';
import { Hazard } from '../hazards/hazard.entity.js';
import { HeadingsService } from '../headings/headings.service.js';
import type { LongSectionDto } from './dto/long-section.dto.js';
import {
  longSectionRounds,
  longSectionTraces,
  todaysFace,
  type LongSectionJointRow,
  type LongSectionRoundRow,
} from './long-section.model.js';

type Num = string | number | null;
const num = (v: Num): number | null => (v === null ? null : Number(v));

interface RoundSqlRow {
  id: string;
  roundNumber: number;
  stage: LongSectionRoundRow['stage'];
  status: LongSectionRoundRow['status'];
  faceChainage: Num;
  previousChainage: Num;
  roundLength: Num;
  ground: string | { units?: Array<{ name: string; sharePercent: number }> } | null;
  q: Num;
  rmr: Num;
  gsi: Num;
  recommendedClass: string | null;
  confirmedClass: string | null;
  installedClass: string | null;
  triggerLevel: LongSectionRoundRow['triggerLevel'];
  confirmedRoundLength: Num;
  confirmedAt: Date | string | null;
}

/**
 * The heading's long section, read in four queries whatever the number of rounds: the rounds with their
 * class codes (one join each, on primary keys), the hazards, and the faults and shear zones.
 */
@Injectable()
export class LongSectionsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(HeadingsService) private readonly headings: HeadingsService,
  ) {}

  async get(access: ProjectAccess, headingId: string): Promise<LongSectionDto> {
    const heading = await this.headings.findForProject(access.projectId, headingId);
    if (!heading) throw DomainException.notFound('The heading');
    const sign: 1 | -1 = heading.chainageSense === 'decreasing' ? -1 : 1;
    const sql = await this.dataSource.query<RoundSqlRow[]>(
      `SELECT r.id, r.round_number AS roundNumber, r.stage, r.status, r.face_chainage AS faceChainage,
              r.previous_chainage AS previousChainage, r.round_length AS roundLength,
              JSON_OBJECT('units', JSON_EXTRACT(r.ground, '$.units'),
                          'inflowLpm', JSON_EXTRACT(r.ground, '$.inflowLpm'),
                          'inflowLengthM', JSON_EXTRACT(r.ground, '$.inflowLengthM'),
                          'overbreakM3', JSON_EXTRACT(r.ground, '$.overbreakM3')) AS ground,
              r.q, r.rmr, r.gsi, rc.code AS recommendedClass, cc.code AS confirmedClass,
              ic.code AS installedClass, r.trigger_level AS triggerLevel,
              r.confirmed_round_length AS confirmedRoundLength, r.confirmed_at AS confirmedAt
         FROM rounds r
         LEFT JOIN support_classes rc ON rc.id = r.recommended_class_id
         LEFT JOIN support_classes cc ON cc.id = r.confirmed_class_id
         LEFT JOIN support_records sr ON sr.round_id = r.id
         LEFT JOIN support_classes ic ON ic.id = sr.class_id
        WHERE r.heading_id = ?
        ORDER BY r.face_chainage ${sign === 1 ? 'ASC' : 'DESC'}, r.round_number ASC`,
      [headingId],
    );
    let lastConfirmed: { at: number; length: number | null } | null = null;
    const rows: LongSectionRoundRow[] = sql.map((r) => {
      const ground = (typeof r.ground === 'string' ? JSON.parse(r.ground) : r.ground) as {
        units?: Array<{ name: string; sharePercent: number }> | null;
        inflowLpm?: Num;
        inflowLengthM?: Num;
        overbreakM3?: Num;
      } | null;
      if (r.confirmedAt !== null) {
        const at = new Date(r.confirmedAt).getTime();
        if (!lastConfirmed || at > lastConfirmed.at)
          lastConfirmed = { at, length: num(r.confirmedRoundLength) };
      }
      return {
        id: r.id,
        roundNumber: Number(r.roundNumber),
        stage: r.stage,
        status: r.status,
        faceChainage: Number(r.faceChainage),
        previousChainage: num(r.previousChainage),
        roundLength: num(r.roundLength),
        units: Array.isArray(ground?.units) ? ground.units : [],
        inflowLpm: num(ground?.inflowLpm ?? null),
        inflowLengthM: num(ground?.inflowLengthM ?? null),
        overbreakM3: num(ground?.overbreakM3 ?? null),
        q: num(r.q),
        rmr: num(r.rmr),
        gsi: num(r.gsi),
        recommendedClass: r.recommendedClass,
        confirmedClass: r.confirmedClass,
        installedClass: r.installedClass,
        triggerLevel: r.triggerLevel,
      };
    });
    const hazards = await this.dataSource.getRepository(Hazard).find({
      where: { headingId },
      order: { fromChainage: 'ASC' },
    });
    const joints = await this.dataSource.query<
      Array<{
        id: string;
        roundId: string;
        kind: LongSectionJointRow['kind'];
        dipDirection: Num;
        dip: Num;
        faceOffset: string | LongSectionJointRow['faceOffset'];
        sameAsJointId: string | null;
      }>
    >(
      `SELECT j.id, j.round_id AS roundId, j.kind, j.dip_direction AS dipDirection, j.dip,
              j.face_offset AS faceOffset, j.same_as_joint_id AS sameAsJointId
         FROM joints j
        WHERE j.heading_id = ? AND j.kind IN (?) AND j.dip IS NOT NULL AND j.dip_direction IS NOT NULL`,
      [headingId, [...SINGLE_FEATURE_KINDS]],
    );
    const face = todaysFace(rows, sign);
    const confirmedLength = (lastConfirmed as { length: number | null } | null)?.length ?? null;
    const roundLength = confirmedLength ?? heading.plannedRoundLength;
    return {
      headingId,
      chainageSense: heading.chainageSense === 'decreasing' ? 'decreasing' : 'increasing',
      faceChainage: face?.chainage ?? null,
      faceRoundNumber: face?.roundNumber ?? null,
      lookAheadRoundLength: roundLength,
      crownHeight: heading.profileHeight - heading.axisHeight,
      invertDepth: heading.axisHeight,
      rounds: longSectionRounds(rows, sign),
      hazards: hazards.map((z) => ({
        id: z.id,
        kind: z.kind,
        level: z.level,
        status: z.status,
        fromChainage: z.fromChainage,
        toChainage: z.toChainage,
        description: z.description,
      })),
      traces: longSectionTraces({
        heading,
        rounds: rows,
        joints: joints.map((j) => ({
          id: j.id,
          roundId: j.roundId,
          kind: j.kind,
          dipDirection: Number(j.dipDirection),
          dip: Number(j.dip),
          faceOffset: (typeof j.faceOffset === 'string'
            ? JSON.parse(j.faceOffset)
            : j.faceOffset) as LongSectionJointRow['faceOffset'],
          sameAsJointId: j.sameAsJointId,
        })),
        face,
        roundLength,
      }),
    };
  }
}
