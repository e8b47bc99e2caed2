#!/usr/bin/env node
// `npm run load`: the load and speed proof (issue 20, item 4). Starts its own MariaDB (own data folder and
// database), the S3 and SMTP fakes and the API on 127.0.0.1 (test ports moved by RB_TEST_PORT_OFFSET + 20),
// seeds the demo and a large project (30,000 rounds, 450,000 joints, two headings; apps/api/src/bench/
// load-seed.ts), counts the SQL statements each route sends, then runs autocannon one route at a time
// (liveness first, as the reference measured in the same run) and a mixed phase, and prints req/s, p99 and
// errors per route with the ratio to liveness. Exits 1 when a target is missed. Everything it started is
// stopped by PID, also on failure or Ctrl-C.
//
// Options (environment): LOAD_SECONDS (per phase, default 20), LOAD_CONNECTIONS (default 50),
// LOAD_ROUNDS (default 30000), LOAD_JSON=<file> (writes the figures as JSON too); DB_POOL_SIZE and
// DB_POOL_WAIT_MS are handed to the API. LOAD_ROUTES=projects,rounds-page (only those phases after liveness,
// no mixed phase: for trying a change); LOAD_CPU_PROF=<folder> (a V8 CPU profile of the API per phase,
// infra/lib/cpu-profile.cjs, with the functions and packages that took most of its time printed).
//
// Besides req/s and p99 (which move with whatever else the machine runs), each phase prints the CPU time the
// API process and MariaDB spent per request (from /proc/<pid>/stat over the phase): on a shared machine those
// move much less than the rates, and they say which side of the connection a route's time is spent on.
import { existsSync, readFileSync, readdirSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { buildAll, ensureAptPackages, ensureNodeModules, migrateAndSeed } from './lib/bootstrap.mjs';
import { profileEnv, root } from './lib/env.mjs';
import { InfraError, fail, info, step } from './lib/log.mjs';
import { run, stopAll } from './lib/proc.mjs';
import { startApi, startMariadb, startS3, startSmtp } from './lib/services.mjs';

const SECONDS = Number(process.env.LOAD_SECONDS ?? 20);
const CONNECTIONS = Number(process.env.LOAD_CONNECTIONS ?? 50);
/** autocannon's timeout: shorter than the phase, so a request that never answers counts as an error. */
const TIMEOUT_S = Math.max(1, Math.min(10, Math.floor(SECONDS / 2)));
/** Targets of issue 20 against the liveness route of the same run. */
const MIN_RATIO = 0.25;
const MAX_P99_FACTOR = 10;
const TARGETED = ['projects', 'rounds-page', 'round-detail'];
const ONLY = process.env.LOAD_ROUTES ? process.env.LOAD_ROUTES.split(',').map((s) => s.trim()) : undefined;
const CPU_PROF = process.env.LOAD_CPU_PROF ? path.resolve(process.env.LOAD_CPU_PROF) : undefined;

process.env.RB_DATA_DIR ??= path.join(root, '.data/load');
const shift = 20; // apart from the e2e tier of the same checkout
const base = profileEnv('test');
const dataDir = base.dataDir;
const env = {
  ...base.env,
  DB_NAME: 'roundbook_load',
  DB_PORT: String(base.ports.db + shift),
  S3_ENDPOINT: `http://127.0.0.1:${base.ports.s3 + shift}`,
  SMTP_PORT: String(base.ports.smtp + shift),
  PORT: String(base.ports.api + shift),
  APP_URL: `http://127.0.0.1:${base.ports.api + shift}`,
  // No background jobs: every statement counted below comes from the requests themselves.
  WORKER_ENABLED: 'false',
  LOGIN_RATE_LIMIT: '1000',
  // The liveness route is anonymous, and anonymous routes are limited per address (120 a minute by default):
  // the load generator is one address, so the limit is lifted for this run only.
  PUBLIC_RATE_LIMIT: '100000000',
  NODE_ENV: 'production',
  // The API's pool (apps/api/src/config/env.validation.ts), when the run is to try another size or wait.
  ...Object.fromEntries(
    ['DB_POOL_SIZE', 'DB_POOL_WAIT_MS'].filter((k) => process.env[k]).map((k) => [k, process.env[k]]),
  ),
  ...(CPU_PROF
    ? {
        LOAD_CPU_PROF: CPU_PROF,
        NODE_OPTIONS: `${process.env.NODE_OPTIONS ?? ''} --require ${path.join(root, 'infra/lib/cpu-profile.cjs')}`,
      }
    : {}),
};
const apiUrl = `http://127.0.0.1:${env.PORT}`;

let stopping = false;
async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  await stopAll();
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(130));
process.on('SIGTERM', () => void shutdown(143));

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
/** CPU time (user + system, ms) a process has used so far, from /proc/<pid>/stat (clock ticks of 10 ms). */
function cpuMs(pid) {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) * 10; // utime, stime (fields 14 and 15 of stat)
  } catch {
    return NaN;
  }
}

