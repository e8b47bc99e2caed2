import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  SUPPORT_ELEMENTS,
  notInClassReason,
  plannedSupport,
  supportElementLabels,
  supportElementRules,
  supportItemErrors,
  type SupportElement,
} from '@roundbook/domain';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { isDuplicateKey } from '../../common/errors/database-errors.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { AuditService } from '../audit/audit.service.js';
import { STAGES, type Stage } from '../headings/heading.entity.js';
import { Round } from '../rounds/round.entity.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import { User } from '../users/user.entity.js';
import type {
  SaveSupportRecordDto,
  SupportItemDto,
  SupportItemInputDto,
  SupportRecordDto,
} from './dto/support-record.dto.js';
import { SupportRecord, type StoredSupportItem } from './support-record.entity.js';

/** An installation time may lie this far ahead of the server's clock (a tablet's clock drifts). */
const CLOCK_SLACK_MS = 5 * 60 * 1000;

/** One round's outstanding support, as the handover carries it. */
export interface OutstandingSupport {
  roundId: string;
  roundNumber: number;
  stage: Stage;
  faceChainage: number;
  classCode: string | null;
  /** False: nothing was recorded yet, so every element of the class is outstanding. */
  recorded: boolean;
  items: SupportItemDto[];
}

type RoundRow = Pick<
  Round,
  'id' | 'projectId' | 'headingId' | 'stage' | 'roundNumber' | 'faceChainage' | 'status' | 'confirmedClassId'
>;
const ROUND_FIELDS = {
  id: true,
  projectId: true,
  headingId: true,
  stage: true,
  roundNumber: true,
  faceChainage: true,
  status: true,
  confirmedClassId: true,
} as const;

const sameItem = (a: StoredSupportItem, b: StoredSupportItem): boolean =>
  a.status === b.status && a.quantity === b.quantity && a.length === b.length && a.reason === b.reason;

/**
 * Support as built, per confirmed round: the checklist prefilled from the confirmed class, recorded by
 * supervisors, engineers and admins (the route says who). The handover reads outstandingForHeading and the
 * Board outstandingHeadings. Rounds and classes are read by their entities; this module sits below rounds
 * (it never calls the rounds service) and below the handovers.
 */
