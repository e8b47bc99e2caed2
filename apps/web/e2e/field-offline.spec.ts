import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Page } from '@playwright/test';

// This spec is about the service worker: it opens the app from the worker's cache with the network cut.
test.use({ serviceWorkers: 'allow' });

// Field mode (issue 17): a geologist opens Roundbook once with a connection, goes underground (the network
// is cut in the browser), reloads the page and still has the app, the heading and a new round.

const password = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';
const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

async function signIn(page: Page): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('geologist@roundbook.test');
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/$/);
}

test('the app opens offline from its cache with the heading, and a round can be started', async ({
  page,
  context,
}) => {
  test.setTimeout(90_000);
  await signIn(page);
  // The service worker takes the page over (clientsClaim) once installed; from then on it keeps answers.
  await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, null, { timeout: 20_000 });

  // Online once: the heading and the new-round panel (its /next answer) are read through the worker.
  await page.reload();
  const card = page.getByTestId('heading-card').filter({ hasText: 'HR-U' });
  // The card's title (its other links lead to the review count and the handovers).
  await card.getByRole('heading', { level: 3 }).getByRole('link').click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/headings\/[^/]+$/);
  const headingUrl = page.url();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('HR-U');
  await expect(page.getByTestId('round-row').first()).toBeVisible();
  await page.getByRole('button', { name: 'New round' }).click();
  const panel = page.getByRole('region', { name: 'New round on HR-U' });
  await expect(panel.getByTestId('next-round')).toBeVisible();
  const stages = panel.getByRole('radio');
  const stageCount = await stages.count();
  if (stageCount > 1) {
    await stages.first().click();
    await expect(panel.getByTestId('next-round')).toBeVisible();
  }

  // Underground: no network at all, then a reload.
  await context.setOffline(true);
  await page.reload();
  await expect(page).toHaveURL(headingUrl);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('HR-U');
  await expect(page.getByTestId('round-row').first()).toBeVisible();
  await expect(page.getByTestId('sync-bar')).toContainText('Offline');
  await page.getByRole('button', { name: 'New round' }).click();
  const offlinePanel = page.getByRole('region', { name: 'New round on HR-U' });
  if (stageCount > 1) await offlinePanel.getByRole('radio').first().click();
  await expect(offlinePanel.getByTestId('next-round')).toBeVisible();
  const face = await offlinePanel.getByLabel('Face chainage').inputValue();
  expect(face).not.toBe('');
  await page.screenshot({ path: `${shots}field-offline-heading.png`, fullPage: true });

  await offlinePanel.getByRole('button', { name: 'Open the round' }).click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/rounds\/[^/]+$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText(face);
  await page.getByLabel('Parts of the face seen only from a distance').fill('Crown, seen from the platform');
  await expect(page.getByTestId('sync-bar')).toContainText(/waiting/);
  await page.screenshot({ path: `${shots}field-offline-round.png`, fullPage: true });

  // A reload underground keeps the new round and its typing.
  await page.reload();
  await expect(page.getByRole('heading', { level: 1 })).toContainText(face);
  await expect(page.getByLabel('Parts of the face seen only from a distance')).toHaveValue(
    'Crown, seen from the platform',
  );

  // Back in the open: the round is created once and the typing saved.
  await context.setOffline(false);
  await expect(page.getByTestId('sync-bar')).toContainText('All changes saved', { timeout: 20_000 });
  const roundUrl = new URL(page.url()).pathname;
  const token = await page.evaluate(
    () =>
      (JSON.parse(localStorage.getItem('roundbook.session') ?? '{}') as { accessToken?: string }).accessToken,
  );
  const res = await page.request.get(`/api${roundUrl}`, { headers: { Authorization: `Bearer ${token}` } });
  expect(res.status()).toBe(200);
  const saved = (await res.json()) as { distantParts: string };
  expect(saved.distantParts).toBe('Crown, seen from the platform');
  await page.screenshot({ path: `${shots}field-online-synced.png` });
});
