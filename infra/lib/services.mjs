// Starting and stopping MariaDB, the S3 fake, the SMTP fake and the API, each on loopback.
import { spawnSync } from 'node:child_process';
import { createWriteStream, existsSync, mkdirSync, readFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { root } from './env.mjs';
import { InfraError, info, step } from './log.mjs';
import { isRunning, run, startChild, waitForLine } from './proc.mjs';

/** Fails with one clear line when a port on 127.0.0.1 is taken. */
export function assertPortFree(port, what, envName) {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', (err) => {
      if (err.code === 'EADDRINUSE') {
        reject(
          new InfraError(
            `Port ${port} on 127.0.0.1 (${what}) is already in use. Stop the program using it ` +
              `(see: ss -ltnp 'sport = :${port}') or choose another port with ${envName} in .env.`,
          ),
        );
      } else reject(new InfraError(`Cannot listen on 127.0.0.1:${port} for ${what}: ${err.message}`));
    });
    server.listen(port, '127.0.0.1', () => server.close(resolve));
  });
}

function logStream(dataDir, name) {
  mkdirSync(path.join(dataDir, 'logs'), { recursive: true });
  return createWriteStream(path.join(dataDir, 'logs', `${name}.log`), { flags: 'a' });
}

const sqlString = (s) => `'${String(s).replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;
const sqlIdent = (s) => {
  if (!/^[A-Za-z0-9_]+$/.test(s))
    throw new InfraError(`DB_NAME/DB_USER may hold only letters, digits and _ (got "${s}").`);
  return s;
};

/** MariaDB: initialise the data folder once, start mariadbd, create the database and application user. */
export async function startMariadb({ dataDir, env }) {
  const dir = path.join(dataDir, 'mariadb');
  const datadir = path.join(dir, 'data');
  const socket = path.join(dir, 'mariadb.sock');
  const pidFile = path.join(dir, 'mariadb.pid');
  mkdirSync(dir, { recursive: true });
  stopStaleMariadb(pidFile, datadir, socket);
  await assertPortFree(Number(env.DB_PORT), 'MariaDB', 'DB_PORT');
  if (!existsSync(path.join(datadir, 'mysql'))) {
    step('Initialising the MariaDB data folder (first run)');
    run(
      'mariadb-install-db',
      [
        '--no-defaults',
        `--datadir=${datadir}`,
        '--user=root',
        '--auth-root-authentication-method=socket',
        '--skip-test-db',
      ],
      {
        quiet: true,
        hint: 'Is the Debian package mariadb-server installed?',
      },
    );
  }
  step(`Starting MariaDB on 127.0.0.1:${env.DB_PORT}`);
  const admin = (args) =>
    spawnSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', ...args], {
      encoding: 'utf8',
    });
  const child = startChild(
    'MariaDB',
    '/usr/sbin/mariadbd',
    [
      '--no-defaults',
      `--datadir=${datadir}`,
      `--socket=${socket}`,
      `--pid-file=${pidFile}`,
      `--port=${env.DB_PORT}`,
      '--bind-address=127.0.0.1',
      '--user=root',
      `--log-error=${path.join(dir, 'error.log')}`,
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      '--skip-name-resolve',
      '--innodb-buffer-pool-size=128M',
    ],
    { logFile: logStream(dataDir, 'mariadb'), stop: async () => void admin(['shutdown']) },
  );
  const deadline = Date.now() + 30000;
  while (admin(['ping']).status !== 0) {
    if (!isRunning(child)) {
      const log = existsSync(path.join(dir, 'error.log'))
        ? readFileSync(path.join(dir, 'error.log'), 'utf8').trim().split('\n').slice(-5).join('\n')
        : '';
      throw new InfraError(`MariaDB stopped during start-up; see ${path.join(dir, 'error.log')}\n${log}`);
    }
    if (Date.now() > deadline)
      throw new InfraError(`MariaDB did not answer within 30 s; see ${path.join(dir, 'error.log')}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  const db = sqlIdent(env.DB_NAME);
  const user = sqlIdent(env.DB_USER);
  const pw = sqlString(env.DB_PASSWORD);
  const sql = [
    `CREATE DATABASE IF NOT EXISTS \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
    `CREATE USER IF NOT EXISTS '${user}'@'127.0.0.1' IDENTIFIED BY ${pw};`,
    `CREATE USER IF NOT EXISTS '${user}'@'localhost' IDENTIFIED BY ${pw};`,
    `ALTER USER '${user}'@'127.0.0.1' IDENTIFIED BY ${pw};`,
    `ALTER USER '${user}'@'localhost' IDENTIFIED BY ${pw};`,
    `GRANT ALL PRIVILEGES ON \`${db}\`.* TO '${user}'@'127.0.0.1', '${user}'@'localhost';`,
  ].join('\n');
  const r = spawnSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot'], {
    input: sql,
    encoding: 'utf8',
  });
  if (r.status !== 0) throw new InfraError(`Could not create the database and user: ${r.stderr.trim()}`);
  info(`MariaDB ready (PID ${child.pid}), database ${db}, user ${user}`);
  const rootSql = (statement, args = []) =>
    spawnSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', ...args], {
      input: statement,
      encoding: 'utf8',
    });
  return {
    child,
    socket,
    /** Rows of a query as root in the application's database: arrays of strings (NULL as 'NULL'). */
    rows: (statement) => {
      const r = rootSql(statement, ['-N', '-B', db]);
      if (r.status !== 0) throw new InfraError(`Query failed: ${r.stderr.trim()}\n${statement}`);
      return r.stdout
        .split('\n')
        .filter(Boolean)
        .map((line) => line.split('\t'));
    },
    rootSql: (statement) => rootSql(statement),
  };
}

