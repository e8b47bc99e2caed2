import { createReadStream, existsSync } from 'node:fs';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { Inject, Injectable, StreamableFile } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { Repository } from 'typeorm';
import type { AuthUser } from '../../common/auth/auth-user.js';
import { DomainException } from '../../common/errors/domain.exception.js';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { ProjectMember } from '../projects/project-member.entity.js';
import type { MailMessageDto } from './dto/mail-message.dto.js';

const ID = /^[A-Za-z0-9-]+$/;

/** Local mode only: the messages the SMTP fake received (infra/fakes/smtp-fake.mjs keeps them as files). */
@Injectable()
export class LocalMailService {
  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @InjectRepository(ProjectMember) private readonly members: Repository<ProjectMember>,
  ) {}

  private async dir(caller: AuthUser): Promise<string> {
    const dir = this.config.mail.localInboxDir;
    if (!this.config.localMode || !dir) throw DomainException.notFound('The local mail view');
    const admin = await this.members.exists({ where: { userId: caller.id, role: 'admin' } });
    if (!admin) throw DomainException.forbidden('Only project admins can read the local mail view.');
    return dir;
  }

  async list(caller: AuthUser, limit = 200): Promise<MailMessageDto[]> {
    const dir = await this.dir(caller);
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

  async attachment(caller: AuthUser, id: string, index: number): Promise<StreamableFile> {
    const dir = await this.dir(caller);
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
}
