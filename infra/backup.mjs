// `npm run backup [-- --to <folder>] [--profile test]`: a consistent dump of the database and a copy of
// object storage into a dated folder (backups/<date-time>/ by default), with a manifest restore checks.
import path from 'node:path';
import { backup } from './lib/backup.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { fail, InfraError } from './lib/log.mjs';

const args = process.argv.slice(2);
const option = (name) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : undefined;
};
const { env } = profileEnv(option('profile') ?? 'local');
const stamp = new Date().toISOString().replace(/[:.]/g, '-').slice(0, 19);
const dir = path.resolve(option('to') ?? path.join(root, 'backups', stamp));
try {
  await backup(env, dir);
  console.log(`Backup written to ${dir}`);
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  process.exit(1);
}
