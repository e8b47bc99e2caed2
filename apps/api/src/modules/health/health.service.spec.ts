import type { DataSource } from 'typeorm';
import type { AppConfig } from '../../config/app-config.js';
import type { MailService } from '../../infrastructure/mail/mail.service.js';
import type { StorageService } from '../../infrastructure/storage/storage.service.js';
import { HealthService } from './health.service.js';

/** A database that answers like MariaDB: `@@wsrep_on` and, on a Galera node, the two status rows. */
function database(wsrepOn: 0 | 1, ready = 'ON', state = 'Synced'): DataSource {
  const query = jest.fn((sql: string) => {
    if (sql.includes('@@wsrep_on')) return Promise.resolve([{ wsrepOn }]);
    if (sql.startsWith('SHOW GLOBAL STATUS'))
      return Promise.resolve([
        { Variable_name: 'wsrep_local_state_comment', Value: state },
        { Variable_name: 'wsrep_ready', Value: ready },
      ]);
    return Promise.reject(new Error(`unexpected query ${sql}`));
  });
  return { query } as unknown as DataSource;
}

const service = (db: DataSource) =>
  new HealthService(
    db,
    { check: jest.fn(() => Promise.resolve()) } as unknown as StorageService,
    { check: jest.fn(() => Promise.resolve()) } as unknown as MailService,
    { healthCacheSeconds: 0 } as AppConfig,
  );

describe('HealthService database readiness (Galera states from stack-notes §13)', () => {
  it('a server without Galera is ready when it answers', async () => {
    const result = await service(database(0)).check();
    expect(result.database.ok).toBe(true);
    expect(result.status).toBe('ok');
  });

  it('a synced Galera node in the primary component is ready', async () => {
    expect((await service(database(1, 'ON', 'Synced')).check()).database.ok).toBe(true);
  });

  it.each([
    ['joining (state transfer)', 'OFF', 'Joining'],
    ['cut off from the primary component', 'OFF', 'Initialized'],
    ['donating a state transfer', 'ON', 'Donor/Desynced'],
  ])('a Galera node %s is not ready, so a balancer sends no one to it', async (_what, ready, state) => {
    const result = await service(database(1, ready, state)).check();
    expect(result.database).toEqual({ ok: false, detail: 'not answering (see the server log)' });
    expect(result.status).toBe('degraded');
  });

  it('a database that does not answer is not ready', async () => {
    const db = { query: jest.fn(async () => Promise.reject(new Error('connect ECONNREFUSED'))) };
    expect((await service(db as unknown as DataSource).check()).database.ok).toBe(false);
  });
});
