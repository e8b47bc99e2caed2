import { randomUUID } from 'node:crypto';
import { Inject, Injectable, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  formatChainageFor,
  noticeSettingOf,
  roundChanges,
  type FrozenRoundView,
  type TriggerFiring,
} from '@roundbook/domain';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { isDuplicateKey } from '../../common/errors/database-errors.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { JobHandlers } from '../../infrastructure/jobs/job-handlers.js';
import { JobsService } from '../../infrastructure/jobs/jobs.service.js';
import { NoticesService } from '../../infrastructure/mail/notices.service.js';
import { reviewEmail, type ReviewEmail } from '../../infrastructure/mail/templates/review.email.js';
import { AuditService } from '../audit/audit.service.js';
import { Heading } from '../headings/heading.entity.js';
import { NoticeSettingsService, type NoticeRecipient } from '../notice-settings/notice-settings.service.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Project } from '../projects/project.entity.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import { verifyPassword } from '../users/password.js';
import { User } from '../users/user.entity.js';
import type {
  AcknowledgeRuleDto,
  ConfirmRoundDto,
  CorrectRoundDto,
  ReturnRoundDto,
  ReviewCommentDto,
  ReviewDecisionDto,
  ReviewPermissionDto,
  ReviewQueueDto,
  ReviewQueueItemDto,
  RoundReviewDto,
  SincePreviousDto,
} from './dto/review.dto.js';
import { Joint } from './joint.entity.js';
import {
  byQueueOrder,
  confirmationErrors,
  MIN_REASON_LENGTH,
  REVIEW_CAUTION,
  ruleClocks,
} from './review-rules.js';
import {
  RoundComment,
  RoundDecision,
  REVIEW_SECTIONS,
  TriggerAcceptance,
  TriggerAcknowledgement,
  type ReviewDecision,
} from './round-review.entity.js';
import { RoundRevision } from './round-revision.entity.js';
import { applyTransition, canTransition, type RoundEvent } from './round-status.js';
import { Round } from './round.entity.js';
import { recordOf } from './rounds.mapper.js';
import { RoundsQueries } from './rounds.queries.js';

/** The job that checks, when a fired rule's timeframe runs out, whether its owner acknowledged it. */
export const RULE_DUE_JOB = 'review.rule-due';

const allowed: ReviewPermissionDto = { allowed: true, reason: '' };
const refused = (reason: string): ReviewPermissionDto => ({ allowed: false, reason });

/**
 * The engineer's review of a submitted round: confirm (signed with the password), return with comments per
 * section, correct after confirmation; the queue across the engineer's projects; and the notices each
 * decision sends. Nothing here confirms anything by itself: every change is one person's signed request.
 */
