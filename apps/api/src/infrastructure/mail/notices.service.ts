import { randomUUID } from 'node:crypto';
import { Inject, Injectable, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, IsNull, type EntityManager } from 'typeorm';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { JobHandlers, PermanentJobError } from '../jobs/job-handlers.js';
import { JobsService } from '../jobs/jobs.service.js';
import { StorageNotFoundError, StorageService } from '../storage/storage.service.js';
import { MailService, type MailAttachment, type MailMessage } from './mail.service.js';
import { Notice, type NoticeAttachment } from './notice.entity.js';

export const MAIL_JOB = 'mail.send';

export interface QueueMail extends Omit<MailMessage, 'attachments' | 'messageId'> {
  kind: string;
  projectId?: string | null;
  sensitive?: boolean;
  /** Files already in object storage, read and attached when the notice is sent */
  attachments?: NoticeAttachment[];
}

export type NoticeStatus = 'queued' | 'sent' | 'failed';

/** The domain part of MAIL_FROM, for Message-IDs (`<uuid@domain>`, RFC 5322 §3.6.4). */
export function messageIdDomain(from: string): string {
  const m = /@([^<>\s@]+)>?\s*$/.exec(from);
  return m ? m[1] : 'roundbook.invalid';
}

/**
 * Outgoing e-mail goes through here: `queue()` writes the notice and its `mail.send` job in the caller's
 * transaction; a worker sends it later (MailService) and stamps `sent_at`. Nothing is sent from a request.
 */
@Injectable()
export class NoticesService implements OnModuleInit {
  private readonly domain: string;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(JobsService) private readonly jobs: JobsService,
    @Inject(JobHandlers) private readonly handlers: JobHandlers,
    @Inject(MailService) private readonly mail: MailService,
    @Inject(StorageService) private readonly storage: StorageService,
    @Inject(APP_CONFIG) config: AppConfig,
  ) {
    this.domain = messageIdDomain(config.mail.from);
  }

  onModuleInit(): void {
    this.handlers.register(MAIL_JOB, (payload) => this.deliver(String(payload.noticeId)));
  }

  /** Queues one e-mail in the caller's transaction; returns the notice. */
  async queue(manager: EntityManager, mail: QueueMail): Promise<Notice> {
    const notice = await manager.save(
      manager.create(Notice, {
        kind: mail.kind,
        projectId: mail.projectId ?? null,
        to: mail.to,
        cc: mail.cc ?? [],
        subject: mail.subject,
        text: mail.text,
        html: mail.html ?? null,
        sensitive: mail.sensitive ?? false,
        attachments: mail.attachments?.length ? mail.attachments : null,
        messageId: `<${randomUUID()}@${this.domain}>`,
        sentAt: null,
      }),
    );
    await this.jobs.enqueue(manager, {
      kind: MAIL_JOB,
      payload: { noticeId: notice.id },
      dedupeKey: `notice:${notice.id}`,
    });
    return notice;
  }

  /**
   * The `mail.send` handler. A notice already stamped `sent_at` is not sent again; a crash between sending
   * and stamping sends it once more with the same Message-ID.
   */
  async deliver(noticeId: string): Promise<void> {
    const repo = this.dataSource.getRepository(Notice);
    const notice = await repo.findOne({ where: { id: noticeId } });
    if (!notice) throw new PermanentJobError(`Notice ${noticeId} no longer exists`);
    if (notice.sentAt) return;
    await this.mail.send({
      to: notice.to,
      cc: notice.cc.length ? notice.cc : undefined,
      subject: notice.subject,
      text: notice.text,
      html: notice.html ?? undefined,
      attachments: notice.attachments?.length ? await this.files(notice.attachments) : undefined,
      messageId: notice.messageId,
    });
    await repo.update(
      { id: notice.id, sentAt: IsNull() },
      {
        sentAt: new Date(),
        ...(notice.sensitive ? { text: '(cleared after sending: it held a private link)', html: null } : {}),
      },
    );
  }

  /** The attachments' bytes from object storage (an outage throws, so the job tries again later). */
  private async files(list: NoticeAttachment[]): Promise<MailAttachment[]> {
    const out: MailAttachment[] = [];
    for (const a of list) {
      const stored = await this.storage.get(a.storageKey).catch((e: unknown) => {
        if (e instanceof StorageNotFoundError)
          throw new PermanentJobError(`The attachment ${a.filename} is no longer in storage`);
        throw e;
      });
      const chunks: Buffer[] = [];
      for await (const chunk of stored.body) chunks.push(Buffer.from(chunk as Uint8Array));
      out.push({ filename: a.filename, contentType: a.contentType, content: Buffer.concat(chunks) });
    }
    return out;
  }

  /** Where each notice stands: sent, queued (waiting or retrying) or failed (its job gave up). */
  async status(noticeIds: string[]): Promise<Map<string, NoticeStatus>> {
    const out = new Map<string, NoticeStatus>();
    if (noticeIds.length === 0) return out;
    const notices = await this.dataSource.getRepository(Notice).find({
      where: { id: In(noticeIds) },
      select: { id: true, sentAt: true },
    });
    const dead = await this.dataSource.query<Array<{ noticeId: string }>>(
      `SELECT JSON_UNQUOTE(JSON_EXTRACT(payload, '$.noticeId')) AS noticeId FROM jobs
        WHERE kind = ? AND state = 'dead' AND dedupe_key IN (${noticeIds.map(() => '?').join(', ')})`,
      [MAIL_JOB, ...noticeIds.map((id) => `notice:${id}`)],
    );
    const deadIds = new Set(dead.map((d) => d.noticeId));
    for (const n of notices) out.set(n.id, n.sentAt ? 'sent' : deadIds.has(n.id) ? 'failed' : 'queued');
    return out;
  }

  /** Recipients and subjects of notices, for the operator's jobs view. */
  async summaries(noticeIds: string[]): Promise<Map<string, { to: string[]; subject: string }>> {
    if (noticeIds.length === 0) return new Map();
    const notices = await this.dataSource.getRepository(Notice).find({
      where: { id: In(noticeIds) },
      select: { id: true, to: true, subject: true },
    });
    return new Map(notices.map((n) => [n.id, { to: n.to, subject: n.subject }]));
  }
}
