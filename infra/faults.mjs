#!/usr/bin/env node
// `npm run faults`: the single-server fault run. Starts an instance of its own (MariaDB, the S3 fake, the
// SMTP fake and the API under infra/lib/supervise.mjs; folder .data/faults, ports of the `faults` profile
// moved by RB_TEST_PORT_OFFSET, all on 127.0.0.1), seeds the demo, and under a bounded write load of round
// creates, saves and submits (HTTP clients retrying with their Idempotency-Key and round id, as the web's
// sync does):
//   a. kills MariaDB (SIGKILL by PID) and starts it again;
//   b. stops the S3 fake during photo uploads and handover PDF jobs, and starts it again;
//   c. stops the SMTP fake while notices are queued, and starts it again;
//   d. kills the API process; the supervisor starts it again.
// Every answer must be a success or a clean failure (503 with Retry-After; a dropped connection only while
// the API process itself is down), never another 5xx or a hang; then the database is compared with what
// the clients were told. Prints the figures; stops everything it started, by PID, within FAULTS_LIMIT_S.
import { randomUUID } from 'node:crypto';
import { rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { ApiError, signedIn } from './lib/api-client.mjs';
import { buildAll, checkEnvironment, ensureAptPackages, migrateAndSeed } from './lib/bootstrap.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { InfraError, fail, info, step } from './lib/log.mjs';
import { deliveryReport, receivedMail } from './lib/mailbox.mjs';
import { isRunning, stopAll } from './lib/proc.mjs';
import { startApi, startMariadb, startS3, startSmtp } from './lib/services.mjs';
import { supervise } from './lib/supervise.mjs';

const LIMIT_S = Number(process.env.FAULTS_LIMIT_S ?? 240) || 240;
/** No attempt may take longer than this (a hang is a failure). */
const ATTEMPT_BOUND_MS = 15_000;
/** How long one client keeps retrying one request before it reports the request failed. */
const GIVE_UP_MS = 45_000;
const WORKERS = 4;
const FAULT_AFTER_MS = 3000;
const DOWN_MS = 4000;
const SETTLE_MS = 4000;

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const { dataDir, env: profile } = profileEnv('faults');
const env = {
  ...profile,
  // Failed jobs come back within a second or two, so the run sees them finish.
  JOBS_POLL_INTERVAL_MS: '200',
  JOBS_BACKOFF_BASE_MS: '500',
  JOBS_BACKOFF_MAX_MS: '2000',
  HEALTH_CACHE_SECONDS: '1',
};
const baseUrl = `http://127.0.0.1:${env.PORT}`;

let stopping = false;
let stopSupervising = () => {};
let watchdog;
async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  clearTimeout(watchdog);
  stopSupervising();
  step('Stopping everything the fault run started');
  await stopAll();
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(130));
process.on('SIGTERM', () => void shutdown(143));

// ---------------------------------------------------------------------------------------------------------
// Accounting: every attempt of every client, by fault phase.

const t0 = Date.now();
const secs = (ms) => (ms / 1000).toFixed(1);
const timeline = [];
const mark = (what) => {
  timeline.push(`${secs(Date.now() - t0)} s  ${what}`);
  info(what);
};
let phase = 'setup';
const phases = {}; // name → { attempts, ok, refused, unavailable, dropped, timeout, 'server-error', gateway, slowestMs }
/** Outcomes a phase may show besides ok: a dropped connection only while the API process is down. */
const dropsAllowed = new Set(['d. API process killed']);
const defects = [];
let recovery = null; // { since, at } — the first write answered after `since`

function onAttempt(a) {
  const p = (phases[phase] ??= { attempts: 0, slowestMs: 0 });
  p.attempts++;
  p[a.outcome] = (p[a.outcome] ?? 0) + 1;
  p.slowestMs = Math.max(p.slowestMs, a.ms);
  const bad =
    a.outcome === 'server-error' ||
    a.outcome === 'timeout' ||
    a.outcome === 'gateway' ||
    (a.outcome === 'dropped' && !dropsAllowed.has(phase)) ||
    a.ms > ATTEMPT_BOUND_MS;
  if (bad)
    defects.push(`${phase}: ${a.method} ${a.url} → ${a.outcome} ${a.status || a.cause} after ${a.ms} ms`);
  if (a.outcome === 'ok' && a.method !== 'GET' && recovery && !recovery.at && a.at > recovery.since)
    recovery.at = a.at;
}

