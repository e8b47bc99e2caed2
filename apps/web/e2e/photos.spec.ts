import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Locator } from '@playwright/test';
import sharp from 'sharp';
import { openNewRoundOnHrU } from './flows';

// The Photos section on a tablet (1280 × 800, touch): a geologist opens a new round on HR-U, adds three
// photos (made here with sharp: an invented face with a tape laid across it) and watches their progress,
// opens the full-screen viewer, swipes to the next photo, double-taps to zoom, marks a scale along the
// tape and sees the scale bar. Screenshots of the gallery and the viewer.

test.use({ viewport: { width: 1280, height: 800 }, hasTouch: true });

const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

type Body = Record<string, any>;

/** A 1600 × 1200 JPEG: rock-coloured noise, a few dark lines, a tape from 20 % to 70 % of the width. */
async function facePhoto(n: number): Promise<Buffer> {
  const [w, h] = [1600, 1200];
  const hue = ['#7a6a58', '#6b6f73', '#80705a'][n - 1];
  const ticks = Array.from({ length: 11 }, (_v, i) => {
    const x = 320 + i * 80;
    return `<line x1="${x}" y1="585" x2="${x}" y2="${i % 5 === 0 ? 630 : 615}" stroke="#111" stroke-width="4"/>`;
  }).join('');
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}">
    <rect width="100%" height="100%" fill="${hue}"/>
    <path d="M0 ${300 + n * 40} L1600 ${180 + n * 60}" stroke="#3a302a" stroke-width="10"/>
    <path d="M200 1200 L${700 + n * 80} 0" stroke="#2f2a26" stroke-width="7"/>
    <path d="M900 1200 C1000 800 1200 700 1600 650" stroke="#4a3f36" stroke-width="6" fill="none"/>
    <rect x="320" y="570" width="800" height="20" fill="#f2c200"/>${ticks}
    <text x="60" y="120" font-size="72" font-family="sans-serif" fill="#fff">Photo ${n}</text>
  </svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 85 }).toBuffer();
}

