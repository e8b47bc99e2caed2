import { mkdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Page } from '@playwright/test';
import { openNewRoundOnHrU, signInAs } from './flows';

// The heading's Orientation tab on the demo heading HR-U: opens it, changes the chainage window, saves
// the net as SVG, and takes screenshots in the light and the high-contrast theme. Signs in once (logins
// are rate-limited).

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

  await signInAs(page, 'engineer@roundbook.test');

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
  await expect.poll(async () => poles(await caption.textContent()), { timeout: 10_000 }).toBeGreaterThan(0);
  expect(poles(await caption.textContent())).toBeLessThan(poles(before));
  // Type a window by hand (km+m), the whole mapped heading from its start.
  const from = page.getByRole('textbox', { name: 'From chainage' });
  await from.fill('2+450');
  await page.getByRole('button', { name: 'Show window' }).click();
  await expect(caption).toContainText('from 2+450.0');
  // The caption names the new window before its poles have come in ("0 of 0 poles"): wait for them.
  await expect
    .poll(async () => poles(await caption.textContent()), { timeout: 10_000 })
    .toBeGreaterThanOrEqual(poles(before));

  // Beside the net, each round's set means along the window's chainage, and the same figures as a table.
  const history = page.getByRole('region', { name: 'Sets along the chainage' });
  const chart = history.getByRole('img', {
    name: /^Chart of each set's mean along the chainage from 2\+450\.0/,
  });
  await expect(chart).toBeVisible();
  expect(await chart.locator('[data-role="history-mean"]').count()).toBeGreaterThan(4);
  await history.getByRole('button', { name: 'Show as a table' }).click();
  const historyRows = history.getByRole('table', { name: 'Sets along the chainage' }).getByRole('row');
  expect(await historyRows.count()).toBeGreaterThan(3);
  const cells = await historyRows.nth(1).getByRole('cell').allTextContents();
  expect(cells[0]).toMatch(/^S\d+$/);
  expect(cells[2]).toMatch(/^\d\+\d{3}\.\d$/);
  expect(cells[3]).toMatch(/^\d{3}(\.\d)?\/\d{2}(\.\d)?$/);
  await history.screenshot({ path: `${shots}orientation-set-history-light.png` });
  await history.getByRole('button', { name: 'Hide the table' }).click();

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
  await history.screenshot({ path: `${shots}orientation-set-history-high-contrast.png` });
  await page.getByRole('switch', { name: 'High contrast' }).click();

  expect(problems).toEqual([]);
});

