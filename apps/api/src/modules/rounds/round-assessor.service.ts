import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  assessRound,
  DEFAULT_SET_PARAMETERS,
  headingSetsOf,
  previousRoundValues,
  type HeadingSet,
  type RoundAssessment,
  type RoundSet,
  type SetNames,
} from '@roundbook/domain';
import { Brackets, DataSource, type EntityManager } from 'typeorm';
import { HazardsService } from '../hazards/hazards.service.js';
import { headingGeometry } from '../headings/heading-geometry.js';
import type { Heading } from '../headings/heading.entity.js';
import { HeadingsService } from '../headings/headings.service.js';
import { ProjectsService } from '../projects/projects.service.js';
import { SupportClassesService } from '../support-classes/support-classes.service.js';
import { TriggerRulesService } from '../trigger-rules/trigger-rules.service.js';
import { activeAcceptances } from './acceptances.read.js';
import { Joint } from './joint.entity.js';
import { classOfRound } from './review-rules.js';
import { Round } from './round.entity.js';

/** The stored joints of the heading's other rounds within a window of the face: what set finding pools. */
export async function nearbyPlanes(
  manager: EntityManager,
  round: Pick<Round, 'id' | 'headingId' | 'faceChainage'>,
  windowM: number,
): Promise<
  Array<{
    id: string;
    roundId: string;
    roundNumber: number;
    dipDirection: number;
    dip: number;
    sameAsJointId: string | null;
  }>
> {
  if (windowM <= 0) return [];
  const rows = await manager
    .getRepository(Joint)
    .createQueryBuilder('j')
    .innerJoin(Round, 'r', 'r.id = j.round_id')
    .select([
      'j.id AS id',
      'j.round_id AS roundId',
      'r.round_number AS roundNumber',
      'j.dip_direction AS dipDirection',
      'j.dip AS dip',
      'j.same_as_joint_id AS sameAsJointId',
    ])
    .where('j.heading_id = :headingId', { headingId: round.headingId })
    .andWhere(
      new Brackets((b) =>
        b.where('j.face_chainage BETWEEN :from AND :to', {
          from: round.faceChainage - windowM,
          to: round.faceChainage + windowM,
        }),
      ),
    )
    .andWhere('j.dip IS NOT NULL')
    .andWhere('j.round_id <> :self', { self: round.id })
    .andWhere("j.kind NOT IN ('fault', 'shear-zone')")
    .orderBy('j.face_chainage', 'DESC')
    .addOrderBy('j.seq', 'ASC')
    .limit(5000)
    .getRawMany<{
      id: string;
      roundId: string;
      roundNumber: string | number;
      dipDirection: string;
      dip: string;
      sameAsJointId: string | null;
    }>();
  return rows.map((r) => ({
    id: String(r.id),
    roundId: String(r.roundId),
    roundNumber: Number(r.roundNumber),
    sameAsJointId: r.sameAsJointId === null ? null : String(r.sameAsJointId),
    dipDirection: Number(r.dipDirection),
    dip: Number(r.dip),
  }));
}

/** How many of the heading's latest earlier rounds give its sets (a set unseen for longer is forgotten). */
export const HEADING_SET_ROUNDS = 30;

/**
 * The heading's sets as its earlier rounds left them (mapped before this one; their stored sets, each
 * label's latest mean): what this round's sets are matched to so that labels hold along the heading.
 */
export async function headingSetsBefore(
  manager: EntityManager,
  round: Pick<Round, 'id' | 'headingId' | 'mappedAt'>,
  names: SetNames = {},
): Promise<HeadingSet[]> {
  const rows = await manager
    .getRepository(Round)
    .createQueryBuilder('r')
    .select(['r.face_chainage AS chainage', "JSON_EXTRACT(r.assessment, '$.sets.sets') AS sets"])
    .where('r.heading_id = :headingId', { headingId: round.headingId })
    .andWhere('r.id <> :self', { self: round.id })
    .andWhere('r.mapped_at < :at', { at: round.mappedAt })
    .andWhere('r.assessment IS NOT NULL')
    .orderBy('r.mapped_at', 'DESC')
    .addOrderBy('r.round_number', 'DESC')
    .limit(HEADING_SET_ROUNDS)
    .getRawMany<{ chainage: string | number; sets: string | RoundSet[] | null }>();
  return headingSetsOf(
    rows.reverse().map((r) => ({
      chainage: Number(r.chainage),
      sets: (typeof r.sets === 'string' ? (JSON.parse(r.sets) as RoundSet[] | null) : r.sets) ?? [],
    })),
    names,
  );
}

