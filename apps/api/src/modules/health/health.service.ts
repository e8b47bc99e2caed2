import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { MailService } from '../../infrastructure/mail/mail.service.js';
import { StorageService } from '../../infrastructure/storage/storage.service.js';
import type { ComponentHealthDto, HealthDto } from './health.dto.js';

const within = <T>(p: Promise<T>, ms: number): Promise<T> =>
  Promise.race([
    p,
    new Promise<T>((_, reject) => setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms)),
  ]);

async function probe(fn: () => Promise<string>): Promise<ComponentHealthDto> {
  try {
    return { ok: true, detail: await within(fn(), 4000) };
  } catch (e) {
    return { ok: false, detail: e instanceof Error ? e.message : String(e) };
  }
}

@Injectable()
export class HealthService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(StorageService) private readonly storage: StorageService,
    @Inject(MailService) private readonly mail: MailService,
  ) {}

  async check(): Promise<HealthDto> {
    const [database, storage, mail] = await Promise.all([
      probe(async () => {
        const rows: Array<{ v: string }> = await this.dataSource.query('SELECT VERSION() AS v');
        return `MariaDB ${rows[0]?.v ?? ''}`.trim();
      }),
      probe(() => this.storage.check()),
      probe(() => this.mail.check()),
    ]);
    const ok = database.ok && storage.ok && mail.ok;
    return { status: ok ? 'ok' : 'degraded', database, storage, mail };
  }
}