test.describe('on a touch tablet', () => {
  test.use({ hasTouch: true, isMobile: false, viewport: { width: 1280, height: 800 } });

  test("a round's poles tapped on its net go into a set, and the Joints list shows it, in both themes", async ({
    page,
  }) => {
    test.setTimeout(120_000);
    const problems = watchForProblems(page);
    await openNewRoundOnHrU(page);
    await page
      .getByRole('tablist', { name: 'Sections of the round' })
      .getByRole('tab', { name: 'Joints' })
      .click();

    // Four joints: two near 130/50 and two near 315/70 (invented).
    await page.getByRole('button', { name: 'Add joint' }).click();
    for (const [i, text] of ['130/50', '132/48', '315/70', '317/68'].entries()) {
      const orientation = page.getByLabel(`Orientation of joint ${i + 1}`, { exact: true });
      await expect(orientation).toBeFocused();
      await orientation.fill(text);
      if (i < 3) await orientation.press('Enter');
    }
    await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 15_000 });
    const setOf = (n: number) => page.getByLabel(`Set of joint ${n}`, { exact: true });
    const before = await setOf(3).inputValue();

    // Choose joints 3 and 4 by tapping their poles. Where a pole is drawn is read from the ring the net
    // draws round the pole being read (the arrow keys step through the poles in the joints' order).
    const net = page.getByRole('img', { name: /lower-hemisphere stereonet: 4 poles/ });
    await net.scrollIntoViewIfNeeded();
    await page.getByRole('button', { name: 'Choose poles for a set' }).tap();
    await expect(net).toHaveAttribute('data-choosing', 'true');
    const bar = page.getByRole('group', { name: 'Chosen poles' });
    await expect(bar).toContainText('0 poles selected');
    const ring = net.locator('[data-role="selected-pole"]');
    const placeOf = async (n: number) => {
      await net.focus();
      for (let k = 0; k < n; k++) await page.keyboard.press('ArrowRight');
      const box = (await ring.boundingBox())!;
      await page.keyboard.press('Escape');
      return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
    };
    const third = await placeOf(3);
    const fourth = await placeOf(4);
    await page.touchscreen.tap(third.x, third.y);
    await expect(bar).toContainText('1 pole selected');
    await page.touchscreen.tap(fourth.x, fourth.y);
    await expect(bar).toContainText('2 poles selected');
    await expect(net.locator('[data-role="chosen-pole"]')).toHaveCount(2);
    await page.screenshot({ path: `${shots}orientation-round-chosen-light.png`, fullPage: true });
    await net.screenshot({ path: `${shots}orientation-round-chosen-net-light.png` });

    // Into a new set, named S9 here; the Joints list shows it as the geologist's own, and it is saved.
    await bar.getByLabel('Set to put them in').selectOption({ label: 'A new set…' });
    await bar.getByLabel('Name of the new set').fill('S9');
    await bar.getByRole('button', { name: 'Put in set S9' }).tap();
    await expect(page.getByTestId('pole-choice-done')).toContainText('2 poles put in set S9');
    await expect(setOf(3)).toHaveValue('S9');
    await expect(setOf(4)).toHaveValue('S9');
    expect(before).not.toBe('S9');
    await expect(setOf(1)).not.toHaveValue('S9');
    await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 15_000 });
    await expect(page.getByRole('table', { name: 'Sets' })).toContainText('S9');

    // A lasso drawn with the mouse round the poles of joints 1 and 2 chooses both; Take out of its set
    // makes them random, again as the geologist's own choice (marked "yours" in the Joints list).
    const [p1, p2] = [await placeOf(1), await placeOf(2)];
    const box = {
      left: Math.min(p1.x, p2.x) - 26,
      right: Math.max(p1.x, p2.x) + 26,
      top: Math.min(p1.y, p2.y) - 26,
      bottom: Math.max(p1.y, p2.y) + 26,
    };
    await page.mouse.move(box.left, box.top);
    await page.mouse.down();
    for (const [x, y] of [
      [box.right, box.top],
      [box.right, box.bottom],
      [box.left, box.bottom],
      [box.left, box.top + 4],
    ])
      await page.mouse.move(x, y, { steps: 6 });
    await expect(net.locator('[data-role="lasso"]')).toHaveCount(1);
    await net.screenshot({ path: `${shots}orientation-round-lasso-net-light.png` });
    await page.mouse.up();
    await expect(net.locator('[data-role="lasso"]')).toHaveCount(0);
    await expect(bar).toContainText('2 poles selected');
    await page.screenshot({ path: `${shots}orientation-round-lasso-light.png`, fullPage: true });
    await bar.getByRole('button', { name: 'Take out of its set' }).tap();
    await expect(setOf(1)).toHaveValue('');
    await expect(setOf(2)).toHaveValue('');
    await expect(page.getByTestId('joint-row').getByText('yours', { exact: true })).toHaveCount(4);
    await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 15_000 });

    // After a reload the choices are the round's: S9 kept, joints 1 and 2 in no set.
    await page.evaluate(() => window.localStorage.setItem('roundbook.theme', 'high-contrast'));
    await page.reload();
    await page
      .getByRole('tablist', { name: 'Sections of the round' })
      .getByRole('tab', { name: 'Joints' })
      .click();
    await expect(setOf(3)).toHaveValue('S9');
    await expect(setOf(1)).toHaveValue('');
    await expect(page.getByTestId('joint-row').getByText('yours', { exact: true })).toHaveCount(4);
    await page.getByRole('button', { name: 'Choose poles for a set' }).tap();
    const second = await placeOf(2);
    await page.touchscreen.tap(second.x, second.y);
    await expect(bar).toContainText('1 pole selected');
    await net.scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${shots}orientation-round-chosen-high-contrast.png`, fullPage: true });
    await net.screenshot({ path: `${shots}orientation-round-chosen-net-high-contrast.png` });
    await page.evaluate(() => window.localStorage.setItem('roundbook.theme', 'light'));
    expect(problems).toEqual([]);
  });
});
