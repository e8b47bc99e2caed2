import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadAppConfig } from './config/app-config.js';
import { databaseOptions } from './database/options.js';
import { seedDemo } from './database/seed/demo-seed.js';

/**
 * Operations for infra/ scripts: `node dist/cli.js check-env | migrate | seed`.
 * check-env prints every invalid variable and exits 1, before any service is started.
 */
async function main(command: string | undefined): Promise<void> {
  let config;
  try {
    config = loadAppConfig();
  } catch (e) {
    console.error(e instanceof Error ? e.message : String(e));
    process.exit(1);
  }
  if (command === 'check-env') {
    console.log('Environment is valid.');
    return;
  }
  const dataSource = new DataSource(databaseOptions(config));
  try {
    await dataSource.initialize();
    if (command === 'migrate') {
      const ran = await dataSource.runMigrations({ transaction: 'each' });
      console.log(
        ran.length
          ? `  applied ${ran.length} migration(s): ${ran.map((m) => m.name).join(', ')}`
          : '  database schema is up to date',
      );
    } else if (command === 'seed') {
      if (!config.demoPassword) throw new Error('DEMO_PASSWORD is not set; nothing seeded.');
      const seeded = await seedDemo(dataSource, config.demoPassword);
      console.log(
        seeded ? '  demo scenario seeded (empty database)' : '  database already holds data: demo not seeded',
      );
    } else {
      throw new Error(`Unknown command "${command ?? ''}". Use check-env, migrate or seed.`);
    }
  } finally {
    if (dataSource.isInitialized) await dataSource.destroy();
  }
}

main(process.argv[2]).catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : String(e));
  process.exit(1);
});