// ---------------------------------------------------------------------------------------------------------
// The load: rounds created, saved with joints, submitted, each step retried by its client.

const ledger = []; // one entry per round flow
let chainage = 6000;

/** A complete record: three joints, Q inputs, a class and a next round length, so it can be submitted. */
function saveBodyOf(r, ctx, joints) {
  return {
    version: r.version,
    faceChainage: r.faceChainage,
    previousChainage: r.previousChainage,
    roundLength: r.roundLength,
    shiftDate: r.shiftDate,
    shift: r.shift,
    distantParts: '',
    joints,
    // Q = 60/4 × 1.5/2 × 1/1 = 11.25 (Barton et al. 1974) [computed here]
    qInput: { rqd: 60, jn: 4, jr: 1.5, ja: 2, jw: 1, srf: 1 },
    rmrInput: null,
    gsiObserved: null,
    recommendedClassId: ctx.classId,
    nextRoundLength: 1,
    recommendationReason: 'Fault run: written while parts of the stack were stopped on purpose.',
  };
}

const jointOf = (orientationText) => ({
  id: randomUUID(),
  kind: 'joint',
  orientationText,
  notation: 'dip-direction/dip',
  setLabel: null,
  spacingM: 0.5,
  persistenceM: 3,
  apertureMm: 0.5,
  jr: 1.5,
  jrc: null,
  jrcMethod: null,
  infill: '',
  ja: 2,
  water: 'damp',
  thicknessM: null,
  notes: '',
});

const sameIds = (a, b) => JSON.stringify([...a].sort()) === JSON.stringify([...b].sort());

async function roundFlow(geo, ctx, { submit = true } = {}) {
  const rec = {
    id: randomUUID(),
    key: randomUUID(),
    phase,
    created: false,
    jointIds: null,
    saved: false,
    submitted: false,
    resolved: 0,
    error: null,
  };
  ledger.push(rec);
  const p = `/api/projects/${ctx.projectId}`;
  const opts = { untilMs: GIVE_UP_MS };
  try {
    let r = await geo.call(
      'POST',
      `${p}/headings/${ctx.headingId}/rounds`,
      { id: rec.id, stage: ctx.stage, faceChainage: (chainage += ctx.sense * 3) },
      { ...opts, headers: { 'idempotency-key': rec.key } },
    );
    if (r.id !== rec.id) throw new InfraError(`The create answered round ${r.id}, not ${rec.id}`);
    rec.created = true;
    const joints = ['120/45', '210/70', '300/20'].map(jointOf);
    rec.jointIds = joints.map((j) => j.id);
    const body = saveBodyOf(r, ctx, joints);
    try {
      r = await geo.call('PUT', `${p}/rounds/${rec.id}`, body, opts);
    } catch (err) {
      // A save whose answer was lost but which was kept: the retry meets its own new version.
      const current =
        err instanceof ApiError && err.body?.code === 'STALE_VERSION' && err.body.details?.current;
      const ours =
        current &&
        current.version === body.version + 1 &&
        sameIds(
          current.joints.map((j) => j.id),
          rec.jointIds,
        );
      if (!ours) throw err;
      rec.resolved++;
      r = current;
    }
    rec.saved = true;
    if (!submit) return rec;
    try {
      r = await geo.call('POST', `${p}/rounds/${rec.id}/submit`, { version: r.version }, opts);
    } catch (err) {
      if (!(err instanceof ApiError && err.status === 409)) throw err;
      const now = await geo.call('GET', `${p}/rounds/${rec.id}`, undefined, opts);
      if (now.status !== 'submitted') throw err;
      rec.resolved++;
    }
    rec.submitted = true;
  } catch (err) {
    rec.error = err instanceof Error ? err.message : String(err);
  }
  return rec;
}

