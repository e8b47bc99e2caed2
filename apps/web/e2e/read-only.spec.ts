import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Browser, Page } from '@playwright/test';

// Issue 19 items 11 and 5. The viewer reads a submitted demo round on a tablet-sized window (1280 × 800,
// playwright.config.ts): every section is a summary of label and value, never a disabled form; screenshots
// in both themes. The geologist then opens the demo's draft round: no field's box overlaps or touches
// another's, and no dropdown cuts its chosen text, on every section at 1280 × 800 and 1920 × 1080; the same
// for the Setup forms as the admin. Each person signs in once (sign-ins are rate-limited).

const password = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';
const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });
type Theme = 'light' | 'high-contrast';
const THEMES: Theme[] = ['light', 'high-contrast'];
const SECTIONS = ['Position', 'Ground', 'Joints', 'Rating', 'Support'];

const problems: string[] = [];

async function signIn(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext({ hasTouch: true })).newPage();
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

/** The theme as the theme switch stores it, then the page loaded again. */
async function setTheme(page: Page, theme: Theme): Promise<void> {
  await page.evaluate((t) => window.localStorage.setItem('roundbook.theme', t), theme);
  await page.reload();
}

async function shot(page: Page, name: string): Promise<void> {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `${shots}${name}.png`, fullPage: true });
}

/** Opens the first round of HR-U with the given status from its Rounds table. */
async function openRound(page: Page, status: 'submitted' | 'draft'): Promise<void> {
  await page
    .getByTestId('heading-card')
    .filter({ hasText: 'HR-U' })
    .getByRole('heading', { level: 3 })
    .getByRole('link')
    .click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/headings\/[^/]+$/);
  await page.goto(`${page.url()}?status=${status}`);
  await page.getByTestId('round-row').first().getByRole('link').first().click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/rounds\/[^/]+$/);
  await expect(page.getByRole('tablist', { name: 'Sections of the round' })).toBeVisible();
}

/**
 * What is wrong with the layout of the fields on screen, in words (empty when nothing): two fields whose
 * boxes — the field and each of its parts (label, control, hint, message) — overlap or come closer than 2 px,
 * a part that sticks out of its own field, and a dropdown whose chosen text is wider than its box.
 */
async function layoutProblems(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const found: string[] = [];
    const visible = (el: Element) => {
      const r = el.getBoundingClientRect();
      return r.width > 0 && r.height > 0 && getComputedStyle(el).visibility !== 'hidden';
    };
    const nameOf = (el: Element) =>
      (el.querySelector('label')?.textContent ?? el.getAttribute('aria-label') ?? el.textContent ?? '')
        .trim()
        .slice(0, 50);
    const fields = [...document.querySelectorAll('main .fui-Field')].filter(visible);
    const boxes = fields.map((f) => ({
      field: f,
      own: f.getBoundingClientRect(),
      parts: [...f.children].filter(visible).map((c) => c.getBoundingClientRect()),
    }));
    const near = (a: DOMRect, b: DOMRect, margin: number) =>
      a.left < b.right + margin &&
      b.left < a.right + margin &&
      a.top < b.bottom + margin &&
      b.top < a.bottom + margin;
    for (const b of boxes) {
      for (const p of b.parts) {
        if (p.left < b.own.left - 1 || p.right > b.own.right + 1)
          found.push(`part of "${nameOf(b.field)}" sticks out of its field`);
      }
    }
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i];
        const b = boxes[j];
        if (a.field.contains(b.field) || b.field.contains(a.field)) continue;
        const all = (x: typeof a) => [x.own, ...x.parts];
        if (all(a).some((pa) => all(b).some((pb) => near(pa, pb, 2))))
          found.push(`"${nameOf(a.field)}" and "${nameOf(b.field)}" overlap or touch`);
      }
    }
    const canvas = document.createElement('canvas').getContext('2d');
    for (const select of [...document.querySelectorAll('main select')].filter(visible)) {
      const s = select as HTMLSelectElement;
      const text = s.selectedOptions[0]?.textContent ?? '';
      const style = getComputedStyle(s);
      if (canvas === null) break;
      canvas.font = `${style.fontWeight} ${style.fontSize} ${style.fontFamily}`;
      const room = s.clientWidth - parseFloat(style.paddingLeft) - parseFloat(style.paddingRight);
      const width = canvas.measureText(text).width;
      if (width > room + 1)
        found.push(
          `dropdown "${s.getAttribute('aria-label') ?? nameOf(s.closest('.fui-Field') ?? s)}" cuts "${text}" (${Math.round(width)} px in ${Math.round(room)} px)`,
        );
    }
    return found;
  });
}