/** A mariadbd left running by an earlier start of ours (same data folder) is shut down first. */
function stopStaleMariadb(pidFile, datadir, socket) {
  if (!existsSync(pidFile)) return;
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  if (!pid) return;
  let cmdline;
  try {
    cmdline = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
  } catch {
    return; // not running
  }
  if (!cmdline.includes(datadir)) return;
  info(`A MariaDB from an earlier start is still running on this data folder (PID ${pid}); shutting it down`);
  spawnSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', 'shutdown'], {
    encoding: 'utf8',
  });
  const deadline = Date.now() + 20000;
  while (existsSync(`/proc/${pid}`) && Date.now() < deadline) spawnSync('sleep', ['0.1']);
}

/** The S3 fake (s3rver) with its bucket. */
export async function startS3({ dataDir, env }) {
  const port = Number(new URL(env.S3_ENDPOINT).port);
  await assertPortFree(port, 'the S3 fake', 'S3_ENDPOINT');
  step(`Starting the S3 fake on 127.0.0.1:${port}`);
  const dir = path.join(dataDir, 's3');
  mkdirSync(dir, { recursive: true });
  const child = startChild('S3 fake', process.execPath, [path.join(root, 'infra/fakes/s3-fake.mjs')], {
    env: { ...process.env, S3_FAKE_PORT: String(port), S3_FAKE_DIR: dir, S3_FAKE_BUCKET: env.S3_BUCKET },
    logFile: logStream(dataDir, 's3'),
  });
  await waitForLine(child, /S3 fake listening/, { name: 'The S3 fake' });
  info(`S3 fake ready (PID ${child.pid}), bucket ${env.S3_BUCKET}, data in ${dir}`);
  return child;
}

/** The SMTP fake: keeps every received message under <data>/mail. */
export async function startSmtp({ dataDir, env }) {
  const port = Number(env.SMTP_PORT);
  await assertPortFree(port, 'the SMTP fake', 'SMTP_PORT');
  step(`Starting the SMTP fake on 127.0.0.1:${port}`);
  mkdirSync(env.LOCAL_MAIL_DIR, { recursive: true });
  const child = startChild('SMTP fake', process.execPath, [path.join(root, 'infra/fakes/smtp-fake.mjs')], {
    env: { ...process.env, SMTP_FAKE_PORT: String(port), SMTP_FAKE_DIR: env.LOCAL_MAIL_DIR },
    logFile: logStream(dataDir, 'smtp'),
  });
  await waitForLine(child, /SMTP fake listening/, { name: 'The SMTP fake' });
  info(`SMTP fake ready (PID ${child.pid}), messages kept in ${env.LOCAL_MAIL_DIR}`);
  return child;
}

/** The API (serving the built web app). */
export async function startApi({ dataDir, env }) {
  await assertPortFree(Number(env.PORT), 'Roundbook', 'PORT');
  step(`Starting Roundbook on ${env.HOST}:${env.PORT}`);
  const child = startChild('Roundbook API', process.execPath, [path.join(root, 'apps/api/dist/main.js')], {
    env: { ...process.env, ...env },
    logFile: logStream(dataDir, 'api'),
  });
  await waitForLine(child, /Roundbook listening/, {
    name: 'Roundbook',
    timeoutMs: 60000,
    hint: `See ${path.join(dataDir, 'logs', 'api.log')}.`,
  });
  return child;
}
