import { randomUUID } from 'node:crypto';
import { Inject, Injectable, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  headingLookAhead,
  outstandingSupportLine,
  shiftOf,
  stageLabels,
  type LookAheadSource,
} from '@roundbook/domain';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { AuthUser, ProjectAccess } from '../../common/auth/auth-user.js';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { JobHandlers, PermanentJobError } from '../../infrastructure/jobs/job-handlers.js';
import { JobsService } from '../../infrastructure/jobs/jobs.service.js';
import { NoticesService } from '../../infrastructure/mail/notices.service.js';
import {
  StorageNotFoundError,
  StorageService,
  StorageUnavailableError,
} from '../../infrastructure/storage/storage.service.js';
import { AuditService } from '../audit/audit.service.js';
import { HazardsService } from '../hazards/hazards.service.js';
import { Heading } from '../headings/heading.entity.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import { Project } from '../projects/project.entity.js';
import { RoundRevision } from '../rounds/round-revision.entity.js';
import { Round } from '../rounds/round.entity.js';
import { SupportClass } from '../support-classes/support-class.entity.js';
import { SupportRecordsService } from '../support-records/support-records.service.js';
import { User } from '../users/user.entity.js';
import type {
  AcknowledgeHandoverDto,
  ComposeHandoverDto,
  HandoverDraftDto,
  HandoverDto,
  HandoverPersonDto,
  HandoverUrlDto,
} from './dto/handover.dto.js';
import { loadPictures } from './handover-pdf-images.js';
import { renderHandoverPdf } from './handover-pdf.js';
import { handoverPictures } from './handover-pictures.js';
import { HANDOVER_CAUTION } from './handover-text.js';
import { handoverEmail, handoverOverdueEmail } from './handover.email.js';
import {
  Handover,
  HandoverHeading,
  type HandoverHeadingSnapshot,
  type HandoverPictures,
  type HandoverSnapshot,
} from './handover.entity.js';

export const HANDOVER_DELIVER_JOB = 'handover.deliver';
/** Runs when a handover's acknowledgement time is up: tells the outgoing supervisor and the engineers, once. */
export const HANDOVER_OVERDUE_JOB = 'handover.overdue';
/** Signed PDF addresses live this long. */
export const PDF_URL_TTL_SECONDS = 300;

/** The look-ahead reads the frozen assessments of this many of a heading's latest handed-in rounds. */
export const LOOK_AHEAD_ROUNDS = 5;

type Figures = Omit<
  HandoverHeadingSnapshot,
  | 'cycleStage'
  | 'notes'
  | 'hazards'
  | 'supportOutstanding'
  | 'lookAhead'
  | 'lookAheadRoundLength'
  | 'pictures'
> & {
  hazards: NonNullable<HandoverHeadingSnapshot['hazards']>;
  supportOutstanding: string[];
  lookAhead: NonNullable<HandoverHeadingSnapshot['lookAhead']>;
  lookAheadRoundLength: number | null;
  /** Only when composing (the draft does not need them) */
  pictures?: HandoverPictures;
};

/**
 * Shift handovers: the draft read from the data, the frozen snapshot saved when sent, its PDF and e-mail
 * made by a job (so the handover is kept even when storage or mail is away), and the acknowledgement.
 */