@Injectable()
export class SupportRecordsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(AuditService) private readonly audit: AuditService,
  ) {}

  /** The round's checklist: as recorded, or the class's plan when nothing was saved yet. */
  async get(access: ProjectAccess, roundId: string): Promise<SupportRecordDto> {
    const manager = this.dataSource.manager;
    const round = await this.round(manager, access, roundId);
    const record = await manager.findOne(SupportRecord, { where: { roundId } });
    return this.view(manager, round, record);
  }

  /** Saves the whole checklist. Optimistic: the version read (0 for the first save) must still be current. */
  async save(
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    dto: SaveSupportRecordDto,
  ): Promise<SupportRecordDto> {
    try {
      await this.dataSource.transaction((manager) => this.saveIn(manager, caller, access, roundId, dto));
    } catch (error) {
      // Two first saves raced: the unique round key let one through; the other read a version that is gone.
      if (isDuplicateKey(error)) throw await this.stale(roundId, access);
      throw error;
    }
    return this.get(access, roundId);
  }

  /**
   * Per confirmed round of the heading, the items still outstanding (for the handover). A round with a record
   * lists its outstanding items; the latest confirmed round of each stage with nothing recorded lists every
   * element of its class (older unrecorded rounds are history kept before this record existed, and the
   * rounds since have passed them). Stage, then round number.
   */
  async outstandingForHeading(
    headingId: string,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<OutstandingSupport[]> {
    const rounds = (await manager.find(Round, {
      where: { headingId, status: 'confirmed' },
      select: ROUND_FIELDS,
      order: { stage: 'ASC', roundNumber: 'ASC' },
    })) as RoundRow[];
    if (rounds.length === 0) return [];
    const latest = new Map<string, number>();
    for (const r of rounds) latest.set(r.stage, Math.max(latest.get(r.stage) ?? 0, r.roundNumber));
    const records = await manager.find(SupportRecord, { where: { roundId: In(rounds.map((r) => r.id)) } });
    const byRound = new Map(records.map((r) => [r.roundId, r]));
    const candidates = rounds.filter((r) => {
      const rec = byRound.get(r.id);
      return rec ? rec.outstandingCount > 0 : latest.get(r.stage) === r.roundNumber;
    });
    const out: OutstandingSupport[] = [];
    for (const r of candidates) {
      const view = await this.view(manager, r, byRound.get(r.id) ?? null);
      const items = view.items.filter((i) => i.status === 'outstanding');
      if (items.length === 0) continue;
      out.push({
        roundId: r.id,
        roundNumber: r.roundNumber,
        stage: r.stage,
        faceChainage: r.faceChainage,
        classCode: view.classCode,
        recorded: view.recorded,
        items,
      });
    }
    return out;
  }

  /**
   * The headings (of those given) whose latest confirmed round of some stage has outstanding support: a
   * record with outstanding items, or no record while its class names any element. For the Board.
   */
  async outstandingHeadings(
    headingIds: string[],
    manager: EntityManager = this.dataSource.manager,
  ): Promise<Set<string>> {
    if (headingIds.length === 0) return new Set();
    const rows = await manager.query<
      Array<{ headingId: string; classId: string | null; outstanding: number | string | null }>
    >(
      // The latest confirmed round of each heading and stage, one seek each down IDX_rounds_heading_progress
      // (heading, status, stage, number); the former GROUP BY read every confirmed round's index entry.
      `SELECT t.headingId, t.classId, s.outstanding_count AS outstanding FROM (
         ${headingIds
           .flatMap(() =>
             STAGES.map(
               () =>
                 `(SELECT r.id, r.heading_id AS headingId, r.confirmed_class_id AS classId FROM rounds r
                    WHERE r.heading_id = ? AND r.status = 'confirmed' AND r.stage = ?
                    ORDER BY r.round_number DESC LIMIT 1)`,
             ),
           )
           .join(' UNION ALL ')}) t
       LEFT JOIN support_records s ON s.round_id = t.id`,
      headingIds.flatMap((id) => STAGES.flatMap((stage) => [id, stage])),
    );
    const out = new Set<string>();
    const unrecorded = rows.filter((r) => r.outstanding === null && r.classId !== null);
    for (const r of rows) if (r.outstanding !== null && Number(r.outstanding) > 0) out.add(r.headingId);
    if (unrecorded.length) {
      const classes = await manager.find(SupportClass, {
        where: { id: In([...new Set(unrecorded.map((r) => r.classId!))]) },
      });
      const plans = new Map(classes.map((c) => [c.id, plannedSupport(c).some((p) => p.inClass)]));
      for (const r of unrecorded) if (plans.get(r.classId!)) out.add(r.headingId);
    }
    return out;
  }

  private async saveIn(
    manager: EntityManager,
    caller: AuthUser,
    access: ProjectAccess,
    roundId: string,
    dto: SaveSupportRecordDto,
  ): Promise<void> {
    const round = await this.round(manager, access, roundId, true);
    if (round.status !== 'confirmed' || round.confirmedClassId === null)
      throw new DomainException(
        ErrorCode.Conflict,
        `Support as built is recorded once the round is confirmed; round ${round.roundNumber} is ${round.status}. Record it after the engineer confirms the support class.`,
      );
    const record = await manager.findOne(SupportRecord, {
      where: { roundId },
      lock: { mode: 'pessimistic_write' },
    });
    if ((record?.version ?? 0) !== dto.version) throw await this.stale(roundId, access, manager);
    const supportClass = await manager.findOneOrFail(SupportClass, { where: { id: round.confirmedClassId } });
    const items = this.checkedItems(dto.items);
    const current = new Map(
      (record?.items ?? this.prefill(supportClass)).map((i) => [i.element, i] as const),
    );
    const now = new Date();
    const next: StoredSupportItem[] = SUPPORT_ELEMENTS.map((element) => {
      const given = items.get(element)!;
      const before = current.get(element);
      const candidate: StoredSupportItem = {
        element,
        status: given.status,
        quantity: given.quantity ?? null,
        length: given.length ?? null,
        reason: given.reason.trim(),
        installedBy: null,
        installedAt: null,
      };
      const changed = !before || !sameItem(before, candidate) || given.installedAt !== undefined;
      return changed
        ? {
            ...candidate,
            installedBy: caller.id,
            installedAt: given.installedAt ? new Date(given.installedAt).toISOString() : now.toISOString(),
          }
        : { ...candidate, installedBy: before.installedBy, installedAt: before.installedAt };
    });
    const outstandingCount = next.filter((i) => i.status === 'outstanding').length;
    const changedElements = next.filter((i) => {
      const b = current.get(i.element);
      return !record || !b || JSON.stringify(b) !== JSON.stringify(i);
    });
    if (record && changedElements.length === 0 && record.classId === supportClass.id) return;
    const saved = await manager.save(
      record
        ? Object.assign(record, {
            items: next,
            outstandingCount,
            classId: supportClass.id,
            updatedBy: caller.id,
          })
        : manager.create(SupportRecord, {
            projectId: access.projectId,
            headingId: round.headingId,
            roundId,
            classId: supportClass.id,
            items: next,
            outstandingCount,
            updatedBy: caller.id,
          }),
    );
    const summary = (list: StoredSupportItem[]) =>
      Object.fromEntries(
        list.map((i) => [
          i.element,
          { status: i.status, quantity: i.quantity, length: i.length, reason: i.reason },
        ]),
      );
    await this.audit.record(manager, {
      projectId: access.projectId,
      actorId: caller.id,
      entityType: 'support-record',
      entityId: saved.id,
      action: record ? 'update' : 'create',
      before: record
        ? { items: summary(changedElements.map((i) => current.get(i.element)!).filter(Boolean)) }
        : null,
      after: {
        roundId,
        classCode: supportClass.code,
        outstandingCount,
        items: summary(changedElements),
      },
    });
  }

  /** Every element once, each item checked against its element's unit and bounds (400 with the words). */
  private checkedItems(given: SupportItemInputDto[]): Map<SupportElement, SupportItemInputDto> {
    const fields: Record<string, string> = {};
    const byElement = new Map<SupportElement, SupportItemInputDto>();
    given.forEach((item, index) => {
      if (byElement.has(item.element))
        fields[`items.${index}.element`] =
          `${supportElementLabels[item.element]} is listed twice; send each element once.`;
      byElement.set(item.element, item);
      const errors = supportItemErrors({
        element: item.element,
        status: item.status,
        quantity: item.quantity ?? null,
        length: item.length ?? null,
        reason: item.reason,
      });
      for (const [key, message] of Object.entries(errors)) fields[`items.${index}.${key}`] = message;
      if (item.installedAt !== undefined) {
        const at = new Date(item.installedAt).getTime();
        if (at > Date.now() + CLOCK_SLACK_MS)
          fields[`items.${index}.installedAt`] =
            `${supportElementLabels[item.element]}: the installation time is in the future.`;
      }
    });
    const missing = SUPPORT_ELEMENTS.filter((e) => !byElement.has(e));
    if (missing.length)
      fields.items = `The checklist lists every element; missing: ${missing.map((e) => supportElementLabels[e]).join(', ')}.`;
    const messages = Object.values(fields);
    if (messages.length)
      throw new DomainException(
        ErrorCode.ValidationFailed,
        messages.length === 1 ? messages[0] : `${messages[0]} (and ${messages.length - 1} more)`,
        fields,
      );
    return byElement;
  }

  /** The class's plan as a first checklist: its elements outstanding, the others not needed (and why). */
  private prefill(c: SupportClass): StoredSupportItem[] {
    return plannedSupport(c).map((p) => ({
      element: p.element,
      status: p.inClass ? 'outstanding' : 'not-needed',
      quantity: null,
      length: null,
      reason: p.inClass ? '' : notInClassReason(c.code),
      installedBy: null,
      installedAt: null,
    }));
  }

  private async view(
    manager: EntityManager,
    round: RoundRow,
    record: SupportRecord | null,
  ): Promise<SupportRecordDto> {
    const confirmed = round.status === 'confirmed' && round.confirmedClassId !== null;
    const classId = round.confirmedClassId ?? record?.classId ?? null;
    const supportClass = classId ? await manager.findOne(SupportClass, { where: { id: classId } }) : null;
    const plan = new Map(supportClass ? plannedSupport(supportClass).map((p) => [p.element, p]) : []);
    const stored = record?.items ?? (confirmed && supportClass ? this.prefill(supportClass) : []);
    const userIds = [
      ...new Set([record?.updatedBy, ...stored.map((i) => i.installedBy)].filter((x): x is string => !!x)),
    ];
    const users = userIds.length
      ? await manager.find(User, { where: { id: In(userIds) }, select: { id: true, name: true } })
      : [];
    const names = new Map(users.map((u) => [u.id, u.name]));
    const byElement = new Map(stored.map((i) => [i.element, i]));
    const items: SupportItemDto[] = SUPPORT_ELEMENTS.filter((e) => byElement.has(e)).map((element) => {
      const i = byElement.get(element)!;
      const rule = supportElementRules[element];
      const p = plan.get(element);
      return {
        element,
        unit: rule.unit,
        hasLength: rule.hasLength,
        planned: {
          inClass: p?.inClass ?? false,
          quantity: p?.quantity ?? null,
          length: p?.length ?? null,
          text: p?.text ?? '',
        },
        status: i.status,
        quantity: i.quantity,
        length: i.length,
        reason: i.reason,
        installedBy: i.installedBy,
        installedByName: i.installedBy ? (names.get(i.installedBy) ?? null) : null,
        installedAt: i.installedAt,
      };
    });
    return {
      roundId: round.id,
      headingId: round.headingId,
      roundNumber: round.roundNumber,
      confirmed,
      classId: supportClass?.id ?? null,
      classCode: supportClass?.code ?? null,
      className: supportClass?.name ?? null,
      recorded: record !== null,
      version: record?.version ?? 0,
      updatedAt: record ? record.updatedAt.toISOString() : null,
      updatedByName: record ? (names.get(record.updatedBy) ?? null) : null,
      items,
      outstandingCount: items.filter((i) => i.status === 'outstanding').length,
    };
  }

  private async stale(
    roundId: string,
    access: ProjectAccess,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<DomainException> {
    const round = await this.round(manager, access, roundId);
    const record = await manager.findOne(SupportRecord, { where: { roundId } });
    return new DomainException(
      ErrorCode.StaleVersion,
      'Someone else recorded support on this round since you opened it. Review what they recorded, then apply your change again.',
      undefined,
      { current: await this.view(manager, round, record) },
    );
  }

  private async round(
    manager: EntityManager,
    access: ProjectAccess,
    roundId: string,
    lock = false,
  ): Promise<RoundRow> {
    const round = (await manager.findOne(Round, {
      where: { id: roundId, projectId: access.projectId },
      select: ROUND_FIELDS,
      ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}),
    })) as RoundRow | null;
    if (!round) throw DomainException.notFound('The round');
    return round;
  }
}
