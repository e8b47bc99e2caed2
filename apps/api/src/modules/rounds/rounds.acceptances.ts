import { randomUUID } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  acceptanceErrors,
  applyAcceptances,
  conditionSnapshot,
  type RoundAssessment,
  type TriggerFiring,
} from '@roundbook/domain';
import { DataSource, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { AuditService } from '../audit/audit.service.js';
import { headingGeometry } from '../headings/heading-geometry.js';
import { Heading } from '../headings/heading.entity.js';
import { TriggerRule } from '../trigger-rules/trigger-rule.entity.js';
import { activeAcceptances } from './acceptances.read.js';
import type { AcceptConditionDto, RoundReviewDto } from './dto/review.dto.js';
import { TriggerAcceptance } from './round-review.entity.js';
import type { Round } from './round.entity.js';
import { RoundsQueries } from './rounds.queries.js';
import { RoundsReview } from './rounds.review.js';

/**
 * Accepting a fired rule's standing condition (issue 11, item 3), and withdrawing an acceptance. Each is
 * an engineer's signed request, audited; the round it was taken on has its level worked out again from its
 * stored firings (nothing of the frozen revision changes), and later rounds of the heading read the
 * acceptance when they are assessed.
 */
@Injectable()
export class RoundsAcceptances {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(RoundsQueries) private readonly queries: RoundsQueries,
    @Inject(RoundsReview) private readonly review: RoundsReview,
  ) {}

  async accept(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    ruleId: string,
    dto: AcceptConditionDto,
  ): Promise<RoundReviewDto> {
    await this.dataSource.transaction(async (manager) => {
      const round = await this.queries.find(manager, access, roundId, true);
      if (round.status !== 'submitted' && round.status !== 'confirmed')
        throw new DomainException(
          ErrorCode.Conflict,
          `A standing condition is accepted on a submitted or confirmed round; this one is ${round.status}.`,
        );
      const firing = (round.triggerFirings ?? []).find((f) => f.ruleId === ruleId);
      if (!firing) {
        const held = (round.assessment?.triggers.accepted ?? []).some((a) => a.ruleId === ruleId);
        if (held)
          throw new DomainException(ErrorCode.Conflict, 'This rule is already accepted on this round.');
        throw DomainException.notFound('A fired rule with that id on this round');
      }
      const input = {
        fromChainage: dto.fromChainage ?? null,
        toChainage: dto.toChainage ?? null,
        until: dto.until ?? null,
        reason: dto.reason,
      };
      const now = new Date();
      const fields = acceptanceErrors(firing.level, input, now);
      if (Object.keys(fields).length)
        throw new DomainException(ErrorCode.ValidationFailed, Object.values(fields)[0], fields);
      const [rule, heading] = await Promise.all([
        manager.findOne(TriggerRule, { where: { id: ruleId, projectId: access.projectId } }),
        manager.findOneByOrFail(Heading, { id: round.headingId }),
      ]);
      const facts = round.assessment?.facts;
      const snapshot =
        rule && facts
          ? conditionSnapshot(rule, facts, headingGeometry(heading, round.stage, round.faceChainage))
          : null;
      if (!snapshot)
        throw new DomainException(
          ErrorCode.Conflict,
          'This rule, as it is set up now, no longer fires on the round’s record: there is no condition to accept.',
        );
      const row = manager.create(TriggerAcceptance, {
        id: randomUUID(),
        projectId: access.projectId,
        headingId: round.headingId,
        ruleId,
        roundId,
        revision: round.revision,
        level: firing.level,
        fromChainage: input.fromChainage,
        toChainage: input.toChainage,
        until: input.until ? new Date(input.until) : null,
        reason: input.reason.trim(),
        snapshot,
        acceptedBy: caller.id,
        acceptedName: caller.name,
        acceptedAt: now,
        withdrawnAt: null,
        withdrawnBy: null,
      });
      await manager.save(row);
      const before = round.triggerLevel;
      await this.reapply(manager, round, heading, now);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'accept-condition',
        before: { triggerLevel: before },
        after: {
          acceptanceId: row.id,
          ruleId,
          level: firing.level,
          summary: firing.summary,
          fromChainage: row.fromChainage,
          toChainage: row.toChainage,
          until: input.until,
          reason: row.reason,
          snapshot,
          triggerLevel: round.triggerLevel,
        },
      });
    });
    return this.review.review(caller, access, roundId);
  }

  async withdraw(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    acceptanceId: string,
  ): Promise<RoundReviewDto> {
    await this.dataSource.transaction(async (manager) => {
      const round = await this.queries.find(manager, access, roundId, true);
      const row = await manager.findOne(TriggerAcceptance, {
        where: { id: acceptanceId, projectId: access.projectId, headingId: round.headingId },
      });
      if (!row) throw DomainException.notFound('The acceptance');
      if (row.withdrawnAt) return;
      const now = new Date();
      row.withdrawnAt = now;
      row.withdrawnBy = caller.id;
      await manager.save(row);
      const heading = await manager.findOneByOrFail(Heading, { id: round.headingId });
      const before = round.triggerLevel;
      await this.reapply(manager, round, heading, now);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'round',
        entityId: roundId,
        action: 'withdraw-acceptance',
        before: { triggerLevel: before },
        after: { acceptanceId, ruleId: row.ruleId, triggerLevel: round.triggerLevel },
      });
    });
    return this.review.review(caller, access, roundId);
  }

  /**
   * The round's stored firings (raised and accepted) read again against the heading's active acceptances
   * (domain applyAcceptances); its level, firings and stored trigger assessment are updated. Its record and
   * frozen revisions are not touched, and nothing is recomputed from the record.
   */
  private async reapply(manager: EntityManager, round: Round, heading: Heading, at: Date): Promise<void> {
    const assessment = round.assessment;
    if (!assessment) return;
    const accepted = assessment.triggers.accepted ?? [];
    const all: TriggerFiring[] = [
      ...(round.triggerFirings ?? []),
      ...accepted.map((a): TriggerFiring => ({
        ruleId: a.ruleId,
        level: a.level,
        summary: a.summary,
        detail: a.detail,
        action: a.action,
        ownerRole: a.ownerRole,
        timeAllowedHours: a.timeAllowedHours,
      })),
    ];
    const rules = await manager.find(TriggerRule, { where: { projectId: round.projectId } });
    const list = await activeAcceptances(manager, round.headingId);
    const triggers = applyAcceptances(
      { ...assessment.triggers, firings: all, accepted: [], lapsed: [] },
      rules,
      assessment.facts,
      headingGeometry(heading, round.stage, round.faceChainage),
      list,
      at,
    );
    const next: RoundAssessment = { ...assessment, triggers, acceptances: list };
    round.assessment = next;
    round.triggerLevel = triggers.level;
    round.triggerFirings = triggers.firings;
    await manager.save(round);
  }
}
