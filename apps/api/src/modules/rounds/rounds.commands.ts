import { randomUUID } from 'node:crypto';
import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  DEFAULT_SET_PARAMETERS,
  emptyGround,
  groundErrors,
  nextFaceChainage,
  restoreSketch,
  roundLengthOf,
  SKETCH_MAX_BYTES,
  SketchError,
  type SketchDocument,
  shiftOf,
  type RoundAssessment,
  type Stage,
} from '@roundbook/domain';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { isDeadlock, isDuplicateKey } from '../../common/errors/database-errors.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { priorResult, rememberResult } from '../../common/idempotency/idempotency.js';
import { auditDiff, objectDiff } from '../audit/audit-diff.js';
import { AuditService } from '../audit/audit.service.js';
import type { Heading } from '../headings/heading.entity.js';
import { ProjectsService } from '../projects/projects.service.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import { SupportClassesService } from '../support-classes/support-classes.service.js';
import type {
  CreateRoundDto,
  NextRoundDto,
  RoundDto,
  SaveRoundDto,
  SubmitRoundDto,
} from './dto/round.dto.js';
import { Joint } from './joint.entity.js';
import { readOrientation } from './orientation-reading.js';
import { classOfRound } from './review-rules.js';
import { RoundAssessor } from './round-assessor.service.js';
import { RoundRevision } from './round-revision.entity.js';
import { applyTransition, assertEditable, type RoundEvent } from './round-status.js';
import { Round } from './round.entity.js';
import { recordOf } from './rounds.mapper.js';
import { RoundsQueries } from './rounds.queries.js';
import { RoundsReview } from './rounds.review.js';
import { SketchRenders } from './sketch-render.service.js';

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
  'setParameters',
] as const;
const JOINT_FIELDS = [
  'kind',
  'orientationText',
  'notation',
  'setLabel',
  'setOverride',
  'spacingM',
  'persistenceM',
  'apertureMm',
  'jr',
  'jrc',
  'jrcMethod',
  'infill',
  'ja',
  'water',
  'thicknessM',
  'notes',
  'faceOffset',
  'sameAsJointId',
] as const;
const CREATE_SCOPE = 'round:create';

/** What the audit keeps of a joint: its editable fields and place in the list. */
function jointSnapshot(j: Joint): Record<string, unknown> {
  return { seq: j.seq, ...Object.fromEntries(JOINT_FIELDS.map((f) => [f, j[f] ?? null])) };
}

/** The round's ground with the fields of the save over it; fields the save leaves out are kept. */
function mergeGround(current: Round['ground'], patch: SaveRoundDto['ground']): Round['ground'] {
  const base = { ...emptyGround(), ...current };
  if (!patch) return base;
  const given = Object.entries(patch).filter(([, v]) => v !== undefined);
  return { ...base, ...Object.fromEntries(given) };
}

/**
 * The sketch of a save, checked and upgraded by packages/domain (restoreSketch): undefined keeps the
 * round's, null removes it; too large is a 413, not a sketch a 400 with the reason.
 */
function sketchOf(input: SaveRoundDto['sketch'], current: SketchDocument | null): SketchDocument | null {
  if (input === undefined) return current;
  if (input === null) return null;
  const bytes = Buffer.byteLength(JSON.stringify(input), 'utf8');
  if (bytes > SKETCH_MAX_BYTES)
    throw new DomainException(
      ErrorCode.PayloadTooLarge,
      `The sketch is ${Math.ceil(bytes / 1024)} KB; at most ${SKETCH_MAX_BYTES / 1024} KB is kept. Simplify long freehand traces or remove some.`,
    );
  try {
    return restoreSketch(input);
  } catch (error) {
    if (error instanceof SketchError)
      throw new DomainException(ErrorCode.ValidationFailed, error.message, {
        [`sketch.${error.path}`]: error.message,
      });
    throw error;
  }
}

/** A short account of a sketch for the audit (the document itself stays with the round and its revisions). */
const sketchSummary = (doc: SketchDocument | null): string | null =>
  doc === null ? null : `${doc.elements.length} element(s)`;

