import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { APP_CONFIG, type AppConfig } from '../../config/app-config.js';
import { MailService } from '../../infrastructure/mail/mail.service.js';
import { StorageService } from '../../infrastructure/storage/storage.service.js';
import type { ComponentHealthDto, HealthDto } from './health.dto.js';

const within = <T>(p: Promise<T>, ms: number): Promise<T> => {
  let timer: NodeJS.Timeout | undefined;
  return Promise.race([
    p,
    new Promise<T>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms);
    }),
  ]).finally(() => clearTimeout(timer));
};

/**
 * Readiness: database, object storage and mail transport, checked at most once per HEALTH_CACHE_SECONDS
 * however often it is asked (concurrent callers share one check). Callers see only whether each part
 * answers; what failed and why (hosts, versions, errors) goes to the log, not to anonymous callers.
 */
@Injectable()
export class HealthService {
  private readonly logger = new Logger('Health');
  private cached: { at: number; result: HealthDto } | undefined;
  private running: Promise<HealthDto> | undefined;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(StorageService) private readonly storage: StorageService,
    @Inject(MailService) private readonly mail: MailService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async check(now = Date.now()): Promise<HealthDto> {
    if (this.cached && now - this.cached.at < this.config.healthCacheSeconds * 1000)
      return this.cached.result;
    this.running ??= this.checkNow().finally(() => (this.running = undefined));
    const result = await this.running;
    this.cached = { at: Date.now(), result };
    return result;
  }

  private async probe(name: string, fn: () => Promise<unknown>): Promise<ComponentHealthDto> {
    try {
      await within(fn(), 4000);
      return { ok: true, detail: 'answering' };
    } catch (e) {
      this.logger.warn(`${name} check failed: ${e instanceof Error ? e.message : String(e)}`);
      return { ok: false, detail: 'not answering (see the server log)' };
    }
  }

  /**
   * The database answers and, on a Galera node, is part of the primary component and synced: a joining or
   * cut-off node answers `SELECT 1` but refuses reads and writes with 1047 (stack-notes §13), so the port alone
   * says too little. A server without Galera (`@@wsrep_on` 0) needs only the answer.
   */
  private async databaseReady(): Promise<void> {
    const [row] = await this.dataSource.query<{ wsrepOn: number | string }[]>('SELECT @@wsrep_on AS wsrepOn');
    if (Number(row?.wsrepOn ?? 0) !== 1) return;
    const status = await this.dataSource.query<{ Variable_name: string; Value: string }[]>(
      "SHOW GLOBAL STATUS WHERE Variable_name IN ('wsrep_ready', 'wsrep_local_state_comment')",
    );
    const value = (name: string) => status.find((s) => s.Variable_name === name)?.Value;
    const ready = value('wsrep_ready');
    const state = value('wsrep_local_state_comment');
    if (ready !== 'ON' || state !== 'Synced')
      throw new Error(`Galera node not ready (wsrep_ready ${ready ?? '?'}, state ${state ?? '?'})`);
  }

  private async checkNow(): Promise<HealthDto> {
    const [database, storage, mail] = await Promise.all([
      this.probe('database', () => this.databaseReady()),
      this.probe('storage', () => this.storage.check()),
      this.probe('mail', () => this.mail.check()),
    ]);
    const ok = database.ok && storage.ok && mail.ok;
    return { status: ok ? 'ok' : 'degraded', checkedAt: new Date().toISOString(), database, storage, mail };
  }
}
