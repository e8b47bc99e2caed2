import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Page } from '@playwright/test';
import { openNewRoundOnHrU } from './flows';

// Issue 19 items 4 and 8 on a 1280 × 800 touch tablet: twelve joints typed into a new round on HR-U, one
// line each, at least ten of them on one screen; every target at least 44 px; removing a joint is undone.
// Screenshots of the Joints section in both themes (apps/web/e2e/screenshots/joints-*.png).

const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

test.use({ hasTouch: true, isMobile: false, viewport: { width: 1280, height: 800 } });

const ORIENTATIONS = [
  '130/50',
  '132/48',
  '128/52',
  '315/70',
  '317/68',
  '312/72',
  '040/15',
  '044/12',
  '240/22',
  '131/49',
  '316/71',
  '042/14',
];

async function setTheme(page: Page, theme: 'light' | 'high-contrast'): Promise<void> {
  await page.evaluate((t) => window.localStorage.setItem('roundbook.theme', t), theme);
  await page.reload();
}

test('twelve joints on a tablet: one line each, ten or more on a screen, remove with Undo', async ({
  page,
}) => {
  test.setTimeout(120_000);
  await openNewRoundOnHrU(page);

  const tabs = page.getByRole('tablist', { name: 'Sections of the round' });
  await tabs.getByRole('tab', { name: 'Joints' }).click();
  await page.getByRole('button', { name: 'Add joint' }).click();
  for (const [i, text] of ORIENTATIONS.entries()) {
    const n = i + 1;
    const orientation = page.getByLabel(`Orientation of joint ${n}`, { exact: true });
    await expect(orientation).toBeFocused();
    await orientation.fill(text);
    if (n === 9) await page.getByLabel(`Kind of joint ${n}`).selectOption('fault');
    await page.getByLabel(`Spacing of joint ${n}, m`).fill('0.4');
    await page.getByLabel(`Jr of joint ${n}`).fill('1.5');
    await page.getByLabel(`Ja of joint ${n}`).fill('2');
    if (n < ORIENTATIONS.length) await page.getByLabel(`Ja of joint ${n}`).press('Enter');
  }
  const rows = page.getByTestId('joint-row');
  await expect(rows).toHaveCount(12);
  await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 15_000 });

  // One line per joint; ten of them fit between the top and the bottom of the 800 px screen.
  const heights: number[] = [];
  for (const row of await rows.all()) heights.push((await row.boundingBox())!.height);
  expect(Math.max(...heights)).toBeLessThanOrEqual(64);
  await rows.first().scrollIntoViewIfNeeded();
  await page.evaluate(() => {
    const first = document.querySelector('[data-testid="joint-row"]')!;
    window.scrollBy(0, first.getBoundingClientRect().top - 60);
  });
  const visible = await page.evaluate(
    () =>
      [...document.querySelectorAll('[data-testid="joint-row"]')].filter((r) => {
        const b = r.getBoundingClientRect();
        return b.top >= 0 && b.bottom <= window.innerHeight;
      }).length,
  );
  console.log(
    `joint rows fully on one 1280 × 800 screen: ${visible}; row heights ${Math.min(...heights)}–${Math.max(...heights)} px`,
  );
  expect(visible).toBeGreaterThanOrEqual(10);

  // Targets: the row's buttons at least 44 × 44 px, and the remove target apart from the others.
  const more = page.getByRole('button', { name: 'More of joint 3' });
  const remove = page.getByRole('button', { name: 'Remove joint 3' });
  const kind = page.getByLabel('Kind of joint 3');
  for (const target of [more, remove]) {
    const box = (await target.boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(44);
    expect(box.width).toBeGreaterThanOrEqual(44);
  }
  const [m, r, k] = [(await more.boundingBox())!, (await remove.boundingBox())!, (await kind.boundingBox())!];
  expect(r.x - (m.x + m.width)).toBeGreaterThanOrEqual(8);
  expect(r.x - (k.x + k.width)).toBeGreaterThan(400);

  await page.screenshot({ path: `${shots}joints-12-light.png` });
  await more.tap();
  await expect(page.getByLabel('Same feature as, joint 3')).toBeVisible();
  await page.screenshot({ path: `${shots}joints-expanded-light.png` });
  await more.tap();

  // Remove with Undo: the joint comes back in its place.
  await remove.tap();
  await expect(rows).toHaveCount(11);
  await expect(page.getByTestId('joint-removed')).toContainText('Joint 3 (joint 128/52) removed.');
  await page.screenshot({ path: `${shots}joints-removed-light.png` });
  await page.getByTestId('joint-removed').getByRole('button', { name: 'Undo' }).tap();
  await expect(rows).toHaveCount(12);
  await expect(page.getByLabel('Orientation of joint 3', { exact: true })).toHaveValue('128/52');
  await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 15_000 });

  await setTheme(page, 'high-contrast');
  await tabs.getByRole('tab', { name: 'Joints' }).click();
  await expect(rows).toHaveCount(12);
  await page.evaluate(() => {
    const first = document.querySelector('[data-testid="joint-row"]')!;
    window.scrollBy(0, first.getBoundingClientRect().top - 60);
  });
  await page.screenshot({ path: `${shots}joints-12-high-contrast.png` });
  await page.getByRole('button', { name: 'More of joint 9' }).tap();
  await page.screenshot({ path: `${shots}joints-expanded-high-contrast.png` });
  await setTheme(page, 'light');
});