/** Runs `WORKERS` clients making rounds; `fault()` is run after FAULT_AFTER_MS; stops SETTLE_MS after recovery. */
async function underLoad(geo, ctx, name, fault) {
  phase = name;
  step(`Fault ${name}`);
  let running = true;
  const loops = Array.from({ length: WORKERS }, async () => {
    while (running) await roundFlow(geo, ctx);
  });
  try {
    await sleep(FAULT_AFTER_MS);
    await fault();
    const deadline = Date.now() + 60_000;
    while (!recovery.at && Date.now() < deadline) await sleep(100);
    if (!recovery.at) throw new InfraError(`${name}: no write succeeded within 60 s of the restart`);
    mark(`first write answered ${secs(recovery.at - recovery.since)} s after the restart`);
    await sleep(SETTLE_MS);
  } finally {
    running = false;
    await Promise.all(loops);
  }
  return {
    recoveryS: (recovery.at - recovery.since) / 1000,
    outageS: (recovery.at - recovery.faultAt) / 1000,
  };
}

const waitFor = async (what, test, ms = 60_000) => {
  const deadline = Date.now() + ms;
  while (Date.now() < deadline) {
    if (await test()) return;
    await sleep(250);
  }
  throw new InfraError(`${what}: not so within ${ms / 1000} s`);
};

/** A process stopped by SIGKILL, waited for. */
async function kill(child, what) {
  mark(`SIGKILL ${what} (PID ${child.pid})`);
  const gone = new Promise((r) => (isRunning(child) ? child.once('exit', r) : r()));
  process.kill(child.pid, 'SIGKILL');
  await gone;
}

// ---------------------------------------------------------------------------------------------------------

