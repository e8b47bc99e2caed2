import { mkdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import { signInAs } from './flows';

// The heading's Long section tab on the demo heading HR-U (issue 16): opens it, reads the fault's crown
// label, zooms closer, saves the plot as SVG, taps a round to open it, and takes screenshots in the light
// and the high-contrast theme.

const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

test('the Long section tab of HR-U draws the rounds along chainage and the fault ahead, in both themes', async ({
  page,
}) => {
  test.setTimeout(90_000);
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page: ${error.message}`));
  page.on('response', (response) => {
    if (response.status() >= 500) problems.push(`${response.status()} ${response.url()}`);
  });

  await signInAs(page, 'engineer@roundbook.test');
  await page
    .getByTestId('heading-card')
    .filter({ hasText: 'HR-U' })
    .getByRole('heading', { level: 3 })
    .getByRole('link')
    .click();
  await page.getByRole('tab', { name: 'Long section' }).click();
  await expect(page.getByRole('tab', { name: 'Long section' })).toHaveAttribute('aria-selected', 'true');

  const plot = page.getByRole('img', { name: /^Long section from chainage/ });
  await expect(plot).toBeVisible();
  // The demo's fault zone is mapped on HR-U: its trace reaches the crown somewhere, labelled in words.
  await expect(plot.getByText(/crown/).first()).toBeVisible();
  await page.screenshot({ path: `${shots}long-section-hr-u-light.png`, fullPage: true });

  const before = await plot.getAttribute('aria-label');
  await page.getByRole('button', { name: 'Closer' }).click();
  await expect(plot).not.toHaveAttribute('aria-label', before ?? '');

  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Save SVG' }).click();
  const file = await (await download).path();
  const svg = readFileSync(file, 'utf8');
  expect(svg).toContain('<svg');
  expect(svg).toContain('</svg>');

  await page.getByRole('switch', { name: 'High contrast' }).click();
  await expect(page.locator('[data-theme-mode="high-contrast"]')).toBeVisible();
  await page.getByRole('button', { name: 'Whole heading' }).click();
  await page.screenshot({ path: `${shots}long-section-hr-u-high-contrast.png`, fullPage: true });
  await page.getByRole('switch', { name: 'High contrast' }).click();

  expect(problems).toEqual([]);
});
