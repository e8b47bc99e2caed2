// Field-mode browser benchmark (issue 17), run by `npm run bench` (infra/bench.mjs, with the test database,
// S3 fake and SMTP fake already up and seeded): fifty rounds of ten joints made offline must sync in at most
// 2× the time the same fifty saves take online, in the same run.
//
// In Chromium (Playwright), signed in as the demo geologist on the HR-U heading page:
//   online  — fifty rounds created and their ten joints saved, one after the other, through the app's API
//             client (apps/web/bench/field-sync.entry.ts, built here into one script);
//   offline — the network cut, fifty more rounds made the way the New round panel and the Round editor keep
//             them with no connection (outbox + drafts in IndexedDB), the page reloaded from the service
//             worker, then the network given back: the time from the browser's `online` event until the
//             app's sync bar says every change is saved. Then the server is asked that each of the hundred
//             rounds is there exactly once with its ten joints.
/* global window, document, MutationObserver -- the callbacks given to page.evaluate run in the browser. */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { buildAll, ensureAptPackages } from './lib/bootstrap.mjs';
import { root } from './lib/env.mjs';
import { InfraError, info, step } from './lib/log.mjs';
import { startApi } from './lib/services.mjs';

const ROUNDS = 50;
const RATIO_TARGET = 2;
const web = path.join(root, 'apps/web');

async function bundleEntry() {
  const { build, defaultClientConditions } = await import('vite');
  const outDir = mkdtempSync(path.join(tmpdir(), 'roundbook-bench-field-'));
  await build({
    configFile: false,
    root: web,
    logLevel: 'warn',
    resolve: { alias: { '@': path.join(web, 'src') }, conditions: ['source', ...defaultClientConditions] },
    define: { 'process.env.NODE_ENV': JSON.stringify('production') },
    build: {
      rollupOptions: {
        // React Query's "use client" lines mean nothing in one script.
        onwarn: (warning, warn) => (warning.code === 'MODULE_LEVEL_DIRECTIVE' ? undefined : warn(warning)),
      },
      outDir,
      emptyOutDir: true,
      minify: false,
      lib: {
        entry: path.join(web, 'bench/field-sync.entry.ts'),
        formats: ['iife'],
        name: 'RoundbookFieldBench',
        fileName: () => 'field-sync.js',
      },
    },
  });
  const code = readFileSync(path.join(outDir, 'field-sync.js'), 'utf8');
  rmSync(outDir, { recursive: true, force: true });
  return code;
}

