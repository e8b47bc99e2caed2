import { mkdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Page } from '@playwright/test';

// The heading's Orientation tab on the demo heading HR-U: opens it, changes the chainage window, saves
// the net as SVG, and takes screenshots in the light and the high-contrast theme. Signs in once (logins
// are rate-limited).

const password = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';
const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

function watchForProblems(page: Page): string[] {
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page: ${error.message}`));
  page.on('response', (response) => {
    if (response.status() >= 500) problems.push(`${response.status()} ${response.url()}`);
  });
  return problems;
}

test("the Orientation tab of HR-U shows the window's poles and sets, in both themes", async ({ page }) => {
  test.setTimeout(90_000);
  const problems = watchForProblems(page);

  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('engineer@roundbook.test');
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/$/);

  // The card's first link is the heading itself (the count of rounds to review links to To confirm).
  await page
    .getByTestId('heading-card')
    .filter({ hasText: 'HR-U' })
    .getByRole('heading', { level: 3 })
    .getByRole('link')
    .click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/headings\/[^/]+$/);
  await page.getByRole('tab', { name: 'Orientation' }).click();
  await expect(page.getByRole('tab', { name: 'Orientation' })).toHaveAttribute('aria-selected', 'true');

  // The default window is the last 50 m behind the face; the net and the sets table fill in.
  const net = page.getByRole('img', { name: /lower-hemisphere stereonet: \d+ poles/ });
  await expect(net).toBeVisible();
  await expect(page.getByRole('table', { name: 'Sets' })).toBeVisible();
  await expect(net).toContainText('multiples of σ, Kamb 1959; uniform = 3σ');
  const caption = page.getByText(/\d+ of \d+ poles? from \d\+\d{3}\.\d to \d\+\d{3}\.\d/);
  const before = await caption.textContent();
  const poles = (text: string | null) => Number(/of (\d+) pole/.exec(text ?? '')?.[1] ?? NaN);
  expect(poles(before)).toBeGreaterThan(0);
  await page.screenshot({ path: `${shots}orientation-hr-u-light.png`, fullPage: true });

  // Narrow the window to the last 25 m: fewer poles, and the caption names the new chainages.
  await page.getByRole('button', { name: 'Last 25 m' }).click();
  await expect(caption).not.toHaveText(before ?? '');
  const after = await caption.textContent();
  expect(poles(after)).toBeLessThan(poles(before));
  // Type a window by hand (km+m), the whole mapped heading from its start.
  const from = page.getByRole('textbox', { name: 'From chainage' });
  await from.fill('2+450');
  await page.getByRole('button', { name: 'Show window' }).click();
  await expect(caption).toContainText('from 2+450.0');
  expect(poles(await caption.textContent())).toBeGreaterThanOrEqual(poles(before));

  // Tap a pole: the read-out names it in every notation.
  await net.focus();
  await page.keyboard.press('ArrowRight');
  const readout = page.getByLabel('Pole read-out');
  await expect(readout).toContainText('Quadrant strike and dip');
  await expect(readout).toContainText('Pole trend / plunge');

  // The sliding aids, each off until asked: friction circle, set-pair intersections, a daylight envelope.
  for (const role of ['friction-circle', 'intersections', 'daylight'])
    await expect(net.locator(`[data-role="${role}"]`)).toHaveCount(0);
  await page.getByRole('switch', { name: 'Friction circle' }).click();
  await page.getByRole('switch', { name: 'Intersections of set pairs' }).click();
  await page.getByRole('radio', { name: 'Daylights on the right wall' }).click();
  await expect(net.locator('[data-role="friction-circle"]')).toHaveCount(1);
  await expect(net.locator('[data-role="daylight-right-wall"]')).toHaveCount(1);
  await expect(net.locator('[data-role^="intersection-label-"]').first()).toBeVisible();
  await expect(net).toContainText('friction circle, φ = 30°');
  await net.screenshot({ path: `${shots}orientation-hr-u-overlays-light.png` });
  await page
    .getByRole('group', { name: 'Sliding aids' })
    .screenshot({ path: `${shots}orientation-hr-u-overlay-options-light.png` });

  // Save the net as SVG: the file is the same scene, with its legend.
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: 'Save as SVG' }).click(),
  ]);
  expect(download.suggestedFilename()).toMatch(/^HR-U-stereonet-\d+-\d+\.svg$/);
  const svg = readFileSync((await download.path()) ?? '', 'utf8');
  expect(svg).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
  expect(svg).toContain('multiples of σ, Kamb 1959; uniform = 3σ');
  expect(svg).toContain('data-role="friction-circle"');
  expect(svg).toContain('Tinted region (right wall)');

  // High-contrast theme: the net keeps its content with its own palette.
  await page.getByRole('switch', { name: 'High contrast' }).click();
  await expect(page.locator('[data-theme-mode="high-contrast"]')).toBeVisible();
  await expect(net).toBeVisible();
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `${shots}orientation-hr-u-high-contrast.png`, fullPage: true });
  await expect(net.locator('[data-role="daylight-right-wall"]')).toHaveCount(1);
  await net.screenshot({ path: `${shots}orientation-hr-u-overlays-high-contrast.png` });
  await page.getByRole('switch', { name: 'High contrast' }).click();

  expect(problems).toEqual([]);
});
