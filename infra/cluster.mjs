#!/usr/bin/env node
// `npm run cluster`: Roundbook on more than one database node, on loopback. Starts a three-node MariaDB
// Galera cluster, the S3 and SMTP fakes, two API processes (each on its own Galera node) and a small
// balancer on one address; migrates and seeds through the first node; prints the address; Ctrl-C stops all.
//
// `npm run cluster -- --proof` (also `npm run cluster:proof`) runs the scale-out proof instead and exits:
// rounds are written through the balancer while one Galera node is killed and brought back, and the run
// shows that nothing was lost or duplicated, that every e-mail was sent once, and that the node
// resynchronised (identical table checksums on all three). The cluster is made afresh at every start.
import { randomUUID } from 'node:crypto';
import { createWriteStream, mkdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { signedIn } from './lib/api-client.mjs';
import { startBalancer } from './lib/balancer.mjs';
import { buildAll, ensureAptPackages, ensureNodeModules, migrateAndSeed } from './lib/bootstrap.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { startCluster } from './lib/galera.mjs';
import { InfraError, fail, info, step } from './lib/log.mjs';
import { deliveryReport, receivedMail } from './lib/mailbox.mjs';
import { startChild, stopAll, waitForLine } from './lib/proc.mjs';
import { assertPortFree, startS3, startSmtp } from './lib/services.mjs';

const proof = process.argv.includes('--proof');
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const base = Number(process.env.CLUSTER_PORT_BASE ?? 0) || 0;
process.env.RB_DATA_DIR ??= path.join(root, '.data/cluster');
const { dataDir, env: localEnv } = profileEnv('local');
const ports = {
  sql: [3401, 3402, 3403].map((p) => p + base),
  api: [8091, 8092].map((p) => p + base),
  balancer: 8090 + base,
  s3: 4591 + base,
  smtp: 2591 + base,
};
const env = {
  ...localEnv,
  DB_PORT: String(ports.sql[0]),
  S3_ENDPOINT: `http://127.0.0.1:${ports.s3}`,
  SMTP_PORT: String(ports.smtp),
  LOCAL_MAIL_DIR: path.join(dataDir, 'mail'),
  APP_URL: `http://127.0.0.1:${ports.balancer}`,
  PORT: String(ports.balancer),
  // The balancer asks every 0.5 s; a node that drops out is seen within about a second.
  HEALTH_CACHE_SECONDS: '1',
  JOBS_POLL_INTERVAL_MS: '200',
};

let stopping = false;
async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  await balancer?.close();
  await stopAll();
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

let balancer;
try {
  step('Roundbook cluster: checking what is installed');
  ensureAptPackages(['mariadb-server', 'mariadb-client', 'galera-4', 'rsync', 'fonts-open-sans']);
  ensureNodeModules();
  buildAll({ web: !proof });
  for (const [what, port] of [
    ['the balancer', ports.balancer],
    ['the S3 fake', ports.s3],
    ['the SMTP fake', ports.smtp],
    ...ports.api.map((p, i) => [`API process ${i + 1}`, p]),
  ])
    await assertPortFree(port, what, 'CLUSTER_PORT_BASE');
  // A fresh cluster every time: the bootstrap node must be the one with the newest data, and a demo
  // cluster has nothing worth keeping (stack-notes §13 has the recovery step for a real one).
  rmSync(dataDir, { recursive: true, force: true });
  mkdirSync(dataDir, { recursive: true });
  const nodes = await startCluster({
    baseDir: path.join(dataDir, 'galera'),
    portBase: base,
    sqlPorts: ports.sql,
  });
  createDatabase(nodes[0]);
  await startS3({ dataDir, env });
  await startSmtp({ dataDir, env });
  migrateAndSeed(env);
  const apis = [];
  for (let i = 0; i < 2; i++) apis.push(await startApiOn(i, nodes[i]));
  balancer = await startBalancer({
    port: ports.balancer,
    targets: ports.api.map((p) => `http://127.0.0.1:${p}`),
  });
  if (proof) {
    const ok = await runProof(nodes);
    await shutdown(ok ? 0 : 1);
  } else {
    console.log(`
  Roundbook (cluster) is running at ${balancer.url}
    API process 1 on 127.0.0.1:${ports.api[0]} → Galera node n1 (127.0.0.1:${ports.sql[0]})
    API process 2 on 127.0.0.1:${ports.api[1]} → Galera node n2 (127.0.0.1:${ports.sql[1]})
    Galera node n3 on 127.0.0.1:${ports.sql[2]} (no API of its own)
  Demo logins as for npm start (password ${env.DEMO_PASSWORD}). Data in ${dataDir}. Ctrl-C stops all.
`);
  }
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  await shutdown(1);
}

function createDatabase(node) {
  const q = (s) => `'${String(s).replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;
  // User and grant statements replicate to every node (Galera runs them in total order).
  node.sql(
    [
      `CREATE DATABASE IF NOT EXISTS \`${env.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
      `CREATE USER IF NOT EXISTS '${env.DB_USER}'@'127.0.0.1' IDENTIFIED BY ${q(env.DB_PASSWORD)};`,
      `GRANT ALL PRIVILEGES ON \`${env.DB_NAME}\`.* TO '${env.DB_USER}'@'127.0.0.1';`,
    ].join('\n'),
  );
}

