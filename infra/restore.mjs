// `npm run restore -- --from <folder> [--database <name>] [--bucket <name>] [--profile test] [--yes]`:
// loads a backup made by `npm run backup` into the instance's database (or another one) and bucket, then
// checks row counts and table checksums against the backup's manifest. Replacing the instance's own
// database asks for --yes; a database of another name is created with the instance's root socket.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { restore } from './lib/backup.mjs';
import { profileEnv } from './lib/env.mjs';
import { fail, InfraError } from './lib/log.mjs';

const args = process.argv.slice(2);
const option = (name) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : undefined;
};
const { env, dataDir } = profileEnv(option('profile') ?? 'local');
try {
  const from = option('from');
  if (!from) throw new InfraError('Say which backup: npm run restore -- --from backups/<folder>');
  const database = option('database') ?? env.DB_NAME;
  if (database === env.DB_NAME && !args.includes('--yes'))
    throw new InfraError(
      `This replaces the tables of ${database} with the backup's. Stop Roundbook first, then run again with --yes (or restore into another database with --database <name>).`,
    );
  const socket = path.join(dataDir, 'mariadb', 'mariadb.sock');
  await restore(env, path.resolve(from), {
    database,
    bucket: option('bucket') ?? env.S3_BUCKET,
    socket: existsSync(socket) ? socket : undefined,
  });
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  process.exit(1);
}