@Injectable()
export class HandoversService implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(StorageService) private readonly storage: StorageService,
    @Inject(JobsService) private readonly jobs: JobsService,
    @Inject(JobHandlers) private readonly handlers: JobHandlers,
    @Inject(NoticesService) private readonly notices: NoticesService,
    @Inject(AuditService) private readonly audit: AuditService,
    @Inject(HazardsService) private readonly hazards: HazardsService,
    @Inject(SupportRecordsService) private readonly support: SupportRecordsService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  onModuleInit(): void {
    this.handlers.register(HANDOVER_DELIVER_JOB, (payload) => this.deliver(String(payload.handoverId)));
    this.handlers.register(HANDOVER_OVERDUE_JOB, (payload) => this.overdue(String(payload.handoverId)));
  }

  async draft(
    access: ProjectAccess,
    user: AuthUser,
    headingIds: string[],
    now = new Date(),
  ): Promise<HandoverDraftDto> {
    const project = await this.project(this.dataSource.manager, access.projectId);
    const figures = await this.figures(this.dataSource.manager, access.projectId, headingIds);
    return {
      headings: figures.map((f) => ({ ...f, cycleStage: null, notes: '' })),
      ...shiftOf(now, project.timeZone),
      supervisors: (await this.supervisors(access.projectId)).filter((p) => p.userId !== user.id),
      distributionList: project.distributionList ?? [],
      caution: HANDOVER_CAUTION,
    };
  }

  /** Saves the handover with its frozen snapshot and queues its PDF and e-mail (one transaction). */
  async compose(access: ProjectAccess, caller: AuthUser, dto: ComposeHandoverDto): Promise<HandoverDto> {
    const ids = dto.headings.map((h) => h.headingId);
    if (new Set(ids).size !== ids.length)
      throw new DomainException(ErrorCode.ValidationFailed, 'Each heading is handed over once.', {
        headings: 'A heading is listed twice.',
      });
    if (dto.incomingUserId === caller.id)
      throw new DomainException(
        ErrorCode.ValidationFailed,
        'Hand over to another supervisor, not to yourself.',
        {
          incomingUserId: 'Choose the incoming supervisor.',
        },
      );
    const incoming = (await this.supervisors(access.projectId)).find((p) => p.userId === dto.incomingUserId);
    if (!incoming)
      throw new DomainException(
        ErrorCode.ValidationFailed,
        'The incoming supervisor must be a member of this project with the supervisor role.',
        { incomingUserId: 'Not a supervisor of this project.' },
      );
    const id = randomUUID();
    const saved = await this.dataSource.transaction(async (manager) => {
      const project = await this.project(manager, access.projectId);
      const figures = await this.figures(manager, access.projectId, ids, true);
      const outgoing = await manager.findOneOrFail(User, { where: { id: caller.id } });
      const extra = (dto.extraRecipients ?? []).map((e) => e.trim().toLowerCase());
      const snapshot: HandoverSnapshot = {
        projectName: project.name,
        timeZone: project.timeZone,
        outgoing: { userId: outgoing.id, name: outgoing.name, email: outgoing.email },
        incoming,
        headings: figures.map((f, i) => ({
          ...f,
          cycleStage: dto.headings[i].cycleStage,
          notes: (dto.headings[i].notes ?? '').trim(),
        })),
        generalNotes: (dto.generalNotes ?? '').trim(),
        extraRecipients: extra,
      };
      const recipients = [
        ...new Set([
          incoming.email,
          ...(project.distributionList ?? []).map((e) => e.toLowerCase()),
          ...extra,
        ]),
      ];
      const sentAt = new Date();
      const ackDueAt = new Date(sentAt.getTime() + project.handoverAckMinutes * 60_000);
      const row = manager.create(Handover, {
        id,
        projectId: access.projectId,
        outgoingId: caller.id,
        incomingId: incoming.userId,
        shiftDate: dto.shiftDate,
        shift: dto.shift,
        status: 'sent',
        snapshot,
        recipients,
        noticeId: null,
        pdfKey: null,
        sentAt,
        ackDueAt,
        overdueNoticeId: null,
        acknowledgedAt: null,
        acknowledgedBy: null,
        acknowledgeComment: null,
      });
      await manager.save(row);
      await manager.save(
        ids.map((headingId, position) =>
          manager.create(HandoverHeading, { handoverId: id, headingId, position }),
        ),
      );
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'handover',
        entityId: id,
        action: 'send',
        after: {
          incoming: incoming.name,
          shiftDate: dto.shiftDate,
          shift: dto.shift,
          headings: snapshot.headings.map((h) => h.code),
          recipients,
        },
      });
      await this.jobs.enqueue(manager, {
        kind: HANDOVER_DELIVER_JOB,
        payload: { handoverId: id },
        dedupeKey: `handover:${id}`,
      });
      await this.jobs.enqueue(manager, {
        kind: HANDOVER_OVERDUE_JOB,
        payload: { handoverId: id },
        runAt: ackDueAt,
        dedupeKey: `handover-overdue:${id}`,
      });
      return row;
    });
    return (await this.toDtos([saved]))[0];
  }

  /**
   * The job: makes the PDF from the snapshot, stores it, and queues the e-mail with it attached. Run again
   * (a retry, a second process) it does nothing once the e-mail is queued; the PDF is the same bytes' worth.
   */
  async deliver(handoverId: string): Promise<void> {
    const repo = this.dataSource.getRepository(Handover);
    const h = await repo.findOne({ where: { id: handoverId } });
    if (!h) throw new PermanentJobError(`Handover ${handoverId} no longer exists`);
    if (h.noticeId) return;
    // Storage away while reading the pictures throws, and the job retries; a missing picture is a line.
    const pictures = await Promise.all(
      h.snapshot.headings.map((x) => loadPictures(this.storage, x.pictures)),
    );
    const pdf = await renderHandoverPdf({
      pictures,
      snapshot: h.snapshot,
      shiftDate: h.shiftDate,
      shift: h.shift,
      sentAt: h.sentAt,
    });
    const key = `projects/${h.projectId}/handovers/${h.id}/handover.pdf`;
    await this.storage.put(key, pdf, 'application/pdf');
    await this.dataSource.transaction(async (manager) => {
      const locked = await manager.findOne(Handover, {
        where: { id: h.id },
        lock: { mode: 'pessimistic_write' },
      });
      if (!locked || locked.noticeId) return;
      const message = handoverEmail({
        snapshot: h.snapshot,
        shiftDate: h.shiftDate,
        shift: h.shift,
        sentAt: h.sentAt,
        link: `${this.config.appUrl}/received?handover=${h.id}`,
      });
      const [to, ...cc] = h.recipients;
      const notice = await this.notices.queue(manager, {
        kind: 'handover',
        projectId: h.projectId,
        to: [to],
        cc,
        ...message,
        attachments: [{ filename: pdfName(h), contentType: 'application/pdf', storageKey: key }],
      });
      await manager.update(Handover, { id: h.id }, { noticeId: notice.id, pdfKey: key });
    });
  }

  /**
   * The overdue job: a handover still not acknowledged when its time is up is reported once to the outgoing
   * supervisor and the project's engineers (the row lock and overdue_notice_id make a rerun, or a second
   * process, do nothing). `now` is the clock it is judged by (the job runs at ack_due_at).
   */
  async overdue(handoverId: string, now = new Date()): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const h = await manager.findOne(Handover, {
        where: { id: handoverId },
        lock: { mode: 'pessimistic_write' },
      });
      if (!h || h.status !== 'sent' || h.overdueNoticeId) return;
      if (h.ackDueAt.getTime() > now.getTime()) return;
      const engineers = await manager
        .createQueryBuilder(ProjectMember, 'm')
        .innerJoin(User, 'u', 'u.id = m.user_id')
        .select(['u.email AS email'])
        .where("m.project_id = :projectId AND m.role = 'engineer'", { projectId: h.projectId })
        .orderBy('u.email', 'ASC')
        .getRawMany<{ email: string }>();
      const outgoing = await manager.findOne(User, { where: { id: h.outgoingId } });
      const to = outgoing?.email ?? h.snapshot.outgoing.email;
      const cc = [...new Set(engineers.map((e) => e.email))].filter((e) => e !== to);
      const message = handoverOverdueEmail({
        snapshot: h.snapshot,
        shiftDate: h.shiftDate,
        shift: h.shift,
        sentAt: h.sentAt,
        ackDueAt: h.ackDueAt,
        link: `${this.config.appUrl}/projects/${h.projectId}/headings/${h.snapshot.headings[0]?.headingId ?? ''}`,
      });
      const notice = await this.notices.queue(manager, {
        kind: 'handover-overdue',
        projectId: h.projectId,
        to: [to],
        cc,
        ...message,
      });
      await manager.update(Handover, { id: h.id }, { overdueNoticeId: notice.id });
      await this.audit.record(manager, {
        projectId: h.projectId,
        actorId: null,
        entityType: 'handover',
        entityId: h.id,
        action: 'overdue',
        after: { ackDueAt: h.ackDueAt.toISOString(), told: [to, ...cc] },
      });
    });
  }

  async get(access: ProjectAccess, handoverId: string): Promise<HandoverDto> {
    return (await this.toDtos([await this.one(access, handoverId)]))[0];
  }

  /** A heading's handovers, newest first. */
  async history(access: ProjectAccess, headingId: string): Promise<HandoverDto[]> {
    const heading = await this.dataSource
      .getRepository(Heading)
      .findOne({ where: { id: headingId, projectId: access.projectId }, select: { id: true } });
    if (!heading) throw DomainException.notFound('The heading');
    const rows = await this.dataSource
      .getRepository(Handover)
      .createQueryBuilder('h')
      .innerJoin(HandoverHeading, 'hh', 'hh.handover_id = h.id')
      .where('hh.heading_id = :headingId', { headingId })
      .andWhere('h.project_id = :projectId', { projectId: access.projectId })
      .orderBy('h.sent_at', 'DESC')
      .addOrderBy('h.id', 'DESC')
      .take(200)
      .getMany();
    return this.toDtos(rows);
  }

  /** Handovers addressed to the caller in the projects they belong to: waiting ones first, then newest. */
  async received(caller: AuthUser): Promise<HandoverDto[]> {
    const rows = await this.dataSource
      .getRepository(Handover)
      .createQueryBuilder('h')
      .innerJoin(ProjectMember, 'm', 'm.project_id = h.project_id AND m.user_id = :me', { me: caller.id })
      .where('h.incoming_id = :me', { me: caller.id })
      // An ENUM sorts by its position: 'sent' (waiting) before 'acknowledged'.
      .orderBy('h.status', 'ASC')
      .addOrderBy('h.sent_at', 'DESC')
      .addOrderBy('h.id', 'DESC')
      .take(200)
      .getMany();
    return this.toDtos(rows);
  }

  /** The named incoming supervisor acknowledges, once, with an optional comment (audited). */
  async acknowledge(
    access: ProjectAccess,
    caller: AuthUser,
    handoverId: string,
    dto: AcknowledgeHandoverDto,
  ): Promise<HandoverDto> {
    await this.one(access, handoverId);
    const saved = await this.dataSource.transaction(async (manager) => {
      const h = await manager.findOneOrFail(Handover, {
        where: { id: handoverId },
        lock: { mode: 'pessimistic_write' },
      });
      if (h.incomingId !== caller.id)
        throw DomainException.forbidden(
          `Only ${h.snapshot.incoming.name}, the incoming supervisor named on it, can acknowledge this handover.`,
        );
      if (h.status === 'acknowledged')
        throw new DomainException(ErrorCode.Conflict, 'This handover was already acknowledged.');
      const comment = dto.comment?.trim() ? dto.comment.trim() : null;
      h.status = 'acknowledged';
      h.acknowledgedAt = new Date();
      h.acknowledgedBy = caller.id;
      h.acknowledgeComment = comment;
      await manager.save(h);
      await this.audit.record(manager, {
        projectId: access.projectId,
        actorId: caller.id,
        entityType: 'handover',
        entityId: h.id,
        action: 'acknowledge',
        before: { status: 'sent' },
        after: { status: 'acknowledged', comment },
      });
      return h;
    });
    return (await this.toDtos([saved]))[0];
  }

  /** A short-lived signed address of the stored PDF. */
  async pdfUrl(access: ProjectAccess, handoverId: string): Promise<HandoverUrlDto> {
    const h = await this.one(access, handoverId);
    if (!h.pdfKey)
      throw new DomainException(ErrorCode.Conflict, 'The PDF is still being made; try again in a moment.');
    try {
      const url = await this.storage.signedGetUrl(h.pdfKey, PDF_URL_TTL_SECONDS, pdfName(h));
      return { url, expiresAt: new Date(Date.now() + PDF_URL_TTL_SECONDS * 1000).toISOString() };
    } catch (e) {
      if (e instanceof StorageUnavailableError)
        throw new DomainException(
          ErrorCode.ServiceUnavailable,
          'File storage cannot be reached right now; try again in a minute.',
        );
      if (e instanceof StorageNotFoundError) throw DomainException.notFound('The PDF');
      throw e;
    }
  }

  private async one(access: ProjectAccess, handoverId: string): Promise<Handover> {
    const h = await this.dataSource
      .getRepository(Handover)
      .findOne({ where: { id: handoverId, projectId: access.projectId } });
    if (!h) throw DomainException.notFound('The handover');
    return h;
  }

  private async project(manager: EntityManager, projectId: string): Promise<Project> {
    return manager.findOneOrFail(Project, { where: { id: projectId } });
  }

  /** Members with the supervisor role (who can receive a handover). */
  private async supervisors(projectId: string): Promise<HandoverPersonDto[]> {
    const rows = await this.dataSource
      .getRepository(ProjectMember)
      .createQueryBuilder('m')
      .innerJoin(User, 'u', 'u.id = m.user_id')
      .select(['u.id AS userId', 'u.name AS name', 'u.email AS email'])
      .where('m.project_id = :projectId AND m.role = :role', { projectId, role: 'supervisor' })
      .orderBy('u.name', 'ASC')
      .getRawMany<HandoverPersonDto>();
    return rows;
  }

  /** Each heading's figures from the data, in the order asked; an id not of this project is a 404. */
  private async figures(
    manager: EntityManager,
    projectId: string,
    headingIds: string[],
    withPictures = false,
  ): Promise<Figures[]> {
    const headings = await manager.find(Heading, { where: { id: In(headingIds), projectId } });
    const byId = new Map(headings.map((h) => [h.id, h]));
    const out: Figures[] = [];
    for (const id of headingIds) {
      const h = byId.get(id);
      if (!h) throw DomainException.notFound('The heading');
      const recent = await manager
        .getRepository(Round)
        .createQueryBuilder('r')
        .where('r.heading_id = :id AND r.status <> :draft', { id, draft: 'draft' })
        .orderBy('r.mapped_at', 'DESC')
        .addOrderBy('r.round_number', 'DESC')
        .take(LOOK_AHEAD_ROUNDS)
        .getMany();
      const last = recent[0] ?? null;
      const confirmed = await manager
        .getRepository(Round)
        .createQueryBuilder('r')
        .where('r.heading_id = :id AND r.status = :confirmed', { id, confirmed: 'confirmed' })
        .orderBy('r.confirmed_at', 'DESC')
        .addOrderBy('r.mapped_at', 'DESC')
        .getOne();
      const lookAheadRoundLength = confirmed?.confirmedRoundLength ?? h.plannedRoundLength ?? null;
      const cls = confirmed?.confirmedClassId
        ? await manager.findOne(SupportClass, { where: { id: confirmed.confirmedClassId } })
        : null;
      out.push({
        headingId: h.id,
        code: h.code,
        name: h.name,
        chainageStyle: h.chainageStyle,
        chainageDecimals: h.chainageDecimals,
        faceChainage: last?.faceChainage ?? null,
        stage: last?.stage ?? null,
        lastRoundNumber: last?.roundNumber ?? null,
        lastConfirmed: confirmed
          ? {
              roundId: confirmed.id,
              roundNumber: confirmed.roundNumber,
              stage: confirmed.stage,
              faceChainage: confirmed.faceChainage,
              classId: confirmed.confirmedClassId,
              classCode: cls?.code ?? null,
              className: cls?.name ?? null,
              nextRoundLength: confirmed.confirmedRoundLength,
              confirmedAt: confirmed.confirmedAt ? confirmed.confirmedAt.toISOString() : null,
            }
          : null,
        triggerLevel: last?.triggerLevel ?? null,
        alerts: (last?.triggerFirings ?? []).map((f) => ({
          level: f.level,
          summary: f.summary,
          action: f.action,
          ownerRole: f.ownerRole,
        })),
        hazards: (await this.hazards.openForHeading(h.id, manager)).map((z) => ({
          id: z.id,
          kind: z.kind,
          fromChainage: z.fromChainage,
          toChainage: z.toChainage,
          level: z.level,
          description: z.description,
        })),
        lookAhead: last
          ? headingLookAhead(await this.frozenLookAhead(manager, recent), {
              faceChainage: last.faceChainage,
              chainageSense: h.chainageSense === 'decreasing' ? -1 : 1,
              roundLength: lookAheadRoundLength,
            })
          : [],
        lookAheadRoundLength,
        ...(withPictures
          ? { pictures: await handoverPictures(manager, projectId, h.driveTrend, recent) }
          : {}),
        supportOutstanding: (await this.support.outstandingForHeading(h.id, manager)).flatMap((o) =>
          o.items.map((i) =>
            outstandingSupportLine({
              roundNumber: o.roundNumber,
              stageLabel: stageLabels[o.stage].toLowerCase(),
              classCode: o.classCode,
              element: i.element,
              planned: i.planned,
              quantity: i.quantity,
              length: i.length,
              reason: i.reason,
            }),
          ),
        ),
      });
    }
    return out;
  }

  /** Each round's look-ahead as frozen in its newest revision (a submit, confirm or return), newest round first. */
  private async frozenLookAhead(manager: EntityManager, rounds: Round[]): Promise<LookAheadSource[]> {
    if (rounds.length === 0) return [];
    const revisions = await manager.getRepository(RoundRevision).find({
      where: { roundId: In(rounds.map((r) => r.id)) },
      select: { roundId: true, revision: true, assessment: true },
      order: { revision: 'DESC' },
    });
    const newest = new Map<string, RoundRevision>();
    for (const r of revisions) if (!newest.has(r.roundId)) newest.set(r.roundId, r);
    return rounds.map((r) => ({
      roundNumber: r.roundNumber,
      faceChainage: r.faceChainage,
      reaches: newest.get(r.id)?.assessment?.lookAhead ?? [],
    }));
  }

  private async toDtos(rows: Handover[], now = new Date()): Promise<HandoverDto[]> {
    const ackIds = [...new Set(rows.map((r) => r.acknowledgedBy).filter((x): x is string => x !== null))];
    const users = ackIds.length
      ? await this.dataSource.getRepository(User).find({ where: { id: In(ackIds) } })
      : [];
    const userById = new Map(users.map((u) => [u.id, u]));
    const status = await this.notices.status(
      rows.map((r) => r.noticeId).filter((x): x is string => x !== null),
    );
    return rows.map((h) => {
      const ack = h.acknowledgedBy ? userById.get(h.acknowledgedBy) : undefined;
      return {
        id: h.id,
        projectId: h.projectId,
        projectName: h.snapshot.projectName,
        timeZone: h.snapshot.timeZone,
        shiftDate: h.shiftDate,
        shift: h.shift,
        status: h.status,
        outgoing: h.snapshot.outgoing,
        incoming: h.snapshot.incoming,
        headings: h.snapshot.headings.map(({ pictures: _pictures, ...x }) => ({
          ...x,
          hazards: x.hazards ?? [],
          supportOutstanding: x.supportOutstanding ?? [],
          lookAhead: x.lookAhead ?? [],
          lookAheadRoundLength: x.lookAheadRoundLength ?? null,
        })),
        generalNotes: h.snapshot.generalNotes,
        recipients: h.recipients,
        emailStatus: h.noticeId ? (status.get(h.noticeId) ?? 'queued') : 'queued',
        pdfReady: h.pdfKey !== null,
        sentAt: h.sentAt.toISOString(),
        ackDueAt: h.ackDueAt.toISOString(),
        overdue: h.status === 'sent' && h.ackDueAt.getTime() <= now.getTime(),
        overdueNotified: h.overdueNoticeId !== null,
        acknowledgedAt: h.acknowledgedAt ? h.acknowledgedAt.toISOString() : null,
        acknowledgedBy: ack ? { userId: ack.id, name: ack.name, email: ack.email } : null,
        acknowledgeComment: h.acknowledgeComment,
        caution: HANDOVER_CAUTION,
      };
    });
  }
}

/** "handover-TH-2026-12-03-day.pdf" */
function pdfName(h: Handover): string {
  const codes = h.snapshot.headings.map((x) => x.code.replace(/[^A-Za-z0-9-]+/g, '')).join('-');
  return `handover-${codes}-${h.shiftDate}-${h.shift}.pdf`;
}