@Injectable()
export class RoundsReview implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(RoundsQueries) private readonly queries: RoundsQueries,
    @Inject(NoticesService) private readonly notices: NoticesService,
    @Inject(JobsService) private readonly jobs: JobsService,
    @Inject(JobHandlers) private readonly handlers: JobHandlers,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(NoticeSettingsService) private readonly noticeSettings: NoticeSettingsService,
  ) {}

  onModuleInit(): void {
    this.handlers.register(RULE_DUE_JOB, (payload) =>
      this.ruleDue(String(payload.roundId), String(payload.ruleId), Number(payload.revision)),
    );
  }

  /** The review of one round as the caller sees it (any member). */
  async review(caller: AuthUser, access: ProjectAccess, roundId: string): Promise<RoundReviewDto> {
    const manager = this.dataSource.manager;
    const round = await this.queries.find(manager, access, roundId);
    const [project, decisions, comments, authors, acks] = await Promise.all([
      manager.findOneByOrFail(Project, { id: access.projectId }),
      manager.find(RoundDecision, { where: { roundId }, order: { signedAt: 'ASC' } }),
      manager.find(RoundComment, { where: { roundId }, order: { createdAt: 'ASC' } }),
      this.authorsOf(manager, round),
      manager.find(TriggerAcknowledgement, { where: { roundId, revision: round.revision } }),
    ]);
    const acked = new Map(acks.map((a) => [a.ruleId, a]));
    const resolverIds = [...new Set(comments.map((c) => c.resolvedBy).filter((id): id is string => !!id))];
    const resolvers = resolverIds.length
      ? await manager.find(User, { where: { id: In(resolverIds) }, select: { id: true, name: true } })
      : [];
    // In the order of the round's sections, as the screen shows them.
    const toComment = (c: RoundComment): ReviewCommentDto => ({
      id: c.id,
      section: c.section,
      text: c.text,
      revision: c.revision,
      authorName: c.authorName,
      createdAt: c.createdAt.toISOString(),
      resolvedAt: c.resolvedAt?.toISOString() ?? null,
      resolvedByName: c.resolvedBy ? (resolvers.find((u) => u.id === c.resolvedBy)?.name ?? '') : null,
    });
    const ordered = [...comments].sort(
      (a, b) =>
        a.revision - b.revision ||
        REVIEW_SECTIONS.indexOf(a.section) - REVIEW_SECTIONS.indexOf(b.section) ||
        a.createdAt.getTime() - b.createdAt.getTime(),
    );
    const lastReturned = Math.max(0, ...comments.map((c) => c.revision));
    const acceptedHere = new Set(
      (
        await manager.find(TriggerAcceptance, {
          where: { roundId: round.id },
          select: { id: true },
        })
      ).map((a) => a.id),
    );
    const firings = round.triggerFirings ?? [];
    const reviewable = round.status === 'submitted' || round.status === 'confirmed';
    const clocks = round.submittedAt
      ? ruleClocks(
          firings,
          round.submittedAt,
          new Date(),
          new Map(acks.map((a) => [a.ruleId, a.acknowledgedAt])),
        )
      : [];
    const classes = await manager.find(SupportClass, { where: { projectId: access.projectId } });
    const codeOf = (id: string | null) => classes.find((c) => c.id === id)?.code ?? null;
    const toDecision = (d: RoundDecision): ReviewDecisionDto => ({
      id: d.id,
      decision: d.decision,
      revision: d.revision,
      classId: d.classId,
      classCode: codeOf(d.classId),
      roundLength: d.roundLength,
      recommendedClassId: d.recommendedClassId,
      reason: d.reason,
      comments: d.comments,
      signedByName: d.signedName,
      signedRole: d.signedRole,
      signedAt: d.signedAt.toISOString(),
    });
    const lastConfirm = [...decisions].reverse().find((d) => d.decision === 'confirm');
    const engineer = access.role === 'engineer';
    const notEngineer = refused('Only an engineer of the project confirms or returns a round.');
    const separation = project.separationOfDuties && authors.has(caller.id);
    return {
      roundId: round.id,
      status: round.status,
      revision: round.revision,
      version: round.version,
      recommendedClassId: round.recommendedClassId,
      recommendedRoundLength: round.nextRoundLength,
      confirmedClassId: round.confirmedClassId,
      confirmedRoundLength: round.confirmedRoundLength,
      confirmedAt: round.confirmedAt?.toISOString() ?? null,
      confirmation: round.status === 'confirmed' && lastConfirm ? toDecision(lastConfirm) : null,
      decisions: decisions.map(toDecision),
      openComments: ordered.filter((c) => c.resolvedAt === null).map(toComment),
      returnComments: ordered.filter((c) => c.revision === lastReturned).map(toComment),
      canConfirm: !engineer
        ? notEngineer
        : !canTransition(round.status, 'confirm')
          ? refused(`Only a submitted round can be confirmed; this one is ${round.status}.`)
          : separation
            ? refused(
                'You mapped or submitted this round, and the project keeps separation of duties (Setup): another engineer of the project confirms it. You may still return it with comments.',
              )
            : allowed,
      canReturn: !engineer
        ? notEngineer
        : !canTransition(round.status, 'return')
          ? refused(`Only a submitted round can be returned; this one is ${round.status}.`)
          : allowed,
      canCorrect:
        access.role !== 'engineer' && access.role !== 'geologist'
          ? refused('An engineer or a geologist of the project corrects a confirmed round.')
          : !canTransition(round.status, 'correct')
            ? refused('Only a confirmed round is corrected.')
            : allowed,
      canResolve: access.role === 'geologist' || access.role === 'engineer',
      canAcceptConditions: engineer,
      rules: reviewable
        ? clocks.map((c) => {
            const a = acked.get(c.ruleId);
            return {
              ...c,
              detail: firings.find((f) => f.ruleId === c.ruleId)?.detail ?? '',
              acknowledgement: a
                ? {
                    actionTaken: a.actionTaken,
                    note: a.note,
                    byName: a.acknowledgedName,
                    role: a.acknowledgedRole,
                    at: a.acknowledgedAt.toISOString(),
                  }
                : null,
              canAcknowledge: !a && access.role === c.ownerRole,
              canAccept: engineer,
            };
          })
        : [],
      acceptedRules: reviewable
        ? (round.assessment?.triggers.accepted ?? []).map((a) => ({
            ruleId: a.ruleId,
            level: a.level,
            summary: a.summary,
            detail: a.detail,
            acceptanceId: a.acceptanceId,
            reason: a.reason,
            acceptedByName: a.acceptedByName,
            acceptedAt: a.acceptedAt,
            fromChainage: a.fromChainage,
            toChainage: a.toChainage,
            until: a.until,
            acceptedHere: acceptedHere.has(a.acceptanceId),
          }))
        : [],
      lapsedAcceptances: reviewable ? (round.assessment?.triggers.lapsed ?? []) : [],
      separationOfDuties: project.separationOfDuties,
      sincePrevious: reviewable ? await this.sincePrevious(manager, round, classes) : null,
      caution: REVIEW_CAUTION,
    };
  }

  /**
   * What changed since the previous round of the heading and stage: this round's last frozen revision
   * against the previous round's last frozen one (domain roundChanges). Nothing is recomputed.
   */
  private async sincePrevious(
    manager: EntityManager,
    round: Round,
    classes: SupportClass[],
  ): Promise<SincePreviousDto> {
    const none = (note: string, prev?: Round): SincePreviousDto => ({
      previousRoundId: prev?.id ?? null,
      previousRoundNumber: prev?.roundNumber ?? null,
      previousRevision: null,
      changes: [],
      note,
    });
    if (round.roundNumber <= 1) return none('This is the first round of the heading at this stage.');
    const previous = await manager.findOne(Round, {
      where: { headingId: round.headingId, stage: round.stage, roundNumber: round.roundNumber - 1 },
      select: { id: true, roundNumber: true },
    });
    if (!previous) return none('The previous round of this stage is not recorded.');
    const latest = (roundId: string) =>
      manager.findOne(RoundRevision, {
        where: { roundId },
        order: { revision: 'DESC', createdAt: 'DESC' },
      });
    const [mine, theirs] = await Promise.all([latest(round.id), latest(previous.id)]);
    if (!theirs)
      return none(
        `Round ${previous.roundNumber} was never submitted: there is nothing frozen to compare.`,
        previous,
      );
    if (!mine) return none('This round has no frozen revision yet.', previous);
    const codeOf = (id: unknown) =>
      typeof id === 'string' ? (classes.find((c) => c.id === id)?.code ?? null) : null;
    const view = (rev: RoundRevision, roundNumber: number): FrozenRoundView => {
      const confirmed = rev.status === 'confirmed' && typeof rev.record.confirmedClassId === 'string';
      return {
        roundNumber,
        classCode: codeOf(confirmed ? rev.record.confirmedClassId : rev.record.recommendedClassId),
        classConfirmed: confirmed,
        assessment: rev.assessment,
      };
    };
    return {
      previousRoundId: previous.id,
      previousRoundNumber: previous.roundNumber,
      previousRevision: theirs.revision,
      changes: roundChanges(view(theirs, previous.roundNumber), view(mine, round.roundNumber)),
      note: '',
    };
  }

  /** Submitted → confirmed: the class and length to build, signed with the engineer's password. */
  async confirm(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    dto: ConfirmRoundDto,
  ): Promise<RoundReviewDto> {
    await this.dataSource.transaction(async (manager) => {
      const round = await this.lockCurrent(manager, access, roundId, dto.version);
      const change = applyTransition(round, 'confirm');
      const project = await manager.findOneByOrFail(Project, { id: access.projectId });
      if (project.separationOfDuties && (await this.authorsOf(manager, round)).has(caller.id))
        throw DomainException.forbidden(
          'You mapped or submitted this round, so another engineer confirms it (separation of duties).',
        );
      const chosen = await manager.findOne(SupportClass, {
        where: { id: dto.classId, projectId: access.projectId },
      });
      if (!chosen)
        throw new DomainException(ErrorCode.ValidationFailed, 'That support class is not in this project.', {
          classId: 'Choose a class of this project.',
        });
      const fields = confirmationErrors(dto, round.recommendedClassId, chosen);
      if (Object.keys(fields).length)
        throw new DomainException(ErrorCode.ValidationFailed, Object.values(fields)[0], fields);
      const signer = await this.signOff(manager, caller, dto.password);
      const now = new Date();
      round.confirmedClassId = chosen.id;
      round.confirmedRoundLength = dto.roundLength;
      round.confirmedAt = now;
      await manager.save(round);
      await this.freeze(manager, round, 'confirm', caller, round.revision);
      await this.decide(manager, round, 'confirm', signer, access, now, {
        classId: chosen.id,
        roundLength: dto.roundLength,
        reason: dto.reason.trim(),
        comments: dto.comments.trim(),
      });
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'confirm',
        before: { status: change.from, recommendedClassId: round.recommendedClassId },
        after: {
          status: change.to,
          revision: round.revision,
          confirmedClassId: chosen.id,
          confirmedRoundLength: dto.roundLength,
          reason: dto.reason.trim(),
          signedBy: signer.name,
          signedRole: access.role,
        },
      });
      if (chosen.id !== round.recommendedClassId) {
        const recommended = round.recommendedClassId
          ? await manager.findOneBy(SupportClass, { id: round.recommendedClassId })
          : null;
        await this.tellGeologist(manager, round, 'confirmed-other-class', caller, [
          `Confirmed class: ${chosen.code} (${chosen.name}); recommended: ${recommended?.code ?? 'none'}.`,
          `Next round length: ${dto.roundLength} m.`,
          `Reason: ${dto.reason.trim()}`,
          ...(dto.comments.trim() ? [`Comments: ${dto.comments.trim()}`] : []),
        ]);
      }
    });
    return this.review(caller, access, roundId);
  }

  /** Submitted → returned, a draft of a new revision, with comments per section for the geologist. */
  async return(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    dto: ReturnRoundDto,
  ): Promise<RoundReviewDto> {
    await this.dataSource.transaction(async (manager) => {
      const round = await this.lockCurrent(manager, access, roundId, dto.version);
      const returned = round.revision;
      const change = applyTransition(round, 'return');
      const now = new Date();
      await manager.save(round);
      await this.freeze(manager, round, 'return', caller, returned);
      const comments = dto.comments.map((c) =>
        manager.create(RoundComment, {
          id: randomUUID(),
          roundId,
          revision: returned,
          section: c.section,
          text: c.text.trim(),
          authorId: caller.id,
          authorName: caller.name,
          resolvedAt: null,
          resolvedBy: null,
        }),
      );
      await manager.save(comments);
      const text = comments.map((c) => `${c.section}: ${c.text}`).join('\n');
      await this.decide(manager, round, 'return', caller, access, now, {
        revision: returned,
        comments: text,
      });
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'return',
        before: { status: change.from, revision: returned },
        after: {
          status: change.to,
          revision: round.revision,
          comments: comments.map((c) => ({ section: c.section, text: c.text })),
        },
      });
      await this.tellGeologist(
        manager,
        round,
        'returned',
        caller,
        comments.map((c) => `${sectionWords[c.section] ?? c.section}: ${c.text}`),
      );
    });
    return this.review(caller, access, roundId);
  }

  /** Confirmed → draft of a new revision (reason required), which is reviewed again. */
  async correct(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    dto: CorrectRoundDto,
  ): Promise<RoundReviewDto> {
    if (dto.reason.trim().length < MIN_REASON_LENGTH)
      throw new DomainException(ErrorCode.ValidationFailed, 'Say why the confirmed round is corrected.', {
        reason: 'Say why the confirmed round is corrected.',
      });
    await this.dataSource.transaction(async (manager) => {
      const round = await this.lockCurrent(manager, access, roundId, dto.version);
      const corrected = round.revision;
      const before = {
        status: round.status,
        revision: corrected,
        confirmedClassId: round.confirmedClassId,
        confirmedRoundLength: round.confirmedRoundLength,
      };
      const change = applyTransition(round, 'correct');
      // The new revision is not confirmed: the class to build is asked again at its review.
      round.confirmedClassId = null;
      round.confirmedRoundLength = null;
      round.confirmedAt = null;
      round.submittedAt = null;
      await manager.save(round);
      await this.decide(manager, round, 'correct', caller, access, new Date(), {
        revision: corrected,
        reason: dto.reason.trim(),
      });
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'correct',
        before,
        after: { status: change.to, revision: round.revision, reason: dto.reason.trim() },
      });
    });
    return this.review(caller, access, roundId);
  }

  /** Marks one return comment resolved (the geologist, or an engineer). */
  async resolve(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    commentId: string,
  ): Promise<RoundReviewDto> {
    await this.dataSource.transaction(async (manager) => {
      await this.queries.find(manager, access, roundId);
      const comment = await manager.findOne(RoundComment, { where: { id: commentId, roundId } });
      if (!comment) throw DomainException.notFound('The comment');
      if (comment.resolvedAt) return;
      comment.resolvedAt = new Date();
      comment.resolvedBy = caller.id;
      await manager.save(comment);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'resolve-comment',
        after: { commentId, section: comment.section, revision: comment.revision, text: comment.text },
      });
    });
    return this.review(caller, access, roundId);
  }

  /** A fired rule of a submitted or confirmed round, acknowledged by the role that owns it (audited). */
  async acknowledge(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    ruleId: string,
    dto: AcknowledgeRuleDto,
  ): Promise<RoundReviewDto> {
    try {
      await this.dataSource.transaction(async (manager) => {
        const round = await this.queries.find(manager, access, roundId, true);
        if (round.status !== 'submitted' && round.status !== 'confirmed')
          throw new DomainException(
            ErrorCode.Conflict,
            `The rules of a ${round.status} round are acknowledged once it is submitted.`,
          );
        const firing = (round.triggerFirings ?? []).find((f) => f.ruleId === ruleId);
        if (!firing) throw DomainException.notFound('A fired rule with that id on this round');
        if (access.role !== firing.ownerRole)
          throw DomainException.forbidden(
            `This rule is owned by the ${firing.ownerRole}; they acknowledge it.`,
          );
        const now = new Date();
        await manager.insert(TriggerAcknowledgement, {
          id: randomUUID(),
          roundId,
          projectId: access.projectId,
          ruleId,
          revision: round.revision,
          level: firing.level,
          actionTaken: dto.actionTaken.trim(),
          note: dto.note.trim(),
          acknowledgedBy: caller.id,
          acknowledgedName: caller.name,
          acknowledgedRole: access.role,
          acknowledgedAt: now,
        });
        await this.audit.record(manager, {
          projectId: access.projectId,
          actorId: caller.id,
          entityType: 'round',
          entityId: roundId,
          action: 'acknowledge-trigger',
          after: {
            ruleId,
            revision: round.revision,
            level: firing.level,
            summary: firing.summary,
            actionTaken: dto.actionTaken.trim(),
            note: dto.note.trim(),
          },
        });
      });
    } catch (error) {
      if (isDuplicateKey(error))
        throw new DomainException(ErrorCode.Conflict, 'This rule was already acknowledged on this revision.');
      throw error;
    }
    return this.review(caller, access, roundId);
  }

  /**
   * Called by submit inside its transaction: the project's engineers are told a round waits for them. The
   * return comments stay as they are: each stays open until someone marks it resolved, and the next review
   * shows which were resolved and which are still open.
   */
  async onSubmitted(manager: EntityManager, round: Round, caller: AuthUser): Promise<void> {
    const engineers = await manager
      .createQueryBuilder(ProjectMember, 'm')
      .innerJoin(User, 'u', 'u.id = m.user_id')
      .select(['u.id AS userId', 'u.email AS email'])
      .where('m.project_id = :projectId', { projectId: round.projectId })
      .andWhere("m.role = 'engineer'")
      .getRawMany<NoticeRecipient>();
    // Each fired rule's timeframe is checked when it runs out (a job per rule and revision).
    const submittedAt = round.submittedAt ?? new Date();
    for (const f of round.triggerFirings ?? []) {
      await this.jobs.enqueue(manager, {
        kind: RULE_DUE_JOB,
        payload: { roundId: round.id, ruleId: f.ruleId, revision: round.revision },
        runAt: new Date(submittedAt.getTime() + f.timeAllowedHours * 3_600_000),
        dedupeKey: `rule-due:${round.id}:${round.revision}:${f.ruleId}`,
      });
    }
    if (engineers.length === 0) return;
    const ctx = await this.context(manager, round);
    const cls = round.recommendedClassId
      ? await manager.findOneBy(SupportClass, { id: round.recommendedClassId })
      : null;
    const firings = round.triggerFirings ?? [];
    await this.send(manager, round, ctx, 'submitted', caller.name, engineers, [
      `Recommended class: ${cls?.code ?? 'none'}; next round length: ${round.nextRoundLength ?? '—'} m.`,
      `Trigger level: ${round.triggerLevel ?? 'not assessed'}${firings.length ? ` (${firings.map((f: TriggerFiring) => f.summary).join('; ')})` : ''}.`,
      `Revision ${round.revision}.`,
    ]);
  }

  /**
   * The RULE_DUE_JOB handler: when a fired rule's time is up and its owner has not acknowledged it on that
   * revision (and the round was not returned or corrected since), the project's engineers and the members
   * of the owning role are told.
   */
  async ruleDue(roundId: string, ruleId: string, revision: number): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const round = await manager.findOne(Round, { where: { id: roundId } });
      if (!round || round.revision !== revision) return;
      if (round.status !== 'submitted' && round.status !== 'confirmed') return;
      const firing = (round.triggerFirings ?? []).find((f) => f.ruleId === ruleId);
      if (!firing) return;
      const acked = await manager.count(TriggerAcknowledgement, { where: { roundId, ruleId, revision } });
      if (acked > 0) return;
      const people = await manager
        .createQueryBuilder(ProjectMember, 'm')
        .innerJoin(User, 'u', 'u.id = m.user_id')
        .select(['u.id AS userId', 'u.email AS email'])
        .where('m.project_id = :projectId', { projectId: round.projectId })
        .andWhere('m.role IN (:...roles)', { roles: [...new Set(['engineer', firing.ownerRole])] })
        .getRawMany<NoticeRecipient>();
      if (people.length === 0) return;
      await this.send(manager, round, await this.context(manager, round), 'rule-overdue', '', people, [
        `Rule: ${firing.summary} (${firing.level}).`,
        `What to do: ${firing.action}`,
        `Owner: ${firing.ownerRole}; time allowed: ${firing.timeAllowedHours} h from the submit.`,
      ]);
    });
  }

  /** Submitted rounds of every project where the caller is an engineer: red first, then oldest. */
  async queue(caller: AuthUser, headingId?: string, now = new Date()): Promise<ReviewQueueDto> {
    const manager = this.dataSource.manager;
    const memberships = await manager.find(ProjectMember, {
      where: { userId: caller.id, role: 'engineer' },
      select: { projectId: true },
    });
    if (memberships.length === 0) return { items: [], caution: REVIEW_CAUTION };
    const rounds = await manager.find(Round, {
      where: {
        projectId: In(memberships.map((m) => m.projectId)),
        status: 'submitted',
        ...(headingId ? { headingId } : {}),
      },
      select: {
        id: true,
        projectId: true,
        headingId: true,
        roundNumber: true,
        faceChainage: true,
        stage: true,
        mappedBy: true,
        submittedAt: true,
        triggerLevel: true,
        triggerFirings: true,
        recommendedClassId: true,
        revision: true,
      },
      take: 1000,
    });
    if (rounds.length === 0) return { items: [], caution: REVIEW_CAUTION };
    const ids = (pick: (r: Round) => string | null) => [
      ...new Set(rounds.map(pick).filter((id): id is string => id !== null)),
    ];
    const classIds = ids((r) => r.recommendedClassId);
    const [projects, headings, users, classes, acks] = await Promise.all([
      manager.find(Project, { where: { id: In(ids((r) => r.projectId)) } }),
      manager.find(Heading, { where: { id: In(ids((r) => r.headingId)) } }),
      manager.find(User, { where: { id: In(ids((r) => r.mappedBy)) }, select: { id: true, name: true } }),
      classIds.length
        ? manager.find(SupportClass, { where: { id: In(classIds) }, select: { id: true, code: true } })
        : Promise.resolve([]),
      manager.find(TriggerAcknowledgement, {
        where: { roundId: In(rounds.map((r) => r.id)) },
        select: { roundId: true, ruleId: true, revision: true, acknowledgedAt: true },
      }),
    ]);
    const items: ReviewQueueItemDto[] = rounds.map((r) => {
      const p = projects.find((x) => x.id === r.projectId)!;
      const h = headings.find((x) => x.id === r.headingId)!;
      const submittedAt = r.submittedAt ?? now;
      return {
        roundId: r.id,
        projectId: r.projectId,
        projectCode: p.code,
        projectName: p.name,
        headingId: r.headingId,
        headingCode: h.code,
        roundNumber: r.roundNumber,
        faceChainage: r.faceChainage,
        chainageText: formatChainageFor(r.faceChainage, h),
        stage: r.stage,
        geologistName: users.find((u) => u.id === r.mappedBy)?.name ?? '',
        submittedAt: submittedAt.toISOString(),
        minutesWaiting: Math.max(0, Math.floor((now.getTime() - submittedAt.getTime()) / 60_000)),
        triggerLevel: r.triggerLevel,
        rules: ruleClocks(
          r.triggerFirings ?? [],
          submittedAt,
          now,
          new Map(
            acks
              .filter((a) => a.roundId === r.id && a.revision === r.revision)
              .map((a) => [a.ruleId, a.acknowledgedAt]),
          ),
        ),
        recommendedClassCode: classes.find((c) => c.id === r.recommendedClassId)?.code ?? null,
        revision: r.revision,
      };
    });
    items.sort((a, b) => byQueueOrder({ ...a, id: a.roundId }, { ...b, id: b.roundId }));
    return { items, caution: REVIEW_CAUTION };
  }

  // --- helpers ---

  private async lockCurrent(
    manager: EntityManager,
    access: ProjectAccess,
    roundId: string,
    version: number,
  ): Promise<Round> {
    const round = await this.queries.find(manager, access, roundId, true);
    if (round.version !== version)
      throw new DomainException(
        ErrorCode.StaleVersion,
        'The round changed since you opened it: read it again before deciding.',
        undefined,
        { current: await this.queries.dto(manager, round) },
      );
    return round;
  }

  /** Who mapped the round or submitted any of its revisions (they may not confirm it themselves). */
  private async authorsOf(manager: EntityManager, round: Round): Promise<Set<string>> {
    const submits = await manager.find(RoundRevision, {
      where: { roundId: round.id, event: 'submit' },
      select: { createdBy: true },
    });
    return new Set([round.mappedBy, ...submits.map((s) => s.createdBy)]);
  }

  /** The sign-off: the caller's password, asked again. A wrong one is refused (403) and nothing changes. */
  private async signOff(manager: EntityManager, caller: AuthUser, password: string): Promise<AuthUser> {
    const user = await manager.findOne(User, { where: { id: caller.id } });
    if (!user || !(await verifyPassword(user.passwordHash, password)))
      throw new DomainException(
        ErrorCode.Forbidden,
        'That password is not right: the confirmation was not signed.',
        { password: 'Type your own Roundbook password to sign.' },
      );
    return { id: user.id, email: user.email, name: user.name };
  }

  private async freeze(
    manager: EntityManager,
    round: Round,
    event: RoundEvent,
    caller: AuthUser,
    revision: number,
  ): Promise<void> {
    const joints = await manager.find(Joint, { where: { roundId: round.id } });
    await manager.save(
      manager.create(RoundRevision, {
        id: randomUUID(),
        roundId: round.id,
        revision,
        event,
        status: round.status,
        record: {
          ...recordOf(round, joints),
          confirmedClassId: round.confirmedClassId,
          confirmedRoundLength: round.confirmedRoundLength,
        },
        assessment: round.assessment!,
        assessmentVersion: round.assessmentVersion!,
        createdBy: caller.id,
      }),
    );
  }

  private async decide(
    manager: EntityManager,
    round: Round,
    decision: ReviewDecision,
    signer: AuthUser,
    access: ProjectAccess,
    at: Date,
    values: Partial<Pick<RoundDecision, 'classId' | 'roundLength' | 'reason' | 'comments' | 'revision'>>,
  ): Promise<void> {
    await manager.save(
      manager.create(RoundDecision, {
        id: randomUUID(),
        roundId: round.id,
        projectId: round.projectId,
        revision: round.revision,
        decision,
        classId: null,
        roundLength: null,
        recommendedClassId: round.recommendedClassId,
        reason: '',
        comments: '',
        signedBy: signer.id,
        signedName: signer.name,
        signedRole: access.role,
        signedAt: at,
        ...values,
      }),
    );
  }

  private async context(manager: EntityManager, round: Round) {
    const [project, heading] = await Promise.all([
      manager.findOneByOrFail(Project, { id: round.projectId }),
      manager.findOneByOrFail(Heading, { id: round.headingId }),
    ]);
    const title = `${heading.code} round ${round.roundNumber} (${round.stage}) at ${formatChainageFor(round.faceChainage, heading)}`;
    return { project, title };
  }

  private async tellGeologist(
    manager: EntityManager,
    round: Round,
    kind: 'returned' | 'confirmed-other-class',
    caller: AuthUser,
    lines: string[],
  ): Promise<void> {
    const geologist = await manager.findOne(User, {
      where: { id: round.mappedBy },
      select: { id: true, email: true },
    });
    if (!geologist) return;
    await this.send(
      manager,
      round,
      await this.context(manager, round),
      kind,
      caller.name,
      [{ userId: geologist.id, email: geologist.email }],
      lines,
    );
  }

  private async send(
    manager: EntityManager,
    round: Round,
    ctx: { project: Project; title: string },
    kind: ReviewEmail['kind'],
    actorName: string,
    people: NoticeRecipient[],
    lines: string[],
  ): Promise<void> {
    const red = round.triggerLevel === 'red' && (kind === 'submitted' || kind === 'rule-overdue');
    // Each person's notice settings for the project; a red notice goes to everyone it concerns.
    const to = await this.noticeSettings.recipients(
      manager,
      round.projectId,
      noticeSettingOf(kind),
      people,
      red,
    );
    if (to.length === 0) return;
    const message = reviewEmail({
      kind,
      projectName: ctx.project.name,
      roundTitle: ctx.title,
      actorName,
      link: `${this.config.appUrl}/projects/${round.projectId}/rounds/${round.id}`,
      lines,
      red,
    });
    await this.notices.queue(manager, { kind: `round-${kind}`, projectId: round.projectId, to, ...message });
  }
}

const sectionWords: Record<string, string> = {
  position: 'Position',
  ground: 'Ground',
  joints: 'Joints',
  ratings: 'Ratings',
  support: 'Support',
  triggers: 'Triggers',
  general: 'General',
};
