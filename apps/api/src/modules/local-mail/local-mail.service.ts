import { createReadStream, existsSync } from 'node:fs';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { Inject, Injectable, StreamableFile } from '@nestjs/common';
import { DomainException, ErrorCode } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import type { Job } from '../../infrastructure/jobs/job.entity.js';
import { JobsService } from '../../infrastructure/jobs/jobs.service.js';
import { MAIL_JOB, NoticesService } from '../../infrastructure/mail/notices.service.js';
import type { JobDto, JobsOverviewDto } from './dto/job.dto.js';
import type { MailMessageDto } from './dto/mail-message.dto.js';

const ID = /^[A-Za-z0-9-]+$/;

/**
 * Local mode only, for the instance operator (OperatorGuard on every route): the messages the SMTP fake
 * received (infra/fakes/smtp-fake.mjs keeps them as files) and the jobs not done yet.
 */
@Injectable()
export class LocalMailService {
  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(JobsService) private readonly jobsTable: JobsService,
    @Inject(NoticesService) private readonly notices: NoticesService,
  ) {}

  private dir(): string {
    const dir = this.config.mail.localInboxDir;
    if (!this.config.localMode || !dir) throw DomainException.notFound('The local mail view');
    return dir;
  }

  async list(limit = 200): Promise<MailMessageDto[]> {
    const dir = this.dir();
    if (!existsSync(dir)) return [];
    const files = (await readdir(dir))
      .filter((f) => f.endsWith('.json'))
      .sort()
      .reverse()
      .slice(0, limit);
    const messages = await Promise.all(
      files.map(
        async (f) =>
          JSON.parse(await readFile(path.join(dir, f), 'utf8')) as MailMessageDto & Record<string, unknown>,
      ),
    );
    return messages.map((m) => ({
      id: m.id,
      from: m.from,
      to: m.to,
      subject: m.subject,
      date: m.date,
      text: m.text,
      html: m.html,
      attachments: m.attachments,
    }));
  }

  async attachment(id: string, index: number): Promise<StreamableFile> {
    const dir = this.dir();
    if (!ID.test(id) || !Number.isInteger(index) || index < 0)
      throw DomainException.notFound('The attachment');
    const summaryFile = path.join(dir, `${id}.json`);
    if (!existsSync(summaryFile)) throw DomainException.notFound('The message');
    const summary = JSON.parse(await readFile(summaryFile, 'utf8')) as MailMessageDto;
    const meta = summary.attachments.find((a) => a.index === index);
    const file = path.join(dir, `${id}.att${index}`);
    if (!meta || !existsSync(file)) throw DomainException.notFound('The attachment');
    return new StreamableFile(createReadStream(file), {
      type: meta.contentType,
      disposition: `attachment; filename="${meta.filename.replace(/["\\\r\n]/g, '_')}"`,
      length: meta.size,
    });
  }

  async jobs(): Promise<JobsOverviewDto> {
    this.dir();
    const { jobs, counts } = await this.jobsTable.overview();
    const summaries = await this.summaries(jobs);
    return { counts, jobs: jobs.map((j) => this.toJobDto(j, summaries)) };
  }

  async retry(jobId: string): Promise<JobDto> {
    this.dir();
    const job = await this.jobsTable.find(jobId);
    if (!job) throw DomainException.notFound('The job');
    if (job.state === 'done' || job.state === 'running')
      throw new DomainException(
        ErrorCode.Conflict,
        `This job is ${job.state}; only waiting or failed jobs can be retried.`,
      );
    const retried = (await this.jobsTable.retry(jobId, new Date()))!;
    return this.toJobDto(retried, await this.summaries([retried]));
  }

  private async summaries(jobs: Job[]): Promise<Map<string, string>> {
    const noticeIds = jobs.filter((j) => j.kind === MAIL_JOB).map((j) => String(j.payload.noticeId));
    const notices = await this.notices.summaries(noticeIds);
    const out = new Map<string, string>();
    for (const j of jobs) {
      const n = j.kind === MAIL_JOB ? notices.get(String(j.payload.noticeId)) : undefined;
      if (n) out.set(j.id, `To ${n.to.join(', ')}: ${n.subject}`);
    }
    return out;
  }

  private toJobDto(j: Job, summaries: Map<string, string>): JobDto {
    return {
      id: j.id,
      kind: j.kind,
      state: j.state,
      attempts: j.attempts,
      maxAttempts: this.config.jobs.maxAttempts,
      nextAttemptAt: j.nextAttemptAt.toISOString(),
      lastError: j.lastError,
      summary: summaries.get(j.id) ?? null,
      createdAt: j.createdAt.toISOString(),
      updatedAt: j.updatedAt.toISOString(),
    };
  }
}
