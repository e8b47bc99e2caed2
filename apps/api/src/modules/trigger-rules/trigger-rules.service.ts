import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  evaluateRuleOutcome,
  previousRoundValues,
  triggerRuleErrors,
  triggerRuleSummary,
  WAITING_RULES,
  type RoundFacts,
} from '@roundbook/domain';
import { DataSource, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { definedOnly } from '../../common/dto/defined-only.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { ROUNDS_READ, type RoundsReadPort } from '../../common/ports/rounds-read.port.js';
import { auditDiff, auditSnapshot } from '../audit/audit-diff.js';
import { AuditService } from '../audit/audit.service.js';
import { headingGeometry } from '../headings/heading-geometry.js';
import { Heading } from '../headings/heading.entity.js';
import type {
  CreateTriggerRuleDto,
  TriggerPreviewDto,
  TriggerRuleDto,
  UpdateTriggerRuleDto,
} from './dto/trigger-rule.dto.js';
import { TriggerRule } from './trigger-rule.entity.js';

const FIELDS = [
  'watch',
  'comparison',
  'threshold',
  'fires',
  'level',
  'action',
  'ownerRole',
  'timeAllowedHours',
  'enabled',
] as const satisfies ReadonlyArray<keyof TriggerRule>;
const LEVEL_ORDER = { red: 0, amber: 1, green: 2 } as const;

const toDto = (r: TriggerRule): TriggerRuleDto => ({
  id: r.id,
  watch: r.watch,
  comparison: r.comparison,
  threshold: r.threshold,
  fires: r.fires,
  level: r.level,
  action: r.action,
  ownerRole: r.ownerRole,
  timeAllowedHours: r.timeAllowedHours,
  enabled: r.enabled,
  summary: triggerRuleSummary(r),
  version: r.version,
});

@Injectable()
export class TriggerRulesService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(ROUNDS_READ) private readonly rounds: RoundsReadPort,
  ) {}

  /** The project's rules, for another module (rounds evaluate them on every save). */
  /** `manager`: the caller's transaction (see ProjectsService.findProject). */
  rulesOf(projectId: string, manager: EntityManager = this.dataSource.manager): Promise<TriggerRule[]> {
    return manager.getRepository(TriggerRule).find({ where: { projectId } });
  }

  async list(access: ProjectAccess): Promise<TriggerRuleDto[]> {
    const rules = await this.dataSource
      .getRepository(TriggerRule)
      .find({ where: { projectId: access.projectId }, order: { createdAt: 'ASC' } });
    return rules.sort((a, b) => LEVEL_ORDER[a.level] - LEVEL_ORDER[b.level]).map(toDto);
  }

  async create(caller: AuthUser, access: ProjectAccess, dto: CreateTriggerRuleDto): Promise<TriggerRuleDto> {
    return this.dataSource.transaction(async (manager) => {
      const rule = manager.create(TriggerRule, {
        comparison: null,
        threshold: null,
        fires: 'value',
        enabled: true,
        ...definedOnly(dto),
        projectId: access.projectId,
      });
      this.assertValid(rule);
      const saved = await manager.save(rule);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'trigger-rule',
        entityId: saved.id,
        action: 'create',
        after: auditSnapshot(saved, FIELDS),
      });
      return toDto(saved);
    });
  }

  async update(
    caller: AuthUser,
    access: ProjectAccess,
    id: string,
    dto: UpdateTriggerRuleDto,
  ): Promise<TriggerRuleDto> {
    return this.dataSource.transaction(async (manager) => {
      const rule = await this.find(manager, access, id);
      if (rule.version !== dto.version) {
        throw new DomainException(
          ErrorCode.StaleVersion,
          'Someone else changed this rule since you opened it. Review their version, then apply your change again.',
          undefined,
          {
            current: toDto(rule),
          },
        );
      }
      const before = { ...rule };
      const { version: _v, ...changes } = definedOnly(dto);
      Object.assign(rule, changes);
      this.assertValid(rule);
      const diff = auditDiff(before, rule, FIELDS);
      if (!diff) return toDto(before);
      const saved = await manager.save(rule);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'trigger-rule',
        entityId: id,
        action: 'update',
        ...diff,
      });
      return toDto(saved);
    });
  }

  async remove(caller: AuthUser, access: ProjectAccess, id: string): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const rule = await this.find(manager, access, id);
      await manager.delete(TriggerRule, { id });
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'trigger-rule',
        entityId: id,
        action: 'delete',
        before: auditSnapshot(rule, FIELDS),
      });
    });
  }

  /** How the rule would have fired on each heading's latest rounds, without saving it. */
  async preview(
    access: ProjectAccess,
    dto: CreateTriggerRuleDto,
    perHeading = 50,
  ): Promise<TriggerPreviewDto> {
    const rule = this.dataSource.manager.create(TriggerRule, {
      comparison: null,
      threshold: null,
      fires: 'value',
      ...definedOnly(dto),
    });
    this.assertValid(rule);
    const waiting = WAITING_RULES[rule.watch];
    if (waiting !== undefined) {
      return { evaluatedRounds: 0, matches: [], notEvaluated: waiting };
    }
    const headings = await this.dataSource
      .getRepository(Heading)
      .find({ where: { projectId: access.projectId }, order: { code: 'ASC' } });
    const byId = new Map(headings.map((h) => [h.id, h]));
    // The facts each round's assessment stored at its last save: the same ones its own level came from.
    const rows = await this.rounds.latestFacts(
      headings.map((h) => h.id),
      perHeading,
    );
    const matches: TriggerPreviewDto['matches'] = [];
    let evaluated = 0;
    const key = (headingId: string, stage: string, roundNumber: number) =>
      `${headingId}|${stage}|${roundNumber}`;
    const byRound = new Map(rows.map((r) => [key(r.headingId, r.stage, r.roundNumber), r]));
    for (const r of rows) {
      const heading = byId.get(r.headingId)!;
      // A change rule on facts saved before they kept the last round's values: read them from the previous
      // round of the heading and stage when it is among the rounds checked.
      const before = byRound.get(key(r.headingId, r.stage, r.roundNumber - 1));
      const facts: RoundFacts =
        rule.fires === 'change' && r.facts.previous === undefined && before
          ? {
              ...r.facts,
              previous: previousRoundValues(
                before.facts,
                headingGeometry(heading, before.stage, before.faceChainage),
              ),
            }
          : r.facts;
      // The heading as the round's own assessment read it: the drive at its face (the tangent of a curved
      // alignment), not the drive at the heading's start.
      const outcome = evaluateRuleOutcome(rule, facts, headingGeometry(heading, r.stage, r.faceChainage));
      if (outcome.state === 'fired' || outcome.state === 'clear') evaluated++;
      if (outcome.state === 'fired') {
        matches.push({
          roundId: r.roundId,
          headingCode: heading.code,
          roundNumber: r.roundNumber,
          stage: r.stage,
          faceChainage: r.faceChainage,
          shiftDate: r.shiftDate,
          value: outcome.value,
          detail: outcome.detail,
        });
      }
    }
    // Matches in the order the rounds came (heading by code, newest first).
    const order = new Map(headings.map((h, i) => [h.code, i]));
    matches.sort((a, b) => (order.get(a.headingCode) ?? 0) - (order.get(b.headingCode) ?? 0));
    return {
      evaluatedRounds: evaluated,
      matches,
      notEvaluated:
        evaluated < rows.length
          ? `${rows.length - evaluated} of the ${rows.length} latest rounds lack what this rule reads, so it was not evaluated on them.`
          : null,
    };
  }

  private assertValid(rule: TriggerRule): void {
    const errors = triggerRuleErrors(rule);
    if (Object.keys(errors).length)
      throw new DomainException(ErrorCode.ValidationFailed, Object.values(errors)[0], errors);
  }

  private async find(manager: EntityManager, access: ProjectAccess, id: string): Promise<TriggerRule> {
    const rule = await manager.findOne(TriggerRule, {
      where: { id, projectId: access.projectId },
      lock: { mode: 'pessimistic_write' },
    });
    if (!rule) throw DomainException.notFound('The trigger rule');
    return rule;
  }
}