async function startApiOn(i, node) {
  const port = ports.api[i];
  step(`Starting API process ${i + 1} on 127.0.0.1:${port} (database: Galera node ${node.name})`);
  mkdirSync(path.join(dataDir, 'logs'), { recursive: true });
  const child = startChild(
    `API process ${i + 1}`,
    process.execPath,
    [path.join(root, 'apps/api/dist/main.js')],
    {
      env: { ...process.env, ...env, PORT: String(port), DB_PORT: String(node.sqlPort) },
      logFile: createWriteStream(path.join(dataDir, 'logs', `api-${i + 1}.log`), { flags: 'a' }),
    },
  );
  await waitForLine(child, /Roundbook listening/, { name: `API process ${i + 1}`, timeoutMs: 60000 });
  return child;
}

// ---------------------------------------------------------------------------------------------------------
// The proof

async function runProof(nodes) {
  const ROUNDS = 150;
  const INVITES = 12;
  const CONCURRENCY = 3;
  step(
    `Proof: ${ROUNDS} rounds and ${INVITES} invitations through the balancer; Galera node n2 killed and brought back`,
  );
  const geologist = await signedIn(balancer.url, 'geologist@roundbook.test', env.DEMO_PASSWORD);
  const admin = await signedIn(balancer.url, 'admin@roundbook.test', env.DEMO_PASSWORD);
  const projects = await geologist.call('GET', '/api/projects');
  const project = (projects.items ?? projects)[0];
  const headings = await geologist.call('GET', `/api/projects/${project.id}/headings`);
  const heading = (headings.items ?? headings)[0];
  const countSql = `SELECT COUNT(*) FROM \`${env.DB_NAME}\`.rounds WHERE heading_id = '${heading.id}'`;
  const before = Number(nodes[0].sql(countSql));
  const ids = Array.from({ length: ROUNDS }, () => randomUUID());
  const runTag = Date.now().toString(36);
  const timeline = [];
  const mark = (what) => {
    timeline.push(`${((Date.now() - started) / 1000).toFixed(1)} s: ${what}`);
    info(what);
  };
  const started = Date.now();
  let done = 0;
  let killed = false;
  let rejoin = null;
  let failed = null;

  const faults = async () => {
    if (!killed && done >= 40) {
      killed = true;
      mark(`killing Galera node n2 (SIGKILL) after ${done} rounds`);
      await nodes[1].kill();
    }
    if (killed && !rejoin && done >= 90) {
      mark(`bringing n2 back after ${done} rounds (--wsrep-recover, then start at the recovered position)`);
      const position = nodes[1].recoverPosition();
      rejoin = nodes[1].start({ position }).then(async () => {
        await nodes[1].waitSynced(120000);
        mark(`n2 Synced again (recovered position ${position})`);
      });
    }
  };

  let nextIndex = 0;
  const worker = async () => {
    while (nextIndex < ids.length && !failed) {
      const i = nextIndex++;
      try {
        await geologist.call('POST', `/api/projects/${project.id}/headings/${heading.id}/rounds`, {
          id: ids[i],
          stage: heading.stages?.[0] ?? 'full_face',
          faceChainage: 5000 + i,
        });
        // Every tenth round an admin invites someone: the e-mail goes through the outbox and the jobs.
        if (i % Math.ceil(ROUNDS / INVITES) === 0)
          await admin.call('POST', `/api/projects/${project.id}/invitations`, {
            email: `proof-${runTag}-${i}@roundbook.test`,
            role: 'viewer',
          });
      } catch (err) {
        failed = err;
      }
      done++;
      await faults();
    }
  };
  await Promise.all(Array.from({ length: CONCURRENCY }, worker));
  if (failed) throw failed;
  await rejoin;
  const writeSeconds = (Date.now() - started) / 1000;
  mark(`all ${ROUNDS} rounds answered in ${writeSeconds.toFixed(1)} s`);

  // The outbox drains: every notice of this run sent.
  const db = env.DB_NAME;
  const noticesSql = `SELECT COUNT(*), COALESCE(SUM(sent_at IS NOT NULL), 0) FROM \`${db}\`.notices WHERE to_addresses LIKE '%proof-${runTag}-%'`;
  let notices = [0, 0];
  const mailDeadline = Date.now() + 60000;
  while (Date.now() < mailDeadline) {
    notices = nodes[0].sql(noticesSql).split('\t').map(Number);
    if (notices[0] > 0 && notices[0] === notices[1]) break;
    await sleep(500);
  }
  const messageIds = nodes[0]
    .sql(`SELECT message_id FROM \`${db}\`.notices WHERE to_addresses LIKE '%proof-${runTag}-%'`)
    .split('\n')
    .filter(Boolean);
  const received = receivedMail(env.LOCAL_MAIL_DIR, (m) => m.to.some((t) => t.includes(`proof-${runTag}-`)));
  const delivery = deliveryReport(messageIds, received);
  const missingMail = delivery.missing;
  const duplicateMail = delivery.duplicated.length;

  // Every node: the same rounds, numbered once each, nothing half-written, identical checksums.
  await sleep(1000); // let the last write sets apply on every node (Galera applies asynchronously)
  const idList = ids.map((id) => `'${id}'`).join(',');
  const perNode = nodes.map((node) => {
    const [present, distinctNumbers, unassessed] = node
      .sql(
        `SELECT COUNT(*), COUNT(DISTINCT round_number), COALESCE(SUM(assessment IS NULL), 0) FROM \`${db}\`.rounds WHERE heading_id = '${heading.id}' AND id IN (${idList})`,
      )
      .split('\t')
      .map(Number);
    const total = Number(node.sql(countSql));
    const totalDistinct = Number(
      node.sql(
        `SELECT COUNT(DISTINCT stage, round_number) FROM \`${db}\`.rounds WHERE heading_id = '${heading.id}'`,
      ),
    );
    const checksums = node
      .sql(
        `CHECKSUM TABLE \`${db}\`.rounds, \`${db}\`.notices, \`${db}\`.audit_events, \`${db}\`.idempotency_keys`,
      )
      .split('\n')
      .map((l) => l.split('\t')[1])
      .join(' ');
    return {
      node: node.name,
      present,
      distinctNumbers,
      unassessed,
      total,
      totalDistinct,
      checksums,
      size: node.status('wsrep_cluster_size'),
      state: node.status('wsrep_local_state_comment'),
    };
  });

  const checks = [
    [
      `every node holds all ${ROUNDS} rounds once`,
      perNode.every((n) => n.present === ROUNDS && n.total === before + ROUNDS),
    ],
    [
      'round numbers are distinct on every node',
      perNode.every((n) => n.distinctNumbers === ROUNDS && n.totalDistinct === n.total),
    ],
    ['no round without its assessment (nothing half-written)', perNode.every((n) => n.unassessed === 0)],
    [
      'identical checksums of rounds, notices, audit and idempotency keys on all three nodes',
      new Set(perNode.map((n) => n.checksums)).size === 1,
    ],
    [
      'the cluster is whole again: size 3, every node Synced',
      perNode.every((n) => n.size === '3' && n.state === 'Synced'),
    ],
    [
      `every queued e-mail sent (${notices[1]} of ${notices[0]})`,
      notices[0] > 0 && notices[0] === notices[1] && missingMail.length === 0,
    ],
    [
      `no e-mail received twice (${received.length} received for ${messageIds.length} notices)`,
      duplicateMail === 0 && received.length === messageIds.length,
    ],
  ];
  const lines = [
    '',
    '  Scale-out proof (npm run cluster -- --proof)',
    ...timeline.map((t) => `    ${t}`),
    `    requests: rounds ${geologist.stats.requests} (${geologist.stats.retries} retried: ${JSON.stringify(geologist.stats.causes)}), invitations ${admin.stats.requests} (${admin.stats.retries} retried)`,
    `    balancer: ${balancer.state.map((t) => `${t.url} ${t.sent} requests`).join(', ')}`,
    ...perNode.map(
      (n) =>
        `    ${n.node}: ${n.present}/${ROUNDS} rounds of this run, ${n.total} on the heading, state ${n.state}, size ${n.size}, checksums ${n.checksums}`,
    ),
    ...checks.map(([what, ok]) => `  ${ok ? '✔' : '✘'} ${what}`),
    '',
  ];
  console.log(lines.join('\n'));
  return checks.every(([, ok]) => ok);
}