/** Pointer events (touch) at points given in CSS pixels of the page. */
async function pointer(
  target: Locator,
  points: { x: number; y: number }[],
  pointerId: number,
): Promise<void> {
  await target.evaluate(
    (el, { points, pointerId }) => {
      const send = (type: string, p: { x: number; y: number }) =>
        el.dispatchEvent(
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
      for (const p of points.slice(1, -1)) send('pointermove', p);
      send('pointerup', points[points.length - 1]);
    },
    { points, pointerId },
  );
}

test('a geologist adds three photos with progress, swipes in the viewer, zooms and marks a scale', async ({
  page,
}) => {
  test.setTimeout(120_000);
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page: ${error.message}`));
  page.on('response', (r) => {
    if (r.status() >= 500) problems.push(`${r.status()} ${r.url()}`);
  });
  await openNewRoundOnHrU(page);
  const section = page.getByRole('region', { name: 'Photos', exact: true });
  await section.getByRole('button', { name: 'Add photos' }).scrollIntoViewIfNeeded();

  // The third file's start is held back until the progress of the batch has been seen part-way.
  let release: () => void = () => {};
  const held = new Promise<void>((r) => (release = r));
  let starts = 0;
  await page.route(/\/api\/projects\/[^/]+\/rounds\/[^/]+\/photos$/, async (route) => {
    if (route.request().method() === 'POST' && ++starts === 3) await held;
    await route.continue();
  });

  const files = await Promise.all(
    [1, 2, 3].map(async (n) => ({
      name: `face-${n}.jpg`,
      mimeType: 'image/jpeg',
      buffer: await facePhoto(n),
    })),
  );
  await section.getByLabel('Photo files').setInputFiles(files);
  await expect(section.getByText('face-1.jpg: added')).toBeVisible();
  await expect(section.getByText('face-2.jpg: added')).toBeVisible();
  await expect(section.getByText('face-3.jpg: 0 %')).toBeVisible();
  for (const f of files) await expect(section.getByRole('progressbar', { name: f.name })).toBeVisible();
  // The batch bar stands at the share of bytes of the first two files.
  const sent = files[0].buffer.length + files[1].buffer.length;
  const total = sent + files[2].buffer.length;
  await expect(section.getByText(`All photos: ${Math.round((sent / total) * 100)} %`)).toBeVisible();
  await page.screenshot({ path: `${shots}photos-uploading.png`, fullPage: true });
  release();
  await expect(section.getByText('face-3.jpg: added')).toBeVisible();
  await expect(section.getByText('All photos: 100 %')).toBeVisible();
  await page.unroute(/\/api\/projects\/[^/]+\/rounds\/[^/]+\/photos$/);

  // The gallery: three photos, their thumbnails made by the job (the original shows until then).
  for (const n of [1, 2, 3]) await expect(section.getByRole('img', { name: `face-${n}.jpg` })).toBeVisible();
  await expect(section.getByText(/thumbnail being made/)).toHaveCount(0, { timeout: 30_000 });
  for (const n of [1, 2, 3])
    await expect
      .poll(() =>
        section.getByRole('img', { name: `face-${n}.jpg` }).evaluate((i: HTMLImageElement) => i.naturalWidth),
      )
      .toBe(320); // 1600 × 1200 fitted in the 320 px thumbnail box
  await section.scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${shots}photos-gallery.png`, fullPage: true });

  // The viewer: every control a finger can hit (44 px at least).
  await section.getByRole('button', { name: 'Open face-1.jpg' }).click();
  // (the dialog is named by the photo shown: found by role, its name checked as it changes)
  const viewer = page.getByRole('dialog');
  await expect(viewer).toHaveAccessibleName('face-1.jpg');
  await expect(viewer.getByText('1 of 3')).toBeVisible();
  for (const b of await viewer.getByRole('button').all()) {
    const size = (await b.boundingBox())!;
    expect(Math.min(size.width, size.height)).toBeGreaterThanOrEqual(44);
  }
  const stage = viewer.getByTestId('photo-stage');
  const box = (await stage.boundingBox())!;
  const cy = box.y + box.height / 2;
  // a finger swipes from right to left: the next photo
  await pointer(
    stage,
    [0, 1, 2, 3, 4].map((i) => ({ x: box.x + box.width * (0.7 - i * 0.08), y: cy })),
    7,
  );
  await expect(viewer.getByText('2 of 3')).toBeVisible();
  await expect(viewer).toHaveAccessibleName('face-2.jpg');
  // the arrow keys go too
  await page.keyboard.press('ArrowRight');
  await expect(viewer.getByText('3 of 3')).toBeVisible();
  await page.keyboard.press('ArrowLeft');
  await expect(viewer.getByText('2 of 3')).toBeVisible();

  const image = viewer.getByRole('img', { name: 'face-2.jpg' });
  await expect.poll(() => image.evaluate((i: HTMLImageElement) => i.naturalWidth)).toBe(1600);
  // a double tap zooms in, another goes back to fit
  const frame = image.locator('..');
  const centre = { x: box.x + box.width / 2, y: cy };
  await pointer(stage, [centre, centre], 8);
  await pointer(stage, [centre, centre], 9);
  await expect(frame).toHaveAttribute('style', /scale\(2\.5\)/);
  await pointer(stage, [centre, centre], 10);
  await pointer(stage, [centre, centre], 11);
  await expect(frame).toHaveAttribute('style', /scale\(1\)/);

  // The scale: the two ends of the tape (20 % and 70 % of the width, half-way down), 1 m apart.
  await viewer.getByRole('button', { name: 'Mark a scale' }).click();
  const img = (await image.boundingBox())!;
  const at = (fx: number, fy: number) => ({ x: img.x + fx * img.width, y: img.y + fy * img.height });
  await pointer(stage, [at(0.2, 0.5), at(0.2, 0.5)], 12);
  await expect(viewer.getByText('Now tap the other end.')).toBeVisible();
  await pointer(stage, [at(0.7, 0.5), at(0.7, 0.5)], 13);
  await viewer.getByLabel('Distance between the two points (m)').fill('1');
  const patched = page.waitForResponse((r) => r.request().method() === 'PATCH' && r.ok());
  await viewer.getByRole('button', { name: 'Save the scale' }).click();
  const saved = (await (await patched).json()) as Body;
  expect(saved.scale.distanceM).toBe(1);
  expect(saved.scale.a.x).toBeCloseTo(0.2, 2);
  expect(saved.scale.b.x).toBeCloseTo(0.7, 2);
  expect(saved.scale.a.y).toBeCloseTo(0.5, 2);
  // 1 m over half the width: the photo is 2 m wide; the bar is 0.5 m, a quarter of the photo's width.
  const bar = viewer.getByRole('img', { name: 'Scale bar 0.5 m' });
  await expect(bar).toBeVisible();
  await expect(bar.getByText('0.5 m')).toBeVisible();
  const barBox = (await bar.boundingBox())!;
  expect(barBox.width).toBeGreaterThan(0.24 * img.width);
  expect(barBox.width).toBeLessThan(0.26 * img.width);
  await page.screenshot({ path: `${shots}photos-viewer-scale.png` });

  await page.keyboard.press('Escape');
  await expect(viewer).toBeHidden();

  // Pin the first photo on the sketch: the Sketch section opens and waits for a tap on the face.
  await section.getByRole('button', { name: 'Pin on the sketch' }).first().click();
  const sketch = page.getByRole('region', { name: 'Sketch', exact: true });
  await expect(sketch.getByTestId('sketch-pinning')).toContainText(
    'Tap the face where “1 · face-1.jpg” was taken.',
  );
  const canvas = sketch.getByTestId('sketch-canvas');
  await expect(canvas.locator('canvas').first()).toBeVisible();
  const cbox = (await canvas.boundingBox())!;
  const pinned = page.waitForResponse((r) => r.request().method() === 'PATCH' && r.ok());
  await pointer(
    canvas.locator('canvas').last(),
    [
      { x: cbox.x + cbox.width * 0.4, y: cbox.y + cbox.height * 0.5 },
      { x: cbox.x + cbox.width * 0.4, y: cbox.y + cbox.height * 0.5 },
    ],
    14,
  );
  const pin = (await (await pinned).json()) as Body;
  expect(pin.originalName).toBe('face-1.jpg');
  // the tap was left of the centre line (x < 0, metres on the face) and above the invert
  expect(pin.pinX).toBeLessThan(0);
  expect(pin.pinY).toBeGreaterThan(0);
  await expect(sketch.getByTestId('sketch-pinning')).toHaveCount(0);
  await expect(sketch.getByTestId(`sketch-pin-${pin.id}`)).toHaveText('1 · face-1.jpg');
  await expect(section.getByText('Pinned on the sketch · 1')).toBeVisible();
  await page.screenshot({ path: `${shots}photos-pinned-on-sketch.png`, fullPage: true });
  // a reload finds the pin on the photo and on the sketch
  await page.reload();
  await expect(
    page.getByRole('region', { name: 'Photos', exact: true }).getByText('Pinned on the sketch · 1'),
  ).toBeVisible();
  await expect(
    page.getByRole('region', { name: 'Sketch', exact: true }).getByTestId(`sketch-pin-${pin.id}`),
  ).toHaveText('1 · face-1.jpg');
  expect(problems).toEqual([]);
});