/** Runs the benchmark; the caller has the database, S3 and SMTP fakes running (infra/bench.mjs). */
export async function fieldSyncBench({ dataDir, env, apiStarted = false }) {
  ensureAptPackages(['chromium', 'fonts-open-sans']);
  buildAll();
  step('field sync: bundling the in-page part');
  const script = await bundleEntry();
  if (!apiStarted) await startApi({ dataDir, env });
  const { chromium } = await import('@playwright/test');
  const baseURL = `http://127.0.0.1:${env.PORT}`;
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--no-first-run',
      '--disable-background-networking',
    ],
  });
  try {
    // bypassCSP: the app's CSP allows only its own scripts; the benchmark's script is put into the page.
    const context = await browser.newContext({ baseURL, bypassCSP: true, serviceWorkers: 'allow' });
    const page = await context.newPage();
    page.on('response', (r) => {
      if (process.env.RB_BENCH_DEBUG && r.status() >= 400)
        info(`${r.status()}: ${r.request().method()} ${r.url()}`);
    });
    page.on('requestfailed', (r) => {
      if (process.env.RB_BENCH_DEBUG) info(`failed: ${r.method()} ${r.url()} ${r.failure()?.errorText}`);
    });
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('geologist@roundbook.test');
    await page.getByLabel('Password').fill(env.DEMO_PASSWORD ?? 'rb-demo-2026');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/$/);
    await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, null, { timeout: 30_000 });
    await page
      .getByTestId('heading-card')
      .filter({ hasText: 'HR-U' })
      .getByRole('heading', { level: 3 })
      .getByRole('link')
      .click();
    await page.waitForURL(/\/projects\/[^/]+\/headings\/[^/]+$/);
    await page.getByTestId('round-row').first().waitFor();
    const [, , projectId, , headingId] = new URL(page.url()).pathname.split('/');
    const token = await page.evaluate(
      () => JSON.parse(localStorage.getItem('roundbook.session') ?? '{}').accessToken,
    );
    const api = async (p) => {
      const res = await page.request.get(`/api${p}`, { headers: { Authorization: `Bearer ${token}` } });
      if (!res.ok()) throw new InfraError(`field sync: GET ${p} answered ${res.status()}`);
      return res.json();
    };
    const [project, heading] = await Promise.all([
      api(`/projects/${projectId}`),
      api(`/projects/${projectId}/headings/${headingId}`),
    ]);
    const stage = heading.stages[0];
    const next = await api(`/projects/${projectId}/headings/${headingId}/rounds/next?stage=${stage}`);
    const sense = heading.chainageSense === 'decreasing' ? -1 : 1;
    const plan = (from, count) =>
      Array.from({ length: count }, (_, i) => ({
        roundNumber: next.roundNumber + from + i,
        previousChainage: next.previousChainage + sense * 3 * (from + i),
        faceChainage: next.previousChainage + sense * 3 * (from + i + 1),
      }));
    const benchHeading = {
      projectId,
      headingId,
      chainageSense: heading.chainageSense ?? 'increasing',
      stage,
      timeZone: project.timeZone,
    };
    const countRounds = async () =>
      (await api(`/projects/${projectId}/headings/${headingId}/rounds?pageSize=1`)).total;
    const before = await countRounds();

    step(`field sync: ${ROUNDS} rounds of ten joints saved online`);
    await page.addScriptTag({ content: script });
    const onlineMs = await page.evaluate(
      ([h, rounds]) => window.roundbookFieldBench.onlineSaves(h, rounds),
      [benchHeading, plan(0, ROUNDS)],
    );

    step(`field sync: ${ROUNDS} rounds of ten joints made offline, then synced`);
    await context.setOffline(true);
    const offlineIds = await page.evaluate(
      ([h, rounds]) => window.roundbookFieldBench.makeOffline(h, rounds),
      [benchHeading, plan(ROUNDS, ROUNDS)],
    );
    await page.reload();
    const summary = page.getByTestId('sync-summary');
    await page
      .getByText(`${ROUNDS} changes waiting on this device`)
      .waitFor({ timeout: 30_000 })
      .catch(async (error) => {
        const bar = await page
          .getByTestId('sync-bar')
          .textContent({ timeout: 1000 })
          .catch(() => null);
        await page
          .screenshot({ path: path.join(dataDir, 'logs', 'bench-field-offline.png') })
          .catch(() => null);
        throw new InfraError(`field sync: the offline rounds are not waiting (sync bar: ${bar}): ${error}`);
      });
    // Timed in the page: from the browser's `online` event to the sync bar's "All changes saved".
    // The watcher is in place (awaited) before the network comes back, so the `online` event is not missed.
    await page.evaluate(() => {
      window.roundbookFieldSynced = new Promise((resolve) => {
        let t0 = null;
        const check = () => {
          const text = document.querySelector('[data-testid="sync-summary"]')?.textContent ?? '';
          if (t0 !== null && text.includes('All changes saved')) {
            observer.disconnect();
            resolve(performance.now() - t0);
          }
        };
        const observer = new MutationObserver(check);
        observer.observe(document.body, { subtree: true, childList: true, characterData: true });
        window.addEventListener('online', () => {
          t0 = performance.now();
          check();
        });
      });
    });
    const synced = page.evaluate(() => window.roundbookFieldSynced);
    await context.setOffline(false);
    const syncMs = await Promise.race([
      synced,
      new Promise((_, reject) =>
        setTimeout(() => reject(new InfraError('field sync: not synced within 2 minutes')), 120_000),
      ),
    ]).catch(async (error) => {
      const bar = await page
        .getByTestId('sync-bar')
        .textContent({ timeout: 1000 })
        .catch(() => null);
      await page.screenshot({ path: path.join(dataDir, 'logs', 'bench-field-sync.png') }).catch(() => null);
      throw new InfraError(`${error.message} (sync bar: ${bar}; rounds ${before} → ${await countRounds()})`);
    });
    await summary.waitFor();

    // Exactly once, with the joints: a hundred rounds more, each offline one with its ten joints and notes.
    const after = await countRounds();
    const rounds = await Promise.all(offlineIds.map((id) => api(`/projects/${projectId}/rounds/${id}`)));
    const withTen = rounds.filter((r) => r.joints.length === 10 && r.distantParts.startsWith('Crown')).length;
    const ratio = syncMs / onlineMs;
    info(
      `field sync: ${ROUNDS} rounds of ten joints saved online in ${onlineMs.toFixed(0)} ms (${(onlineMs / ROUNDS).toFixed(0)} ms a round)`,
    );
    info(
      `field sync: the same ${ROUNDS} made offline synced in ${syncMs.toFixed(0)} ms (${(syncMs / ROUNDS).toFixed(0)} ms a round): ${ratio.toFixed(2)}× (target ≤ ${RATIO_TARGET}×) ${ratio <= RATIO_TARGET ? 'ok' : 'OVER'}`,
    );
    info(
      `field sync: rounds on the heading ${before} → ${after} (expected +${2 * ROUNDS}); offline rounds on the server with their ten joints: ${withTen} of ${ROUNDS} ${after - before === 2 * ROUNDS && withTen === ROUNDS ? 'ok' : 'WRONG'}`,
    );
    if (after - before !== 2 * ROUNDS || withTen !== ROUNDS)
      throw new InfraError('field sync: the offline rounds did not arrive exactly once with their joints');
    await context.close();
  } finally {
    await browser.close();
  }
}