/** Stores the assessment and what is kept of it in columns (for listing, sorting and the Board). */
function storeAssessment(round: Round, assessment: RoundAssessment): void {
  round.assessment = assessment;
  round.assessmentVersion = assessment.version;
  round.q = assessment.ratings.q.value;
  round.rmr = assessment.ratings.rmr.value;
  round.gsi = assessment.ratings.gsi.value;
  round.triggerLevel = assessment.triggers.level;
  round.triggerFirings = assessment.triggers.firings;
  round.triggersNotEvaluated = assessment.triggers.notEvaluated.length;
}

/** Changes to rounds: open, save (drafts save as you go), submit. Status changes go through round-status.ts. */
@Injectable()
export class RoundsCommands {
  private readonly logger = new Logger('Rounds');
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(RoundsQueries) private readonly queries: RoundsQueries,
    @Inject(RoundAssessor) private readonly assessor: RoundAssessor,
    @Inject(ProjectsService) private readonly projects: ProjectsService,
    @Inject(SupportClassesService) private readonly supportClasses: SupportClassesService,
    @Inject(RoundsReview) private readonly review: RoundsReview,
    @Inject(SketchRenders) private readonly sketchRenders: SketchRenders,
  ) {}

  async next(access: ProjectAccess, headingId: string, stage: Stage): Promise<NextRoundDto> {
    const heading = await this.queries.heading(access, headingId);
    return this.nextFor(this.dataSource.manager, heading, stage);
  }

  /**
   * Opens a new round. Idempotent: a retried request with the same Idempotency-Key, or with the same client
   * round id, returns the round the first one made.
   */
  async create(
    caller: AuthUser,
    access: ProjectAccess,
    headingId: string,
    dto: CreateRoundDto,
    idempotencyKey: string | null = null,
  ): Promise<RoundDto> {
    // A duplicate key means another create won a race: two copies of one request (the loser then finds what
    // the winner made), or, on a Galera cluster, two rounds of the heading made at once on different nodes,
    // where the heading's row lock is local to each node and both read the same last round number (the loser
    // reads again and takes the next one). Found by the cluster proof; a few tries settle it. A deadlock
    // (1213) rolled the whole transaction back, so it is run again from BEGIN (stack-notes §13).
    for (let attempt = 1; ; attempt++) {
      try {
        return await this.createOnce(caller, access, headingId, dto, idempotencyKey);
      } catch (error) {
        const again =
          isDeadlock(error) || (isDuplicateKey(error) && (idempotencyKey !== null || dto.id !== undefined));
        if (!again || attempt >= 5) throw error;
        this.logger.warn(`A round create met a conflict (try ${attempt}): ${(error as Error).message}`);
      }
    }
  }

  private async createOnce(
    caller: AuthUser,
    access: ProjectAccess,
    headingId: string,
    dto: CreateRoundDto,
    idempotencyKey: string | null,
  ): Promise<RoundDto> {
    const id = await this.dataSource.transaction(async (manager) => {
      // The heading's lock comes first, so creates on one heading queue there. Taken after the key's lock
      // (a gap lock when the key is new), two creates each held a gap the other then inserted into: a
      // deadlock, found by `npm run faults` with four clients sending Idempotency-Keys.
      const heading = await this.queries.heading(access, headingId, manager, true);
      if (idempotencyKey !== null) {
        const prior = await priorResult(manager, caller.id, idempotencyKey, CREATE_SCOPE);
        if (prior !== null) return prior;
      }
      if (dto.id !== undefined) {
        const existing = await manager.findOne(Round, { where: { id: dto.id } });
        if (existing) {
          if (existing.projectId !== access.projectId || existing.headingId !== headingId)
            throw new DomainException(ErrorCode.Conflict, 'A round with this id already exists elsewhere.');
          return existing.id;
        }
      }
      if (!heading.stages.includes(dto.stage)) {
        throw new DomainException(
          ErrorCode.ValidationFailed,
          `Heading ${heading.code} does not use the ${dto.stage} stage.`,
          { stage: `Choose one of: ${heading.stages.join(', ')}.` },
        );
      }
      const next = await this.nextFor(manager, heading, dto.stage, { locking: true });
      const project = await this.projects.findProject(access.projectId, manager);
      const now = new Date();
      const round = manager.create(Round, {
        id: dto.id ?? randomUUID(),
        projectId: access.projectId,
        headingId,
        stage: dto.stage,
        roundNumber: next.roundNumber,
        faceChainage: dto.faceChainage,
        previousChainage: next.previousChainage,
        roundLength: roundLengthOf(dto.faceChainage, next.previousChainage, heading.chainageSense),
        ...shiftOf(now, project.timeZone),
        mappedBy: caller.id,
        mappedAt: now,
        distantParts: '',
        ground: emptyGround(),
        qInput: null,
        rmrInput: null,
        gsiObserved: null,
        sketch: null,
        q: null,
        rmr: null,
        gsi: null,
        recommendedClassId: null,
        nextRoundLength: null,
        recommendationReason: '',
        setParameters: DEFAULT_SET_PARAMETERS,
        status: 'draft',
        revision: 1,
        submittedAt: null,
      });
      // Assessed from the start, so its trigger panel speaks of the project's rules before the first save.
      storeAssessment(round, await this.assessor.assess(round, [], manager, heading));
      const saved = await manager.save(round);
      if (idempotencyKey !== null)
        await rememberResult(manager, caller.id, idempotencyKey, CREATE_SCOPE, saved.id);
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
    return this.queries.get(access, id);
  }

  /** Saves the whole editable record (drafts save as you go). Optimistic locking by version; joints kept by id. */
  async save(caller: AuthUser, access: ProjectAccess, roundId: string, dto: SaveRoundDto): Promise<RoundDto> {
    await this.dataSource.transaction(async (manager) => {
      const round = await this.queries.find(manager, access, roundId, true);
      await this.assertCurrent(manager, round, dto.version);
      assertEditable(round.status);
      const project = await this.projects.findProject(access.projectId, manager);
      if (dto.recommendedClassId) await this.supportClass(access, dto.recommendedClassId);
      const heading = await this.queries.heading(access, round.headingId, manager);
      const jointsBefore = await manager.find(Joint, { where: { roundId }, order: { seq: 'ASC' } });
      const jointsBeforeSnap = Object.fromEntries(jointsBefore.map((j) => [j.id, jointSnapshot(j)]));
      this.assertRecord(dto, mergeGround(round.ground, dto.ground), jointsBefore, project.groundScale);
      const sketchBefore = round.sketch ?? null;
      const sketch = sketchOf(dto.sketch, sketchBefore);
      const before = Object.fromEntries(AUDITED.map((f) => [f, round[f]]));
      // A field left out keeps what the round has: a partial save never erases anything.
      const keep = <K extends keyof SaveRoundDto & keyof Round>(k: K): Round[K] =>
        (dto[k] === undefined ? round[k] : dto[k]) as Round[K];
      const previousChainage = keep('previousChainage') ?? null;
      const faceChainage = keep('faceChainage');
      Object.assign(round, {
        faceChainage,
        previousChainage,
        // Positive in the drive direction, whichever way the heading's chainage runs.
        roundLength:
          previousChainage !== null
            ? roundLengthOf(faceChainage, previousChainage, heading.chainageSense)
            : (keep('roundLength') ?? null),
        shiftDate: keep('shiftDate'),
        shift: keep('shift'),
        distantParts: keep('distantParts'),
        ground: mergeGround(round.ground, dto.ground),
        qInput: keep('qInput') ?? null,
        rmrInput: keep('rmrInput') ?? null,
        gsiObserved: keep('gsiObserved') ?? null,
        sketch,
        recommendedClassId: keep('recommendedClassId') ?? null,
        nextRoundLength: keep('nextRoundLength') ?? null,
        recommendationReason: keep('recommendationReason'),
        setParameters: dto.setParameters
          ? { windowM: dto.setParameters.windowM, count: dto.setParameters.count ?? null }
          : (round.setParameters ?? DEFAULT_SET_PARAMETERS),
      });
      // Joints left out of the save are kept as they are (an empty list removes them all).
      const joints =
        dto.joints === undefined
          ? jointsBefore
          : await this.upsertJoints(manager, round, dto.joints, jointsBefore, project.defaultNotation);
      const assessment = await this.assessor.assess(round, joints, manager);
      // Joints without an override take the set the assessment found (the screen and triggers read the same).
      const relabel = joints.filter(
        (j) => !j.setOverride && (assessment.sets.membership[j.id] || null) !== j.setLabel,
      );
      for (const j of relabel) j.setLabel = assessment.sets.membership[j.id] || null;
      if (relabel.length) await manager.save(Joint, relabel);
      storeAssessment(round, assessment);
      await manager.save(round);
      const after = Object.fromEntries(AUDITED.map((f) => [f, round[f]]));
      // The audit keeps what changed, not copies: ground by field, joints by id (null where one was added or
      // removed); autosaves of one person in a run are one event.
      const change = auditDiff(
        before,
        after,
        AUDITED.filter((f) => f !== 'ground'),
      ) ?? {
        before: {},
        after: {},
      };
      const ground = objectDiff(
        before.ground as Record<string, unknown>,
        after.ground as Record<string, unknown>,
      );
      if (Object.keys(ground.after).length) {
        change.before.ground = ground.before;
        change.after.ground = ground.after;
      }
      if (JSON.stringify(sketchBefore) !== JSON.stringify(sketch)) {
        change.before.sketch = sketchSummary(sketchBefore);
        change.after.sketch = sketchSummary(sketch);
      }
      const jointsAfterSnap = Object.fromEntries(joints.map((j) => [j.id, jointSnapshot(j)]));
      const jointChange = objectDiff(jointsBeforeSnap, jointsAfterSnap);
      if (Object.keys(jointChange.after).length) {
        change.before.joints = jointChange.before;
        change.after.joints = jointChange.after;
      }
      if (Object.keys(change.after).length === 0) return; // nothing changed: nothing to record
      await this.audit.recordCoalesced(
        manager,
        {
          projectId: access.projectId,
          actorId: caller.id,
          entityType: 'round',
          entityId: roundId,
          action: 'save',
          before: change.before,
          after: change.after,
        },
        ['ground', 'joints'],
      );
    });
    return this.queries.get(access, roundId);
  }

  /**
   * The joints of the save, kept by id: ids already on the round are updated in place, new ids (or none)
   * inserted, joints left out removed. A joint's id never changes across saves.
   */
  private async upsertJoints(
    manager: EntityManager,
    round: Round,
    input: NonNullable<SaveRoundDto['joints']>,
    existing: Joint[],
    defaultNotation: Joint['notation'],
  ): Promise<Joint[]> {
    const byId = new Map(existing.map((j) => [j.id, j]));
    const wanted = input.map((j) => j.id).filter((id): id is string => id !== undefined);
    if (new Set(wanted).size !== wanted.length)
      throw new DomainException(ErrorCode.ValidationFailed, 'Two joints of the save have the same id.', {
        joints: 'Each joint needs its own id.',
      });
    const foreign = wanted.filter((id) => !byId.has(id));
    if (foreign.length) {
      const taken = await manager.count(Joint, { where: { id: In(foreign) } });
      if (taken > 0)
        throw new DomainException(ErrorCode.Conflict, 'A joint id of this save belongs to another round.', {
          joints: 'Make new ids for joints copied from another round.',
        });
    }
    const sameAs = await this.sameFeatureRoots(manager, round, input);
    const kept: Joint[] = input.map((j, i) => {
      const reading = readOrientation(j.orientationText, j.notation ?? defaultNotation);
      const joint =
        (j.id ? byId.get(j.id) : undefined) ?? manager.create(Joint, { id: j.id ?? randomUUID() });
      const values: Partial<Joint> = {
        roundId: round.id,
        headingId: round.headingId,
        faceChainage: round.faceChainage,
        seq: i + 1,
        dipDirection: 'error' in reading ? null : reading.dipDirection,
        dip: 'error' in reading ? null : reading.dip,
        orientationError: 'error' in reading ? reading.error.slice(0, 300) : null,
      };
      for (const f of JOINT_FIELDS)
        (values as Record<string, unknown>)[f] = j[f] ?? (f === 'setOverride' ? false : null);
      values.infill = j.infill;
      values.notes = j.notes;
      values.orientationText = j.orientationText;
      values.sameAsJointId = j.sameAsJointId ? (sameAs.get(j.sameAsJointId) ?? null) : null;
      return Object.assign(joint, values);
    });
    const keptIds = new Set(kept.map((j) => j.id));
    const removed = existing.filter((j) => !keptIds.has(j.id)).map((j) => j.id);
    if (removed.length) await manager.delete(Joint, { id: In(removed) });
    if (kept.length) await manager.save(Joint, kept);
    return kept;
  }

  /** Draft (or returned) → submitted, when the record is complete enough for the engineer; the assessment is frozen. */
  async submit(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    dto: SubmitRoundDto,
  ): Promise<RoundDto> {
    await this.dataSource.transaction(async (manager) => {
      const round = await this.queries.find(manager, access, roundId, true);
      await this.assertCurrent(manager, round, dto.version);
      assertEditable(round.status);
      const joints = await manager.find(Joint, { where: { roundId } });
      const assessment = await this.assessor.assess(round, joints, manager);
      const fields: Record<string, string> = {};
      const badJoints = joints.filter((j) => j.orientationError).sort((a, b) => a.seq - b.seq);
      if (badJoints.length)
        fields.joints = `Fix the orientation of joint ${badJoints.map((j) => j.seq).join(', ')} before submitting.`;
      if (assessment.ratings.q.value === null && assessment.ratings.rmr.value === null) {
        fields.ratings =
          assessment.ratings.q.error ??
          assessment.ratings.rmr.error ??
          'Rate the rock mass (Q or RMR89) before submitting.';
      }
      if (!round.recommendedClassId) fields.recommendedClassId = 'Choose the support class you recommend.';
      if (round.nextRoundLength === null) fields.nextRoundLength = 'Give the length of the next round.';
      if (round.recommendedClassId) {
        const c = await this.supportClass(access, round.recommendedClassId);
        if (c.retired) fields.recommendedClassId = `${c.code} is retired; choose an active class.`;
        if (round.nextRoundLength !== null && round.nextRoundLength > c.maxRoundLength) {
          fields.nextRoundLength = `${c.code} allows rounds of up to ${c.maxRoundLength} m.`;
        }
        // The suggestion is a class that fits both ratings, or (when none does) the more cautious one.
        const suggested =
          assessment.suggestedClassIds.includes(c.id) || assessment.suggestion.suggested === c.id;
        if (!suggested && round.recommendationReason.trim().length < 5) {
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
      const change = applyTransition(round, 'submit');
      round.submittedAt = new Date();
      storeAssessment(round, assessment);
      await manager.save(round);
      const revisionId = await this.freeze(manager, round, joints, 'submit', caller);
      // The picture of the frozen sketch, for reports and handovers (rendered by a job from the same document).
      if ((round.sketch?.elements.length ?? 0) > 0) await this.sketchRenders.enqueue(manager, revisionId);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'submit',
        before: { status: change.from },
        after: {
          status: change.to,
          recommendedClassId: round.recommendedClassId,
          nextRoundLength: round.nextRoundLength,
        },
      });
      // Resolves the last return's comments and tells the project's engineers (review notices).
      await this.review.onSubmitted(manager, round, caller);
    });
    return this.queries.get(access, roundId);
  }

  /** Keeps the record and its assessment as they are at this event (a revision that later edits never touch). */
  private async freeze(
    manager: EntityManager,
    round: Round,
    joints: Joint[],
    event: RoundEvent,
    caller: AuthUser,
  ): Promise<string> {
    const id = randomUUID();
    await manager.save(
      manager.create(RoundRevision, {
        id,
        roundId: round.id,
        revision: round.revision,
        event,
        status: round.status,
        record: recordOf(round, joints),
        assessment: round.assessment!,
        assessmentVersion: round.assessmentVersion!,
        createdBy: caller.id,
      }),
    );
    return id;
  }

  /**
   * "Same feature as" picks of a save, each resolved to the feature's first observation: the pick must be a
   * joint of another round of the same heading, and the feature must not be one of this round's own joints
   * (that would link the round to itself). Anything else is a 400 naming the joint.
   */
  private async sameFeatureRoots(
    manager: EntityManager,
    round: Round,
    input: NonNullable<SaveRoundDto['joints']>,
  ): Promise<Map<string, string>> {
    const picked = [...new Set(input.map((j) => j.sameAsJointId).filter((id): id is string => !!id))];
    const roots = new Map<string, string>();
    if (picked.length === 0) return roots;
    const targets = await manager.find(Joint, {
      where: { id: In(picked) },
      select: { id: true, roundId: true, headingId: true, sameAsJointId: true },
    });
    const byId = new Map(targets.map((t) => [t.id, t]));
    const own = new Set(input.map((j) => j.id).filter((id): id is string => !!id));
    input.forEach((j, i) => {
      if (!j.sameAsJointId) return;
      const t = byId.get(j.sameAsJointId);
      const problem =
        t === undefined || t.headingId !== round.headingId
          ? 'is linked to a feature that is not mapped on this heading'
          : t.roundId === round.id
            ? 'is linked to a joint of this same round (pick one mapped on an earlier round)'
            : own.has(t.sameAsJointId ?? t.id)
              ? 'is linked to a feature first mapped on this round'
              : null;
      if (problem !== null)
        throw new DomainException(ErrorCode.ValidationFailed, `Joint ${i + 1} ${problem}.`, {
          joints: `Joint ${i + 1} ${problem}.`,
        });
      roots.set(j.sameAsJointId, t!.sameAsJointId ?? t!.id);
    });
    return roots;
  }

  /**
   * The next round of the heading's stage. `locking` (inside a create's transaction): a locking read, which
   * sees the latest committed rounds. A plain read under REPEATABLE READ sees the snapshot taken at the
   * transaction's first read, before the heading's lock was granted, so a create that waited for another
   * read the same last number and failed on the unique key (found by the cluster proof with three
   * concurrent creates; on one server too).
   */
  private async nextFor(
    manager: EntityManager,
    heading: Heading,
    stage: Stage,
    { locking = false }: { locking?: boolean } = {},
  ): Promise<NextRoundDto> {
    const last = await manager.findOne(Round, {
      where: { headingId: heading.id, stage },
      order: { roundNumber: 'DESC' },
      ...(locking ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    });
    const previousChainage = last?.faceChainage ?? heading.startChainage;
    // The round is built under the class of the last round (confirmed, else recommended): suggest the smaller of
    // the planned length and what that class allows (issue 19 item 2).
    const classId = last ? classOfRound(last) : null;
    const lastClass =
      classId === null ? null : await manager.findOne(SupportClass, { where: { id: classId } });
    const allowed = lastClass === null ? null : Number(lastClass.maxRoundLength);
    const length =
      allowed === null ? heading.plannedRoundLength : Math.min(heading.plannedRoundLength, allowed);
    return {
      stage,
      roundNumber: (last?.roundNumber ?? 0) + 1,
      previousChainage,
      plannedRoundLength: heading.plannedRoundLength,
      allowedRoundLength: allowed,
      allowedByClassCode: lastClass?.code ?? null,
      suggestedFaceChainage: nextFaceChainage(previousChainage, length, heading.chainageSense),
    };
  }

  /**
   * Refusals of a save that the DTO cannot see alone: grades of the project's scale and unit shares that
   * make 100 % (packages/domain groundErrors), and a governing discontinuity that is a joint of this save.
   */
  private assertRecord(
    dto: SaveRoundDto,
    ground: Round['ground'],
    jointsBefore: Joint[],
    scale: 'isrm' | 'iso-14689',
  ): void {
    const fields = groundErrors(ground, scale);
    const q = (dto.qInput === undefined ? null : dto.qInput) as {
      governingJointId?: unknown;
      governingSetLabel?: unknown;
    } | null;
    if (q && q.governingJointId !== undefined && q.governingJointId !== null) {
      const ids = (dto.joints ?? jointsBefore).map((j) => j.id).filter((id) => id !== undefined);
      if (typeof q.governingJointId !== 'string' || !ids.includes(q.governingJointId))
        fields['qInput.governingJointId'] =
          'The governing discontinuity must be one of this round’s joints (by its id).';
    }
    if (
      q &&
      q.governingSetLabel !== undefined &&
      q.governingSetLabel !== null &&
      (typeof q.governingSetLabel !== 'string' || q.governingSetLabel.length > 20)
    )
      fields['qInput.governingSetLabel'] = 'The governing set is a set label such as S1.';
    if (Object.keys(fields).length)
      throw new DomainException(ErrorCode.ValidationFailed, Object.values(fields)[0], fields);
  }

  private async assertCurrent(manager: EntityManager, round: Round, version: number): Promise<void> {
    if (round.version !== version) {
      throw new DomainException(
        ErrorCode.StaleVersion,
        'Someone else saved this round since you opened it. Your typing is kept on this screen: compare it with their version, then save again.',
        undefined,
        { current: await this.queries.dto(manager, round) },
      );
    }
  }

  private async supportClass(access: ProjectAccess, id: string) {
    const c = (await this.supportClasses.classesOf(access.projectId)).find((x) => x.id === id);
    if (!c)
      throw new DomainException(ErrorCode.ValidationFailed, 'That support class is not in this project.', {
        recommendedClassId: 'Choose a class of this project.',
      });
    return c;
  }
}