try {
  step('Roundbook fault run: checking what is installed');
  ensureAptPackages(['mariadb-server', 'mariadb-client']);
  buildAll({ web: false });
  checkEnvironment(env);
  watchdog = setTimeout(() => {
    fail(`The fault run passed its bound of ${LIMIT_S} s; stopping everything it started.`);
    void shutdown(2);
  }, LIMIT_S * 1000);
  // A fresh instance every run: the checks compare the database with this run's clients only.
  for (const d of ['mariadb', 's3', 'mail', 'logs'])
    rmSync(path.join(dataDir, d), { recursive: true, force: true });
  let db = await startMariadb({ dataDir, env });
  let s3 = await startS3({ dataDir, env });
  let smtp = await startSmtp({ dataDir, env });
  migrateAndSeed(env);
  let api = await startApi({ dataDir, env });
  let apiRestarted = null; // resolves when the supervisor has the API running again
  stopSupervising = supervise(
    'Roundbook (the API)',
    api,
    async () => {
      api = await startApi({ dataDir, env });
      apiRestarted?.(api);
      return api;
    },
    { isStopping: () => stopping, logHint: `See ${dataDir}/logs/api.log.` },
  );
  const firstApiPid = api.pid;

  const options = { timeoutMs: ATTEMPT_BOUND_MS + 5000, onAttempt };
  const password = env.DEMO_PASSWORD;
  const geo = await signedIn(baseUrl, 'geologist@roundbook.test', password, options);
  const admin = await signedIn(baseUrl, 'admin@roundbook.test', password, options);
  const supervisor = await signedIn(baseUrl, 'supervisor@roundbook.test', password, options);
  const projects = await geo.call('GET', '/api/projects');
  const project = (projects.items ?? projects)[0];
  const headings = await geo.call('GET', `/api/projects/${project.id}/headings`);
  const heading = (headings.items ?? headings).find((h) => h.stages.length === 1) ?? headings[0];
  const classes = await geo.call('GET', `/api/projects/${project.id}/support-classes`);
  const shortest = classes.classes.reduce((a, b) => (a.maxRoundLength <= b.maxRoundLength ? a : b));
  const ctx = {
    projectId: project.id,
    headingId: heading.id,
    stage: heading.stages[0],
    classId: shortest.id,
    sense: heading.chainageSense === 'decreasing' ? -1 : 1,
  };
  const next = await geo.call(
    'GET',
    `/api/projects/${project.id}/headings/${heading.id}/rounds/next?stage=${heading.stages[0]}`,
  );
  chainage = next.previousChainage; // each round of the run advances 3 m from the heading's last face
  // A second supervisor to hand over to: the demo viewer takes the role on this throw-away instance.
  const team = await admin.call('GET', `/api/projects/${project.id}/team`);
  const incoming = team.members.find((m) => m.email === 'viewer@roundbook.test');
  await admin.call('PATCH', `/api/projects/${project.id}/members/${incoming.memberId}`, {
    role: 'supervisor',
  });
  const runTag = Date.now().toString(36);
  mark(`instance ready on ${baseUrl}; load on heading ${heading.code}, ${WORKERS} clients`);

  // a. MariaDB killed and started again.
  const a = await underLoad(geo, ctx, 'a. MariaDB killed', async () => {
    const faultAt = Date.now();
    await kill(db.child, 'MariaDB');
    await sleep(DOWN_MS);
    db = await startMariadb({ dataDir, env });
    mark('MariaDB started again (crash recovery done)');
    recovery = { faultAt, since: Date.now() };
  });
  const apiSurvivedDb = api.pid === firstApiPid && isRunning(api);

  // b. The S3 fake stopped during photo uploads and handover PDF jobs.
  phase = 'b. S3 fake stopped';
  step(`Fault ${phase}`);
  const sharp = createRequire(path.join(root, 'apps/api/package.json'))('sharp');
  const photoRound = await roundFlow(geo, ctx, { submit: false });
  if (!photoRound.saved) throw new InfraError(`Could not make the round for photos: ${photoRound.error}`);
  const photos = []; // { id, stored, error }
  const uploadOne = async (i) => {
    const bytes = await sharp({
      create: { width: 96, height: 64, channels: 3, background: { r: 40 + i, g: 90, b: 120 } },
    })
      .jpeg()
      .toBuffer();
    const entry = { id: null, stored: false, error: null };
    photos.push(entry);
    const p = `/api/projects/${project.id}/rounds/${photoRound.id}/photos`;
    try {
      const up = await geo.call(
        'POST',
        p,
        { fileName: `face-${i}.jpg`, contentType: 'image/jpeg', size: bytes.length },
        { untilMs: GIVE_UP_MS },
      );
      entry.id = up.photo.id;
      const parts = [];
      for (let n = 1; n <= up.partCount; n++) {
        const chunk = new Uint8Array(bytes.subarray((n - 1) * up.partSize, n * up.partSize));
        parts.push(await geo.call('PUT', `${p}/${entry.id}/parts/${n}`, chunk, { untilMs: GIVE_UP_MS }));
      }
      await geo.call('POST', `${p}/${entry.id}/complete`, { parts }, { untilMs: GIVE_UP_MS });
      entry.stored = true;
    } catch (err) {
      entry.error = err instanceof Error ? err.message : String(err);
    }
  };
  const handovers = []; // ids answered
  const handOver = async () => {
    const h = await supervisor.call(
      'POST',
      `/api/projects/${project.id}/handovers`,
      {
        shiftDate: new Date().toISOString().slice(0, 10),
        shift: 'day',
        incomingUserId: incoming.userId,
        headings: [{ headingId: heading.id, cycleStage: 'mapping', notes: `Fault run ${runTag}` }],
      },
      { untilMs: GIVE_UP_MS },
    );
    handovers.push(h.id);
  };
  let uploading = true;
  let photoIndex = 0;
  const uploaders = Array.from({ length: 2 }, async () => {
    while (uploading) await uploadOne(photoIndex++);
  });
  await sleep(1500);
  recovery = { faultAt: Date.now(), since: Infinity };
  await kill(s3, 'the S3 fake');
  await Promise.all([handOver(), handOver(), sleep(DOWN_MS)]);
  s3 = await startS3({ dataDir, env });
  mark('S3 fake started again');
  recovery.since = Date.now();
  await waitFor('a photo upload after the S3 fake came back', () => recovery.at, 60_000);
  const b = {
    recoveryS: (recovery.at - recovery.since) / 1000,
    outageS: (recovery.at - recovery.faultAt) / 1000,
  };
  mark(`first upload step answered ${secs(recovery.at - recovery.since)} s after the restart`);
  await sleep(2000);
  uploading = false;
  await Promise.all(uploaders);
  const storedIds = photos.filter((x) => x.stored).map((x) => `'${x.id}'`);
  await waitFor('every stored photo has its smaller sizes', () => {
    if (storedIds.length === 0) return true;
    const [[ready]] = db.rows(
      `SELECT COUNT(*) FROM photos WHERE variant_state = 'ready' AND id IN (${storedIds.join(',')})`,
    );
    return Number(ready) === storedIds.length;
  });
  await waitFor('every handover has its PDF and its e-mail queued', () => {
    const [[done]] = db.rows(
      `SELECT COUNT(*) FROM handovers WHERE pdf_key IS NOT NULL AND notice_id IS NOT NULL AND id IN (${handovers.map((id) => `'${id}'`).join(',')})`,
    );
    return Number(done) === handovers.length;
  });
  const [[pdfAttempts]] = db.rows(
    `SELECT COALESCE(MAX(attempts), 0) FROM jobs WHERE kind = 'handover.deliver' AND dedupe_key IN (${handovers.map((id) => `'handover:${id}'`).join(',')})`,
  );
  mark(
    `${photos.filter((x) => x.stored).length} photos stored, ${handovers.length} handover PDFs made (up to ${pdfAttempts} attempts)`,
  );

  // c. The SMTP fake stopped while notices are queued.
  phase = 'c. SMTP fake stopped';
  step(`Fault ${phase}`);
  await kill(smtp, 'the SMTP fake');
  const INVITES = 5;
  for (let i = 0; i < INVITES; i++)
    await admin.call(
      'POST',
      `/api/projects/${project.id}/invitations`,
      { email: `faults-${runTag}-${i}@roundbook.test`, role: 'viewer' },
      { untilMs: GIVE_UP_MS },
    );
  await sleep(DOWN_MS);
  const [[queuedWhileDown]] = db.rows('SELECT COUNT(*) FROM notices WHERE sent_at IS NULL');
  smtp = await startSmtp({ dataDir, env });
  const smtpBack = Date.now();
  mark(`SMTP fake started again with ${queuedWhileDown} notice(s) waiting`);
  await waitFor(
    'every notice sent',
    () => Number(db.rows('SELECT COUNT(*) FROM notices WHERE sent_at IS NULL')[0][0]) === 0,
  );
  const c = { drainS: (Date.now() - smtpBack) / 1000 };
  await sleep(500); // the fake writes its summary after it has answered
  const messageIds = db.rows('SELECT message_id FROM notices').map(([id]) => id);
  const delivery = deliveryReport(messageIds, receivedMail(env.LOCAL_MAIL_DIR));
  const [[mailRetries]] = db.rows(`SELECT COUNT(*) FROM jobs WHERE kind = 'mail.send' AND attempts > 1`);
  mark(
    `all ${messageIds.length} notices sent ${secs(Date.now() - smtpBack)} s after the restart (${mailRetries} after a failed try)`,
  );

  // d. The API process killed; the supervisor starts it again.
  const restarted = new Promise((r) => (apiRestarted = r));
  const d = await underLoad(geo, ctx, 'd. API process killed', async () => {
    const faultAt = Date.now();
    await kill(api, 'the API');
    const next = await restarted;
    mark(`the supervisor started the API again (PID ${next.pid})`);
    recovery = { faultAt, since: Date.now() };
  });

  // ------------------------------------------------------------------------------------------------------
  // The database against what the clients were told.
  phase = 'checks';
  step('Comparing the database with what the clients were told');
  const loadRounds = ledger.filter((r) => r !== photoRound);
  const inList = (ids) => (ids.length ? ids.map((id) => `'${id}'`).join(',') : "''");
  const rows = new Map(
    db
      .rows(
        `SELECT r.id, r.status, r.version, r.assessment IS NULL, (SELECT GROUP_CONCAT(j.id ORDER BY j.id) FROM joints j WHERE j.round_id = r.id), (SELECT COUNT(*) FROM round_revisions v WHERE v.round_id = r.id AND v.event = 'submit') FROM rounds r WHERE r.id IN (${inList(ledger.map((r) => r.id))})`,
      )
      .map(([id, status, version, noAssessment, joints, revisions]) => [
        id,
        {
          status,
          version: Number(version),
          noAssessment: noAssessment === '1',
          joints: joints === 'NULL' ? [] : joints.split(','),
          revisions: Number(revisions),
        },
      ]),
  );
  const problems = [];
  for (const rec of ledger) {
    const row = rows.get(rec.id);
    if (rec.created && !row) problems.push(`round ${rec.id} was answered created but is not in the database`);
    if (!row) continue;
    if (row.noAssessment) problems.push(`round ${rec.id} has no assessment (half-written)`);
    if (![0, 3].includes(row.joints.length))
      problems.push(`round ${rec.id} has ${row.joints.length} joints (a save is all or nothing)`);
    if (rec.saved && !sameIds(row.joints, rec.jointIds))
      problems.push(`round ${rec.id} was answered saved but its joints differ`);
    if (rec.submitted && (row.status !== 'submitted' || row.revisions !== 1))
      problems.push(
        `round ${rec.id} was answered submitted but is ${row.status} with ${row.revisions} submit revision(s)`,
      );
    if (row.status === 'submitted' && row.revisions !== 1)
      problems.push(`round ${rec.id} is submitted with ${row.revisions} submit revisions`);
  }
  // A create reported failed: absent, or there and found again by its Idempotency-Key.
  const failedCreates = ledger.filter((r) => !r.created);
  let foundByKey = 0;
  for (const rec of failedCreates.filter((r) => rows.has(r.id))) {
    const again = await geo.call(
      'POST',
      `/api/projects/${project.id}/headings/${heading.id}/rounds`,
      { stage: ctx.stage, faceChainage: 9999 },
      { headers: { 'idempotency-key': rec.key } },
    );
    if (again.id === rec.id) foundByKey++;
    else problems.push(`round ${rec.id} exists but its Idempotency-Key gives ${again.id}`);
  }
  const [[numbersTaken, numbersDistinct]] = db.rows(
    `SELECT COUNT(*), COUNT(DISTINCT stage, round_number) FROM rounds WHERE heading_id = '${heading.id}'`,
  );
  const [[orphanKeys]] = db.rows(
    "SELECT COUNT(*) FROM idempotency_keys k LEFT JOIN rounds r ON r.id = k.resource_id WHERE k.scope = 'round:create' AND r.id IS NULL",
  );
  const [[orphanUploads]] = db.rows(
    `SELECT COUNT(*) FROM photos WHERE round_id = '${photoRound.id}' AND upload_state <> 'stored' AND deleted_at IS NULL`,
  );

  // ------------------------------------------------------------------------------------------------------
  const all = Object.values(phases);
  const sum = (k) => all.reduce((s, p) => s + (p[k] ?? 0), 0);
  const other5xx = sum('server-error') + sum('gateway');
  const count = (pred) => loadRounds.filter(pred).length;
  const row = (name, p) =>
    `    ${name.padEnd(24)} ${String(p.attempts).padStart(5)} requests: ${p.ok ?? 0} ok, ${p.unavailable ?? 0} × 503+Retry-After, ${p.dropped ?? 0} dropped, ${p.refused ?? 0} 4xx, ${(p['server-error'] ?? 0) + (p.gateway ?? 0)} other 5xx, ${p.timeout ?? 0} hung; slowest ${p.slowestMs} ms`;
  const checks = [
    ['no 5xx other than 503 with Retry-After', other5xx === 0],
    [
      `no request hung past ${ATTEMPT_BOUND_MS / 1000} s`,
      sum('timeout') === 0 && all.every((p) => p.slowestMs <= ATTEMPT_BOUND_MS),
    ],
    ['connections dropped only while the API process was down', defects.every((x) => !x.includes('dropped'))],
    ['the API recovered from the database outage without a restart', apiSurvivedDb],
    [
      `every round flow finished: created, saved and submitted (${count((r) => r.submitted)}/${loadRounds.length})`,
      loadRounds.length > 0 && loadRounds.every((r) => r.submitted),
    ],
    [
      'every round answered created, saved or submitted is so in the database; nothing half-written',
      problems.length === 0,
    ],
    [
      `round numbers distinct on the heading (${numbersDistinct} of ${numbersTaken})`,
      numbersTaken === numbersDistinct,
    ],
    ['no Idempotency-Key pointing at a missing round', orphanKeys === '0'],
    [
      `every photo upload finished after the S3 outage (${photos.filter((x) => x.stored).length}/${photos.length})`,
      photos.every((x) => x.stored) && orphanUploads === '0',
    ],
    [
      `every handover PDF job finished after the S3 outage (${handovers.length}, up to ${pdfAttempts} attempts)`,
      handovers.length === 2 && Number(pdfAttempts) > 1,
    ],
    [
      `every notice delivered exactly once by Message-ID (${messageIds.length}; ${delivery.missing.length} missing, ${delivery.duplicated.length} twice)`,
      messageIds.length > 0 &&
        delivery.missing.length === 0 &&
        delivery.duplicated.length === 0 &&
        delivery.strangers.length === 0,
    ],
    ['the supervisor restarted the API after it was killed', api.pid !== firstApiPid && isRunning(api)],
  ];
  const lines = [
    '',
    '  Fault run (npm run faults)',
    ...timeline.map((t) => `    ${t}`),
    '',
    ...Object.entries(phases).map(([name, p]) => row(name, p)),
    row('all', {
      attempts: sum('attempts'),
      ok: sum('ok'),
      unavailable: sum('unavailable'),
      dropped: sum('dropped'),
      refused: sum('refused'),
      'server-error': sum('server-error'),
      gateway: sum('gateway'),
      timeout: sum('timeout'),
      slowestMs: Math.max(...all.map((p) => p.slowestMs)),
    }),
    `    rounds: ${loadRounds.length} flows, ${count((r) => r.created)} created, ${count((r) => r.saved)} saved, ${count((r) => r.submitted)} submitted, ${count((r) => r.error)} reported failed (${failedCreates.length} at the create, ${foundByKey} of them found again by their key), ${ledger.reduce((s, r) => s + r.resolved, 0)} answers lost but the write kept (resolved by the retry)`,
    `    recovery: a. MariaDB ${a.recoveryS.toFixed(1)} s after its restart (outage seen ${a.outageS.toFixed(1)} s); b. S3 ${b.recoveryS.toFixed(1)} s (${b.outageS.toFixed(1)} s); c. queued mail sent ${c.drainS.toFixed(1)} s after SMTP returned; d. API ${d.recoveryS.toFixed(1)} s after the supervisor's restart (outage seen ${d.outageS.toFixed(1)} s)`,
    `    whole run ${secs(Date.now() - t0)} s (bound ${LIMIT_S} s)`,
    ...[...defects, ...problems].slice(0, 20).map((x) => `    ! ${x}`),
    ...ledger
      .filter((r) => r.error)
      .slice(0, 5)
      .map((r) => `    failed flow (${r.phase}): ${r.error}`),
    ...checks.map(([what, ok]) => `  ${ok ? '✔' : '✘'} ${what}`),
    '',
  ];
  console.log(lines.join('\n'));
  await shutdown(checks.every(([, ok]) => ok) ? 0 : 1);
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  if (defects.length)
    console.log(
      defects
        .slice(0, 20)
        .map((x) => `    ! ${x}`)
        .join('\n'),
    );
  await shutdown(1);
}
