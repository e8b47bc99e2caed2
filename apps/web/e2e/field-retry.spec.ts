import { expect, test } from '@playwright/test';
import type { Page, Route } from '@playwright/test';

// Field mode (issue 17): a request the server committed whose answer was lost on the way back (the
// connection dropped in the tunnel) is retried and never makes a duplicate. page.route cannot see what a
// service worker fetches, so this spec runs with workers blocked (the project's default).

const password = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';

async function signIn(page: Page): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('geologist@roundbook.test');
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/$/);
}

/** Sends the request to the server, lets it commit, then drops the answer (the first time only). */
function dropFirstAnswer(hits: string[]) {
  let dropped = false;
  return async (route: Route) => {
    hits.push(route.request().method());
    if (dropped) return route.continue();
    dropped = true;
    await route.fetch();
    return route.abort('connectionreset');
  };
}

test('a create and a save whose answers were lost are retried without a duplicate or a false conflict', async ({
  page,
}) => {
  test.setTimeout(90_000);
  await signIn(page);
  const card = page.getByTestId('heading-card').filter({ hasText: 'HR-U' });
  // The card's title (its other links lead to the review count and the handovers).
  await card.getByRole('heading', { level: 3 }).getByRole('link').click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/headings\/[^/]+$/);
  const [, , projectId, , headingId] = new URL(page.url()).pathname.split('/');
  const token = await page.evaluate(
    () =>
      (JSON.parse(localStorage.getItem('roundbook.session') ?? '{}') as { accessToken?: string }).accessToken,
  );
  const headers = { Authorization: `Bearer ${token}` };
  const countRounds = async () => {
    const res = await page.request.get(`/api/projects/${projectId}/headings/${headingId}/rounds?pageSize=1`, {
      headers,
    });
    expect(res.status()).toBe(200);
    return ((await res.json()) as { total: number }).total;
  };
  const before = await countRounds();

  const creates: string[] = [];
  await page.route(`**/api/projects/${projectId}/headings/${headingId}/rounds`, dropFirstAnswer(creates));
  await page.getByRole('button', { name: 'New round' }).click();
  const panel = page.getByRole('region', { name: 'New round on HR-U' });
  const stages = panel.getByRole('radio');
  if ((await stages.count()) > 1) await stages.first().click();
  await expect(panel.getByTestId('next-round')).toBeVisible();
  await panel.getByRole('button', { name: 'Open the round' }).click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/rounds\/[^/]+$/);
  const roundPath = new URL(page.url()).pathname;

  const saves: string[] = [];
  await page.route(`**/api${roundPath}`, async (route) => {
    if (route.request().method() !== 'PUT') return route.continue();
    return dropFirstAnswer(saves)(route);
  });
  await page.getByLabel('Parts of the face seen only from a distance').fill('Crown, seen from the platform');
  await expect(page.getByTestId('sync-bar')).toContainText('All changes saved', { timeout: 30_000 });
  await expect(page.getByTestId('save-state')).toHaveText(/Saved/);
  expect(creates.length).toBeGreaterThanOrEqual(2);
  expect(saves.length).toBeGreaterThanOrEqual(2);

  // One round more, not two; the typing saved once, and no conflict view for the device's own save.
  expect(await countRounds()).toBe(before + 1);
  const res = await page.request.get(`/api${roundPath}`, { headers });
  const saved = (await res.json()) as { distantParts: string; version: number };
  expect(saved.distantParts).toBe('Crown, seen from the platform');
  expect(saved.version).toBe(2);
  await expect(page.getByText(/saved on another device|Compare and choose/)).toHaveCount(0);
});
