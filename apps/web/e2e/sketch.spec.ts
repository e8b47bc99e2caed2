import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Locator, Page } from '@playwright/test';
import { openNewRoundOnHrU } from './flows';

// The Sketch section on a tablet (1280 × 800, touch): a geologist opens a new round on HR-U, records a
// joint, draws two freehand traces and an overbreak outline with touch pointer events, links the second
// trace to the joint, reloads and finds the drawing as it was (the document the API returns is the one
// last saved). Screenshots in the light and the high-contrast theme.

test.use({ viewport: { width: 1280, height: 800 }, hasTouch: true });

const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

type Body = Record<string, any>;

/** Touch pointer events on the Konva stage at fractions of the canvas box (what a finger sends). */
async function touch(canvas: Locator, path: [number, number][], pointerId: number): Promise<void> {
  const box = (await canvas.boundingBox())!;
  const points = path.map(([fx, fy]) => ({ x: box.x + fx * box.width, y: box.y + fy * box.height }));
  await canvas.evaluate(
    (el, { points, pointerId }) => {
      const target = el.querySelector('canvas:last-of-type') ?? el;
      const send = (type: string, p: { x: number; y: number }) =>
        target.dispatchEvent(
          new PointerEvent(type, {
            bubbles: true,
            cancelable: true,
            clientX: p.x,
            clientY: p.y,
            pointerId,
            pointerType: 'touch',
            isPrimary: true,
            buttons: type === 'pointerup' ? 0 : 1,
          }),
        );
      send('pointerdown', points[0]);
      for (const p of points.slice(1)) send('pointermove', p);
      send('pointerup', points[points.length - 1]);
    },
    { points, pointerId },
  );
}

/** A straight line from a to b in n steps. */
const stroke = (a: [number, number], b: [number, number], n = 12): [number, number][] =>
  Array.from({ length: n + 1 }, (_v, i) => [a[0] + ((b[0] - a[0]) * i) / n, a[1] + ((b[1] - a[1]) * i) / n]);

async function waitSaved(page: Page): Promise<void> {
  await expect(page.getByTestId('save-state')).toHaveText('Saved', { timeout: 15_000 });
}

test('a geologist draws the face with a finger, links a trace to a joint, and the drawing survives a reload', async ({
  page,
}) => {
  test.setTimeout(120_000);
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page: ${error.message}`));
  page.on('response', (r) => {
    if (r.status() >= 500) problems.push(`${r.status()} ${r.url()}`);
  });

  await openNewRoundOnHrU(page);

  const tabs = page.getByRole('tablist', { name: 'Sections of the round' });
  await tabs.getByRole('tab', { name: 'Joints' }).click();
  await page.getByRole('button', { name: 'Add joint' }).click();
  await page.getByLabel('Orientation of joint 1', { exact: true }).fill('130/50');
  await page.getByLabel('Spacing of joint 1, m').fill('0.4');
  await waitSaved(page);

  await tabs.getByRole('tab', { name: 'Sketch' }).click();
  const sketch = page.getByRole('region', { name: 'Sketch', exact: true });
  const canvas = sketch.getByTestId('sketch-canvas');
  await expect(canvas.locator('canvas').first()).toBeVisible();
  // targets for gloves: every tool button at least 48 px
  for (const b of await sketch.getByRole('toolbar', { name: 'Sketch tools' }).getByRole('button').all()) {
    const size = (await b.boundingBox())!;
    expect(Math.min(size.width, size.height)).toBeGreaterThanOrEqual(48);
  }

  // two freehand traces; the second one linked to joint 1 before it is drawn
  await sketch.getByRole('button', { name: 'Freehand trace' }).click();
  await touch(canvas, stroke([0.36, 0.62], [0.58, 0.4]), 11);
  await sketch.getByLabel('New traces link to').selectOption({ label: 'Joint 1 · 130/50' });
  await touch(canvas, stroke([0.42, 0.7], [0.66, 0.52]), 12);
  // an overbreak outline in the crown: three taps (apart, so no double tap), then Finish line
  await sketch.getByRole('button', { name: 'Overbreak outline' }).click();
  for (const [i, p] of (
    [
      [0.46, 0.24],
      [0.56, 0.24],
      [0.51, 0.17],
    ] as [number, number][]
  ).entries()) {
    if (i > 0) await page.waitForTimeout(350); // the canvas reads two taps within 300 ms as "finish"
    await touch(canvas, [p], 20 + i);
  }
  await sketch.getByRole('button', { name: 'Finish line' }).click();

  const saved = page.waitForResponse(
    (r) => r.request().method() === 'PUT' && /\/api\/projects\/[^/]+\/rounds\/[^/]+$/.test(r.url()) && r.ok(),
  );
  await waitSaved(page);
  await saved.catch(() => undefined);
  await expect(sketch.getByRole('button', { name: /Joint 1 · 130\/50.*Traced on the sketch/ })).toBeVisible();
  await page.screenshot({ path: `${shots}sketch-drawn-light.png`, fullPage: true });

  // reload: the round comes back from the API with the same drawing
  const reread = page.waitForResponse(
    (r) => r.request().method() === 'GET' && /\/api\/projects\/[^/]+\/rounds\/[^/]+$/.test(r.url()) && r.ok(),
  );
  await page.reload();
  const round = (await (await reread).json()) as Body;
  const elements = round.sketch.elements as Body[];
  expect(elements.map((e) => e.kind)).toEqual(['trace', 'trace', 'overbreak']);
  expect(elements[0].link).toBeNull();
  expect(elements[1].link).toEqual({ jointId: round.joints[0].id });
  expect(elements[0].points.length).toBeGreaterThanOrEqual(5);
  // the first stroke went up and to the right: its end is right of and above its start (y up, metres)
  const [start, end] = [elements[0].points[0], elements[0].points.at(-1)];
  expect(end[0]).toBeGreaterThan(start[0]);
  expect(end[1]).toBeGreaterThan(start[1]);
  expect(elements[2].points).toHaveLength(3);

  await page
    .getByRole('tablist', { name: 'Sections of the round' })
    .getByRole('tab', { name: 'Sketch' })
    .click();
  const again = page.getByRole('region', { name: 'Sketch', exact: true });
  await expect(again.getByRole('button', { name: /Joint 1 · 130\/50.*Traced on the sketch/ })).toBeVisible();
  // tapping the joint selects its trace and gives its length
  await again.getByRole('button', { name: /Joint 1 · 130\/50/ }).click();
  await expect(again.getByTestId('sketch-selection')).toContainText(/Trace · \d+\.\d\d m long/);
  await page.screenshot({ path: `${shots}sketch-reloaded-light.png`, fullPage: true });

  await page.evaluate(() => window.localStorage.setItem('roundbook.theme', 'high-contrast'));
  await page.reload();
  await page
    .getByRole('tablist', { name: 'Sections of the round' })
    .getByRole('tab', { name: 'Sketch' })
    .click();
  await expect(
    page.getByRole('region', { name: 'Sketch', exact: true }).getByTestId('sketch-canvas'),
  ).toBeVisible();
  await page.screenshot({ path: `${shots}sketch-high-contrast.png`, fullPage: true });
  await page.evaluate(() => window.localStorage.setItem('roundbook.theme', 'light'));

  expect(problems).toEqual([]);
});
