import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Browser, Page } from '@playwright/test';

// The engineer works the To confirm queue on a tablet-sized window (1280 × 800, playwright.config.ts):
// opens the first submitted demo round, confirms it with another class than recommended and a reason,
// signing with the password; returns the next one with a comment on its ground; the geologist then reads
// the confirmation and the return comment. Screenshots of each step. Each person signs in once.

const password = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';
const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });
const CAUTION = 'the responsible engineer decides under the project’s design and local regulations';

const problems: string[] = [];

async function signIn(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  page.on('pageerror', (error) => problems.push(`page: ${error.message}`));
  page.on('response', (response) => {
    if (response.status() >= 500) problems.push(`${response.status()} ${response.url()}`);
  });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/$/);
  return page;
}

async function shot(page: Page, name: string): Promise<void> {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `${shots}${name}.png`, fullPage: true });
}

test('the engineer confirms one round with another class and returns another; the geologist sees both', async ({
  browser,
}) => {
  test.setTimeout(120_000);
  const engineer = await signIn(browser, 'engineer@roundbook.test');

  await engineer.getByRole('link', { name: 'To confirm' }).first().click();
  const queue = engineer.getByRole('list', { name: 'Rounds to confirm' });
  await expect(queue).toBeVisible();
  const items = queue.getByTestId('queue-item');
  expect(await items.count()).toBeGreaterThanOrEqual(2);
  await expect(engineer.getByTestId('review-caution')).toContainText(CAUTION);
  await shot(engineer, 'review-queue');

  // Confirm the first (the most urgent) with a class other than the recommended one.
  await items.first().getByRole('link').first().click();
  await expect(engineer).toHaveURL(/\/projects\/[^/]+\/rounds\/[^/]+$/);
  const confirmedUrl = engineer.url();
  const panel = engineer.getByTestId('review-panel');
  await expect(panel).toBeVisible();
  await expect(panel.getByTestId('review-caution')).toContainText(CAUTION);
  const form = panel.getByRole('form', { name: 'Confirm the round' });
  const select = form.getByRole('combobox', { name: /Support class to build/ });
  const recommended = await select.inputValue();
  const other = await select.evaluate(
    (el, current) =>
      [...(el as HTMLSelectElement).options].find((o) => !o.disabled && o.value !== '' && o.value !== current)
        ?.value ?? '',
    recommended,
  );
  expect(other).not.toBe('');
  await select.selectOption(other);
  await form.getByRole('textbox', { name: /Reason/ }).fill('Open crown joints on the left shoulder');
  await form.getByRole('textbox', { name: /Comments/ }).fill('Bolt the left shoulder first.');
  await form.getByLabel(/Your password/).fill(password);
  await shot(engineer, 'review-confirm-filled');
  await form.getByRole('button', { name: 'Sign and confirm' }).click();
  const confirmation = panel.getByTestId('confirmation');
  await expect(confirmation).toContainText('Open crown joints on the left shoulder');
  await expect(confirmation).toContainText('(engineer)');
  await shot(engineer, 'review-confirmed');

  // Back to the queue: return the next one with a comment on its ground.
  await engineer.getByRole('link', { name: 'To confirm' }).first().click();
  await expect(queue).toBeVisible();
  await queue.getByTestId('queue-item').first().getByRole('link').first().click();
  await expect(engineer).toHaveURL(/\/projects\/[^/]+\/rounds\/[^/]+$/);
  const returnedUrl = engineer.url();
  expect(returnedUrl).not.toBe(confirmedUrl);
  await panel.getByRole('tab', { name: 'Return with comments' }).click();
  const back = panel.getByRole('form', { name: 'Return the round' });
  await back.getByRole('textbox', { name: 'Ground' }).fill('Say where the water at the crown comes from.');
  await shot(engineer, 'review-return-filled');
  await back.getByRole('button', { name: 'Return to the geologist' }).click();
  await expect(panel.getByTestId('return-comment')).toContainText(
    'Say where the water at the crown comes from.',
  );

  // The geologist reads the result of both.
  const geologist = await signIn(browser, 'geologist@roundbook.test');
  await geologist.goto(confirmedUrl);
  await expect(geologist.getByTestId('confirmation')).toContainText('Open crown joints on the left shoulder');
  await expect(geologist.getByTestId('review-caution')).toContainText(CAUTION);
  await shot(geologist, 'review-geologist-confirmed');
  await geologist.goto(returnedUrl);
  await expect(geologist.getByTestId('return-comment')).toContainText(
    'Say where the water at the crown comes from.',
  );
  await shot(geologist, 'review-geologist-returned');
  // The comment is also at the top of the Ground section, where the geologist resolves it.
  await geologist
    .getByRole('tablist', { name: 'Sections of the round' })
    .getByRole('tab', { name: 'Ground' })
    .click();
  const callout = geologist.getByTestId('section-comments-ground');
  await expect(callout).toContainText('Say where the water at the crown comes from.');
  await shot(geologist, 'review-geologist-comment-beside-ground');
  await callout.getByRole('button', { name: 'Resolve' }).click();
  await expect(callout).toHaveCount(0);
  await expect(geologist.getByTestId('return-comment')).toHaveCount(0);
  expect(problems).toEqual([]);
});