test('the viewer reads a submitted round as a summary, in both themes', async ({ browser }) => {
  test.setTimeout(120_000);
  const viewer = await signIn(browser, 'viewer@roundbook.test');
  await openRound(viewer, 'submitted');
  const roundUrl = viewer.url();
  const tabs = viewer.getByRole('tablist', { name: 'Sections of the round' });

  for (const theme of THEMES) {
    await setTheme(viewer, theme);
    await expect(tabs.getByRole('tab', { name: 'Support' })).toBeVisible();
    for (const section of SECTIONS) {
      await tabs.getByRole('tab', { name: section }).click();
      const summary = viewer.getByTestId(`summary-${section.toLowerCase()}`);
      await expect(summary).toBeVisible();
      // A summary, not a form: nothing to type into or choose from.
      await expect(summary.locator('input, select, textarea')).toHaveCount(0);
      await expect(summary.locator('[disabled], [aria-disabled="true"]')).toHaveCount(0);
      // Values wrap; none is cut with an ellipsis or hidden behind its box.
      const cut = await summary
        .locator('dd')
        .evaluateAll((dds) => dds.filter((d) => d.scrollWidth > d.clientWidth + 1).map((d) => d.textContent));
      expect(cut).toEqual([]);
      await shot(viewer, `read-only-${section.toLowerCase()}-${theme}`);
    }
  }
  await viewer.goto(roundUrl);
  await tabs.getByRole('tab', { name: 'Position' }).click();
  const position = viewer.getByTestId('summary-position');
  await expect(position.getByTestId('summary-shift')).toHaveText(/^(Day|Night) shift$/);
  await expect(position).toContainText('Face chainage');
  await expect(position).toContainText(/\d\+\d{3}\.\d/);
  await tabs.getByRole('tab', { name: 'Joints' }).click();
  const joints = viewer.getByTestId('summary-joints');
  await expect(joints.getByRole('table', { name: 'Joints of this face' })).toBeVisible();
  expect(
    await joints.getByRole('table', { name: 'Joints of this face' }).locator('tbody tr').count(),
  ).toBeGreaterThan(0);
  await tabs.getByRole('tab', { name: 'Rating' }).click();
  // A Q parameter reads as its symbol, its value and its whole description from the table.
  await expect(viewer.getByTestId('summary-rating').getByTestId('summary-q-ja')).toHaveText(/^Ja \d/);
  await tabs.getByRole('tab', { name: 'Support' }).click();
  await expect(viewer.getByTestId('summary-support')).toContainText('Recommended class');
  expect(problems).toEqual([]);
});

test('no field covers or touches another on the round sections and the Setup forms', async ({ browser }) => {
  test.setTimeout(180_000);
  const geologist = await signIn(browser, 'geologist@roundbook.test');
  await openRound(geologist, 'draft');
  const tabs = geologist.getByRole('tablist', { name: 'Sections of the round' });
  const found: string[] = [];
  for (const size of [
    { width: 1280, height: 800 },
    { width: 1920, height: 1080 },
  ]) {
    await geologist.setViewportSize(size);
    for (const theme of THEMES) {
      await setTheme(geologist, theme);
      await expect(tabs.getByRole('tab', { name: 'Support' })).toBeVisible();
      for (const tab of await tabs.getByRole('tab').all()) {
        // A Fluent tab holds its text twice (the second keeps the room for the bold selected text).
        const text = ((await tab.textContent()) ?? '?').replace(/!/g, '').trim();
        const half = text.slice(0, text.length / 2);
        const name = text.length % 2 === 0 && text === half + half ? half : text;
        await tab.click();
        await geologist.waitForLoadState('networkidle');
        // Open the first joint's further fields too: they are fields like the others.
        if (name === 'Joints') {
          const more = geologist.getByRole('button', { name: 'More of joint 1', exact: true });
          if ((await more.count()) > 0 && (await more.getAttribute('aria-expanded')) !== 'true')
            await more.click();
        }
        if (theme === 'light')
          found.push(...(await layoutProblems(geologist)).map((p) => `${size.width} ${name}: ${p}`));
        await shot(geologist, `editor-${name.toLowerCase()}-${size.width}-${theme}`);
      }
    }
  }

  const admin = await signIn(browser, 'admin@roundbook.test');
  for (const size of [
    { width: 1280, height: 800 },
    { width: 1920, height: 1080 },
  ]) {
    await admin.setViewportSize(size);
    for (const section of ['project', 'headings']) {
      await admin.goto(`/setup/${section}`);
      await expect(admin.getByRole('tablist', { name: 'Setup sections' })).toBeVisible();
      await admin.waitForLoadState('networkidle');
      // The heading form opens from its row (its hint on the grid start coordinates, its drive fields).
      if (section === 'headings') {
        await admin
          .getByRole('row')
          .filter({ hasText: 'HR-U' })
          .getByRole('button', { name: 'Change' })
          .click();
        await expect(admin.getByRole('form', { name: 'Change heading HR-U' })).toBeVisible();
      }
      found.push(...(await layoutProblems(admin)).map((p) => `${size.width} setup ${section}: ${p}`));
      await shot(admin, `setup-${section}-${size.width}`);
    }
  }
  expect(found).toEqual([]);
  expect(problems).toEqual([]);
});