/** Self time of a V8 CPU profile summed by function and by package: where the API's time went in a phase. */
function summariseProfile(file, top = 12) {
  const { nodes, samples, timeDeltas } = JSON.parse(readFileSync(file, 'utf8'));
  const byId = new Map(nodes.map((n) => [n.id, n]));
  const self = new Map();
  samples.forEach((id, i) => self.set(id, (self.get(id) ?? 0) + (timeDeltas[i] ?? 0)));
  const total = [...self.values()].reduce((a, b) => a + b, 0) || 1;
  const fns = new Map();
  const pkgs = new Map();
  for (const [id, us] of self) {
    const { functionName, url, lineNumber } = byId.get(id).callFrame;
    const where = url.replace(/^file:\/\//, '').replace(root + '/', '');
    const fn = `${functionName || '(anonymous)'} ${where ? `${where}:${lineNumber + 1}` : ''}`.trim();
    fns.set(fn, (fns.get(fn) ?? 0) + us);
    const pkg =
      /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(where)?.[1] ??
      (where.startsWith('apps/') || where.startsWith('packages/')
        ? where.split('/').slice(0, 2).join('/')
        : where.startsWith('node:')
          ? 'node'
          : functionName.startsWith('(')
            ? functionName
            : 'other');
    pkgs.set(pkg, (pkgs.get(pkg) ?? 0) + us);
  }
  const list = (m) =>
    [...m]
      .sort((a, b) => b[1] - a[1])
      .slice(0, top)
      .map(([k, us]) => `${((us / total) * 100).toFixed(1).padStart(5)}%  ${k}`);
  return { functions: list(fns), packages: list(pkgs) };
}
/** Deterministic choices, so two runs ask for the same pages and rounds (mulberry32). */
function rng(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

async function http(method, url, { token, body } = {}) {
  const res = await fetch(`${apiUrl}${url}`, {
    method,
    headers: {
      ...(token ? { authorization: `Bearer ${token}` } : {}),
      ...(body ? { 'content-type': 'application/json' } : {}),
    },
    body: body ? JSON.stringify(body) : undefined,
  });
  const text = await res.text();
  if (!res.ok) throw new InfraError(`${method} ${url} answered ${res.status}: ${text.slice(0, 300)}`);
  return { json: text ? JSON.parse(text) : null, bytes: Buffer.byteLength(text) };
}

/** The fields of a joint a save takes (JointInputDto), from a joint as the round detail shows it. */
const JOINT_INPUT = [
  'id',
  'kind',
  'orientationText',
  'notation',
  'setLabel',
  'setOverride',
  'spacingM',
  'persistenceM',
  'apertureMm',
  'jr',
  'jrc',
  'jrcMethod',
  'infill',
  'ja',
  'water',
  'thicknessM',
  'notes',
  'faceOffset',
];
const jointInput = (j) => Object.fromEntries(JOINT_INPUT.filter((k) => k in j).map((k) => [k, j[k]]));

try {
  step('Load run: checking what is installed');
  ensureAptPackages(['mariadb-server', 'mariadb-client']);
  ensureNodeModules();
  buildAll({ web: false });
  const { default: autocannon } = await import('autocannon');
  const db = await startMariadb({ dataDir, env });
  // LOAD_REUSE=1 keeps the database of the previous run (same seed) and only migrates it: for trying a
  // change to the API without seeding again. Without it every run starts from an empty database.
  const seedFile = path.join(dataDir, 'load-seed.json');
  let seed;
  if (process.env.LOAD_REUSE === '1' && existsSync(seedFile)) {
    migrateAndSeed(env, { seed: false });
    seed = JSON.parse(readFileSync(seedFile, 'utf8'));
    info('Reusing the database seeded by the previous run (LOAD_REUSE=1)');
  } else {
    db.rootSql(
      `DROP DATABASE IF EXISTS \`${env.DB_NAME}\`; CREATE DATABASE \`${env.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
    );
    migrateAndSeed(env);
    step('Seeding the large project (bulk SQL)');
    const seedOut = run(process.execPath, [path.join(root, 'apps/api/dist/bench/load-seed.js')], {
      env: { ...process.env, ...env },
      quiet: true,
      hint: 'The load seed failed.',
    });
    seed = JSON.parse(seedOut.trim().split('\n').pop());
    writeFileSync(seedFile, JSON.stringify(seed));
  }
  info(
    `${seed.rounds.toLocaleString('en')} rounds and ${seed.joints.toLocaleString('en')} joints on ${seed.headingIds.length} headings (copies of ${seed.templates} demo rounds) in ${seed.seconds} s`,
  );
  await startS3({ dataDir, env });
  await startSmtp({ dataDir, env });
  const api = await startApi({ dataDir, env });

  const login = async (email) =>
    (await http('POST', '/api/auth/login', { body: { email, password: env.DEMO_PASSWORD } })).json
      .accessToken;
  const viewer = await login('viewer@roundbook.test');
  const geologist = await login('geologist@roundbook.test');
  const p = `/api/projects/${seed.projectId}`;
  const perHeading = Math.ceil(seed.rounds / seed.headingIds.length);
  const pages = Math.ceil(perHeading / 50);
  const random = rng(20);
  const pick = (list) => list[Math.floor(random() * list.length)];
  const SORTS = ['-faceChainage', '-faceChainage', '-faceChainage', 'q', '-shiftDate', 'rmr'];
  const roundsPage = () =>
    `${p}/headings/${pick(seed.headingIds)}/rounds?pageSize=50&page=${1 + Math.floor(random() * Math.min(pages, 40))}&sort=${pick(SORTS)}`;
  const roundDetail = () => `${p}/rounds/${pick(seed.roundIds)}`;
  const stereonet = () => {
    // The joints of a 30 m window behind some face, as the round screen asks for finding sets.
    const h = Math.floor(random() * seed.headingIds.length);
    const face = (h + 1) * 100000 + Math.floor(random() * perHeading) * seed.plannedRoundLength;
    return `${p}/headings/${seed.headingIds[h]}/joints?fromChainage=${face - 30}&toChainage=${face}`;
  };

  // The drafts the joint edits save. autocannon gives a connection a fresh context each time it has gone
  // through its list of requests, so a draft cannot belong to a connection: an edit checks a free draft out
  // and gives it back with its answer, so that no two edits of one draft are in flight at once. An edit that
  // never got its answer (cut at the end of a phase, or timed out) may still have been saved: that draft is
  // stale, and so is one whose save answered 409 (version conflict). The next edit of a stale draft reads the
  // round again instead (GET, as the round screen does after a conflict) and saves from what it read.
  const drafts = [];
  for (const id of seed.draftRoundIds) {
    const { json } = await http('GET', `${p}/rounds/${id}`, { token: geologist });
    drafts.push({ id, version: json.version, joints: json.joints.map(jointInput), edits: 0, out: 0 });
  }
  let free = [...drafts];
  const conflicts = { count: 0, rereads: 0 };
  /** Before a phase: every draft free again; those still out (their answer never came) are stale. */
  const resetDrafts = () => {
    for (const d of drafts) if (d.out) Object.assign(d, { out: 0, stale: true });
    free = [...drafts];
    conflicts.count = 0;
    conflicts.rereads = 0;
  };
  /** A free draft, or one whose answer is overdue (it never comes: the client gave up), or none. */
  const checkOut = () => {
    let d = free.shift();
    if (!d) {
      const oldest = drafts.reduce((a, b) => (a.out <= b.out ? a : b));
      if (Date.now() - oldest.out <= TIMEOUT_S * 1000) return undefined;
      d = Object.assign(oldest, { stale: true });
    }
    d.out = Date.now();
    return d;
  };
  const giveBack = (d) => {
    d.out = 0;
    if (!free.includes(d)) free.push(d);
  };
  const editRequest = {
    method: 'PUT',
    headers: { authorization: `Bearer ${geologist}`, 'content-type': 'application/json' },
    setupRequest: (req, context) => {
      const d = (context.draft = checkOut());
      // More connections than drafts, all of them out: this turn reads a draft instead of saving one.
      if (!d) return { ...req, method: 'GET', path: `${p}/rounds/${pick(drafts).id}`, body: undefined };
      context.reread = Boolean(d.stale);
      if (context.reread) return { ...req, method: 'GET', path: `${p}/rounds/${d.id}`, body: undefined };
      d.edits += 1;
      // One joint's orientation and notes change at each save; the rest are sent as they are.
      const joints = d.joints.map((j, i) =>
        i === d.edits % d.joints.length
          ? {
              ...j,
              notes: `load edit ${d.edits}`,
              orientationText: `${String(100 + (d.edits % 90)).padStart(3, '0')}/${40 + (d.edits % 30)}`,
            }
          : j,
      );
      return { ...req, path: `${p}/rounds/${d.id}`, body: JSON.stringify({ version: d.version, joints }) };
    },
    onResponse: (status, body, context) => {
      const d = context.draft;
      if (!d) return;
      if (status === 200) {
        const round = JSON.parse(body);
        d.version = round.version;
        if (context.reread) {
          d.joints = round.joints.map(jointInput);
          d.stale = false;
          conflicts.rereads += 1;
        }
      } else if (status === 409 && !context.reread) {
        // Someone saved the round since it was read: not an error of the API; read it again next time.
        d.stale = true;
        conflicts.count += 1;
      }
      giveBack(d);
    },
  };
  const get = (token, makePath) => ({
    method: 'GET',
    headers: { authorization: `Bearer ${token}` },
    setupRequest: (req) => ({ ...req, path: makePath() }),
  });
  const routes = [
    { name: 'liveness', label: 'GET /api/health/live', request: get(null, () => '/api/health/live') },
    { name: 'projects', label: "Board's projects list", request: get(viewer, () => '/api/projects') },
    { name: 'rounds-page', label: 'Rounds page (50 rows)', request: get(viewer, roundsPage) },
    { name: 'round-detail', label: "A round's detail", request: get(viewer, roundDetail) },
    { name: 'stereonet', label: 'Stereonet data (30 m window)', request: get(viewer, stereonet) },
    { name: 'joint-edit', label: 'Joint edits (PUT round)', request: editRequest },
  ];
  routes[0].request.headers = {};

  // Statements per request: MariaDB's Questions counter over 20 sequential requests of each route
  // (the counter's own SELECT taken off), with no background worker running.
  const questions = () =>
    Number(db.rootSql(`SHOW GLOBAL STATUS LIKE 'Questions';`).stdout.trim().split('\n').pop().split('\t')[1]);
  step('Counting SQL statements per request (20 sequential requests per route)');
  const N = 20;
  for (const r of routes) {
    const before = questions();
    let bytes = 0;
    for (let i = 0; i < N; i++) {
      const req = r.request.setupRequest
        ? r.request.setupRequest({ ...r.request }, (r.ctx ??= {}))
        : r.request;
      const res = await fetch(`${apiUrl}${req.path}`, {
        method: req.method,
        headers: req.headers,
        body: req.body,
      });
      const text = await res.text();
      if (!res.ok)
        throw new InfraError(`${r.label}: ${req.method} ${req.path} answered ${res.status} ${text}`);
      bytes += Buffer.byteLength(text);
      r.request.onResponse?.(res.status, text, r.ctx);
    }
    const after = questions();
    // Each SHOW STATUS through the socket counts once (the second one is in `after`).
    r.queries = (after - before - 1) / N;
    r.bytes = Math.round(bytes / N);
    info(`${r.label}: ${r.queries.toFixed(1)} statements/request, ${r.bytes.toLocaleString('en')} bytes`);
  }

  const runPhase = (name, requests) =>
    new Promise((resolve, reject) => {
      const instance = autocannon(
        {
          url: apiUrl,
          connections: CONNECTIONS,
          duration: SECONDS,
          requests,
          timeout: TIMEOUT_S,
        },
        (err, result) => (err ? reject(err) : resolve(result)),
      );
      // A phase never outlives its time by more than its timeout.
      const guard = setTimeout(() => instance.stop(), (SECONDS + 15) * 1000);
      instance.on('done', () => clearTimeout(guard));
      void name;
    });
  const figures = [];
  if (CPU_PROF) {
    // What start-up and the counting above sampled goes to a profile of its own, not the first phase's.
    for (const f of readdirSync(CPU_PROF))
      if (f.endsWith('.cpuprofile')) renameSync(path.join(CPU_PROF, f), path.join(CPU_PROF, `${f}.old`));
    await profileCut('startup');
  }
  async function profileCut(name) {
    if (!CPU_PROF) return;
    const before = new Set(readdirSync(CPU_PROF));
    process.kill(api.pid, 'SIGWINCH');
    for (let i = 0; i < 100; i++) {
      const fresh = readdirSync(CPU_PROF).find((f) => /^\d+\.cpuprofile$/.test(f) && !before.has(f));
      if (fresh) {
        await sleep(200); // written in one writeFileSync; a moment for it to be complete
        const file = path.join(CPU_PROF, `${name}.cpuprofile`);
        renameSync(path.join(CPU_PROF, fresh), file);
        return file;
      }
      await sleep(100);
    }
    throw new InfraError('The API wrote no CPU profile (LOAD_CPU_PROF).');
  }
  const phases = routes.filter((r, i) => i === 0 || !ONLY || ONLY.includes(r.name));
  for (const r of phases) {
    step(`${r.label}: ${CONNECTIONS} connections for ${SECONDS} s`);
    resetDrafts();
    const cpu0 = { api: cpuMs(api.pid), db: cpuMs(db.child.pid) };
    const result = await runPhase(r.name, [r.request]);
    const cpu = {
      api: (cpuMs(api.pid) - cpu0.api) / Math.max(1, result.requests.total),
      db: (cpuMs(db.child.pid) - cpu0.db) / Math.max(1, result.requests.total),
    };
    const profile = await profileCut(r.name);
    // A 409 on a joint edit is a version conflict (answered by reading the round again), not an error.
    // autocannon's `errors` already counts its timeouts (adding them again counted each one twice).
    const errors = result.errors + result.non2xx - conflicts.count;
    figures.push({
      route: r.name,
      label: r.label,
      rps: result.requests.average,
      p99: result.latency.p99,
      p50: result.latency.p50,
      errors,
      conflicts: conflicts.count,
      queries: r.queries,
      bytes: r.bytes,
      total: result.requests.total,
      apiCpuMs: cpu.api,
      dbCpuMs: cpu.db,
    });
    info(
      `${Math.round(result.requests.average)} req/s, p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms, ${errors} errors (${conflicts.count} version conflicts, not counted; ${conflicts.rereads} drafts read again; ${result.non2xx} non-2xx, ${result.timeouts} timeouts; status codes ${JSON.stringify(Object.fromEntries(Object.entries(result.statusCodeStats ?? {}).map(([k, v]) => [k, v.count])))})`,
    );
    info(`CPU per request: API ${cpu.api.toFixed(2)} ms, MariaDB ${cpu.db.toFixed(2)} ms`);
    if (profile) {
      const { functions, packages } = summariseProfile(profile);
      info(
        `API profile (${path.relative(root, profile)}), self time by package:\n    ${packages.join('\n    ')}`,
      );
      info(`by function:\n    ${functions.join('\n    ')}`);
    }
    await sleep(1000);
  }
  let mixed;
  let mixedErrors = 0;
  let mixedConflicts = 0;
  if (!ONLY) {
    step(`Mixed: Board, Rounds pages, round details, stereonet data and joint edits, ${SECONDS} s`);
    resetDrafts();
    mixed = await runPhase('mixed', [
      routes[1].request,
      routes[2].request,
      routes[2].request,
      routes[3].request,
      routes[3].request,
      routes[4].request,
      routes[5].request,
    ]);
    mixedErrors = mixed.errors + mixed.non2xx - conflicts.count;
    mixedConflicts = conflicts.count;
    info(
      `mixed: ${Math.round(mixed.requests.average)} req/s, p99 ${mixed.latency.p99} ms, ${mixedErrors} errors (${mixedConflicts} version conflicts, not counted; ${conflicts.rereads} drafts read again; ${mixed.non2xx} non-2xx, ${mixed.timeouts} timeouts; status codes ${JSON.stringify(Object.fromEntries(Object.entries(mixed.statusCodeStats ?? {}).map(([k, v]) => [k, v.count])))})`,
    );
  }

  const live = figures[0];
  const rows = figures.map((f) => ({
    ...f,
    ratio: f.rps / live.rps,
    p99Factor: f.p99 / Math.max(1, live.p99),
  }));
  console.log(
    `\n  Load run: ${seed.rounds.toLocaleString('en')} rounds, ${seed.joints.toLocaleString('en')} joints, ${CONNECTIONS} connections, ${SECONDS} s per route\n`,
  );
  const pad = (s, n) => String(s).padEnd(n);
  const padl = (s, n) => String(s).padStart(n);
  console.log(
    `  ${pad('route', 30)}${padl('req/s', 8)}${padl('ratio', 8)}${padl('p99 ms', 8)}${padl('×live', 7)}${padl('errors', 8)}${padl('409s', 6)}${padl('SQL/req', 9)}${padl('bytes', 9)}${padl('API ms', 8)}${padl('DB ms', 7)}  target`,
  );
  let ok = true;
  for (const r of rows) {
    const targeted = TARGETED.includes(r.route);
    const pass =
      r.total > 0 && r.errors === 0 && (!targeted || (r.ratio >= MIN_RATIO && r.p99Factor <= MAX_P99_FACTOR));
    if (!pass) ok = false;
    console.log(
      `  ${pad(r.label, 30)}${padl(Math.round(r.rps), 8)}${padl(`${(r.ratio * 100).toFixed(1)}%`, 8)}${padl(r.p99, 8)}${padl(r.p99Factor.toFixed(1), 7)}${padl(r.errors, 8)}${padl(r.conflicts, 6)}${padl(r.queries.toFixed(1), 9)}${padl(r.bytes, 9)}${padl(r.apiCpuMs.toFixed(2), 8)}${padl(r.dbCpuMs.toFixed(2), 7)}  ${targeted ? (pass ? 'met' : 'MISSED') : pass ? 'no errors' : r.total === 0 ? 'NO ANSWER' : 'ERRORS'}`,
    );
  }
  if (mixed) {
    console.log(
      `  ${pad('Mixed (all but liveness)', 30)}${padl(Math.round(mixed.requests.average), 8)}${padl('', 8)}${padl(mixed.latency.p99, 8)}${padl('', 7)}${padl(mixedErrors, 8)}${padl(mixedConflicts, 6)}`,
    );
    if (mixedErrors > 0 || mixed.requests.total === 0) ok = false;
  }
  console.log(
    `\n  Targets: Board projects list, Rounds page and round detail ≥ ${MIN_RATIO * 100}% of liveness req/s, p99 ≤ ${MAX_P99_FACTOR}× liveness p99, no errors anywhere (a 409 on a joint edit is a version conflict: the round is read again and the edit goes on).\n`,
  );
  if (process.env.LOAD_JSON)
    writeFileSync(
      process.env.LOAD_JSON,
      JSON.stringify(
        {
          seed: { rounds: seed.rounds, joints: seed.joints },
          rows,
          mixed: mixed && {
            rps: mixed.requests.average,
            p99: mixed.latency.p99,
            errors: mixedErrors,
            conflicts: mixedConflicts,
          },
        },
        null,
        2,
      ),
    );
  await shutdown(ok ? 0 : 1);
} catch (err) {
  fail(err instanceof InfraError ? err.message : (err?.stack ?? String(err)));
  await shutdown(1);
}
