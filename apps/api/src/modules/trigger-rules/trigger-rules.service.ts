import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { definedOnly } from '../../common/dto/defined-only.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { auditDiff, auditSnapshot } from '../audit/audit-diff.js';
import { AuditService } from '../audit/audit.service.js';
import { Heading } from '../headings/heading.entity.js';
import { Joint } from '../rounds/joint.entity.js';
import { inflowPer10m } from '../rounds/round-computations.js';
import { Round } from '../rounds/round.entity.js';
import type {
  CreateTriggerRuleDto,
  TriggerPreviewDto,
  TriggerRuleDto,
  UpdateTriggerRuleDto,
} from './dto/trigger-rule.dto.js';
import { evaluateRule } from './trigger-evaluation.js';
import { TriggerRule } from './trigger-rule.entity.js';
import { triggerRuleErrors, triggerRuleSummary } from './trigger-rule.rules.js';

const FIELDS = [
  'watch',
  'comparison',
  'threshold',
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
  ) {}

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
      ...definedOnly(dto),
    });
    this.assertValid(rule);
    if (rule.watch === 'open-red-hazard') {
      return {
        evaluatedRounds: 0,
        matches: [],
        notEvaluated: 'Hazards are not recorded in Roundbook yet, so this rule has nothing to check.',
      };
    }
    const headings = await this.dataSource
      .getRepository(Heading)
      .find({ where: { projectId: access.projectId }, order: { code: 'ASC' } });
    const rounds: Round[] = [];
    for (const heading of headings) {
      const latest = await this.dataSource
        .getRepository(Round)
        .find({ where: { headingId: heading.id }, order: { roundNumber: 'DESC' }, take: perHeading });
      rounds.push(...latest.map((r) => Object.assign(r, { heading })));
    }
    const ids = rounds.map((r) => r.id);
    const joints = ids.length
      ? await this.dataSource.getRepository(Joint).find({ where: { roundId: In(ids) } })
      : [];
    const byRound = new Map<string, Joint[]>();
    for (const j of joints) byRound.set(j.roundId, [...(byRound.get(j.roundId) ?? []), j]);
    const previous = await this.previousClasses(rounds);
    const matches: TriggerPreviewDto['matches'] = [];
    for (const r of rounds) {
      const fired = evaluateRule(
        rule,
        {
          q: r.q,
          rmr: r.rmr,
          inflowPer10m: inflowPer10m(r.ground.inflowLpm, r.ground.inflowLengthM ?? r.roundLength),
          overbreakM3: r.ground.overbreakM3,
          faceChainage: r.faceChainage,
          recommendedClassId: r.recommendedClassId,
          previousClassId: previous.get(r.id),
          joints: byRound.get(r.id) ?? [],
        },
        r.heading!,
      );
      if (fired) {
        matches.push({
          roundId: r.id,
          headingCode: r.heading!.code,
          roundNumber: r.roundNumber,
          stage: r.stage,
          faceChainage: r.faceChainage,
          shiftDate: r.shiftDate,
          ...fired,
        });
      }
    }
    return { evaluatedRounds: rounds.length, matches, notEvaluated: null };
  }

  /** The recommended class of the round before each one (same heading and stage); undefined for a first round. */
  private async previousClasses(rounds: Round[]): Promise<Map<string, string | null | undefined>> {
    const key = (headingId: string, stage: string, n: number): string => `${headingId}|${stage}|${n}`;
    const loaded = new Map(
      rounds.map((r) => [key(r.headingId, r.stage, r.roundNumber), r.recommendedClassId]),
    );
    const out = new Map<string, string | null | undefined>();
    for (const r of rounds) {
      const k = key(r.headingId, r.stage, r.roundNumber - 1);
      if (r.roundNumber === 1) out.set(r.id, undefined);
      else if (loaded.has(k)) out.set(r.id, loaded.get(k));
      else {
        // Only the oldest rounds of the window need their predecessor from the database.
        const prev = await this.dataSource.getRepository(Round).findOne({
          where: { headingId: r.headingId, stage: r.stage, roundNumber: r.roundNumber - 1 },
          select: { id: true, recommendedClassId: true },
        });
        out.set(r.id, prev ? prev.recommendedClassId : undefined);
      }
    }
    return out;
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