/**
 * Works out a round's assessment from its record and today's context (the heading, the project's support
 * classes and trigger rules, the previous round and the nearby joints), with packages/domain's assessRound.
 */
@Injectable()
export class RoundAssessor {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(HeadingsService) private readonly headings: HeadingsService,
    @Inject(SupportClassesService) private readonly supportClasses: SupportClassesService,
    @Inject(TriggerRulesService) private readonly triggerRules: TriggerRulesService,
    @Inject(ProjectsService) private readonly projects: ProjectsService,
    @Inject(HazardsService) private readonly hazards: HazardsService,
  ) {}

  async assess(
    round: Round,
    joints: Joint[],
    manager: EntityManager = this.dataSource.manager,
    heading?: Heading,
  ): Promise<RoundAssessment> {
    const parameters = round.setParameters ?? DEFAULT_SET_PARAMETERS;
    const [h, classes, rules, project, previous, nearby, openHazards, acceptances, headingSets] =
      await Promise.all([
        heading ?? this.headings.findForProject(round.projectId, round.headingId, manager),
        // Every read through `manager`: inside a transaction a second pooled connection could wait forever
        // once every connection is held by a transaction waiting for the heading's lock (twelve rounds opened
        // at once hung the API with a pool of ten before).
        this.supportClasses.classesOf(round.projectId, manager),
        this.triggerRules.rulesOf(round.projectId, manager),
        this.projects.findProject(round.projectId, manager),
        round.roundNumber > 1
          ? manager.findOne(Round, {
              where: { headingId: round.headingId, stage: round.stage, roundNumber: round.roundNumber - 1 },
              select: {
                id: true,
                recommendedClassId: true,
                confirmedClassId: true,
                faceChainage: true,
                assessment: true,
              },
            })
          : Promise.resolve(null),
        nearbyPlanes(manager, round, parameters.windowM),
        this.hazards.openForHeading(round.headingId, manager),
        activeAcceptances(manager, round.headingId),
        headingSetsBefore(manager, round),
      ]);
    if (!h) throw new Error(`Heading ${round.headingId} of round ${round.id} is missing`);
    // The previous round's values and conditions as its own stored facts read them, for the rules that
    // fire on a change (judged at that round's face: the drive there, on a curved alignment).
    const previousFacts = previous?.assessment?.facts;
    const previousValues = previousFacts
      ? previousRoundValues(previousFacts, headingGeometry(h, round.stage, previous.faceChainage))
      : undefined;
    return assessRound(
      {
        faceChainage: round.faceChainage,
        roundLength: round.roundLength,
        ground: round.ground,
        joints: [...joints]
          .sort((a, b) => a.seq - b.seq)
          .map((j) => ({
            id: j.id,
            kind: j.kind,
            dipDirection: j.dipDirection,
            dip: j.dip,
            setLabel: j.setLabel,
            setOverride: j.setOverride,
            spacingM: j.spacingM,
            faceOffset: j.faceOffset ?? null,
            seq: j.seq,
            jr: j.jr,
            ja: j.ja,
            apertureMm: j.apertureMm,
            infill: j.infill,
            thicknessM: j.thicknessM,
            sameAsJointId: j.sameAsJointId ?? null,
          })),
        qInput: round.qInput,
        rmrInput: round.rmrInput,
        gsiObserved: round.gsiObserved,
        recommendedClassId: round.recommendedClassId,
        setParameters: parameters,
        sketch: round.sketch,
      },
      {
        heading: headingGeometry(h, round.stage, round.faceChainage),
        supportClasses: classes,
        nearbyJoints: nearby,
        headingSets,
        // The class-change rule compares confirmed classes once the previous round is confirmed.
        previousRound: previous
          ? {
              classId: classOfRound(previous),
              ...(previousValues !== undefined ? { values: previousValues } : {}),
            }
          : null,
        rules,
        qTableEdition: project.qTableEdition,
        groundScale: project.groundScale,
        // The heading's open hazards as the register holds them now (the open-red-hazard rule reads them).
        openHazards: openHazards.map((z) => ({
          id: z.id,
          kind: z.kind,
          level: z.level,
          fromChainage: z.fromChainage,
          toChainage: z.toChainage,
          description: z.description,
        })),
        // The engineers' accepted standing conditions on the heading, judged now (range, date, condition).
        acceptances: { list: acceptances, at: new Date().toISOString() },
      },
    );
  }
}
