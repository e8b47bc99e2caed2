import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';

// A signed-in admin starts a project from the Board, is told when the code is taken, and lands on
// the new project's Setup as its admin. The code is unique per run, so the file runs again on the same
// database. One sign-in (logins are rate-limited).

const password = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';
const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

test('an admin creates a project and continues in its Setup', async ({ page }) => {
  test.setTimeout(60_000);
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page: ${error.message}`));
  page.on('response', (response) => {
    if (response.status() >= 500) problems.push(`${response.status()} ${response.url()}`);
  });
  const stamp = Date.now();
  const code = `NP-${stamp}`;
  const name = `Trial adit ${stamp}`;

  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('admin@roundbook.test');
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/$/);

  await page.getByRole('button', { name: 'New project' }).click();
  await expect(page).toHaveURL(/\/projects\/new$/);
  await expect(page.getByRole('heading', { level: 1, name: 'New project' })).toBeVisible();
  const form = page.getByRole('form', { name: 'New project' });

  // The form's own checks first; nothing is sent.
  await form.getByRole('button', { name: 'Create project' }).click();
  await expect(form.getByText('Give the project a short code, e.g. BRH.')).toBeVisible();
  await expect(form.getByText('Give the project a name.')).toBeVisible();

  // A code already in use is refused by the server, and the message lands on the code field.
  await form.getByLabel('Project code').fill('BRH');
  await form.getByLabel('Project name').fill(name);
  await form.getByLabel('Client').fill('Invented Works Ltd');
  await form.getByLabel('Time zone').selectOption('Europe/Oslo');
  await form.getByLabel('Orientation notation for entry').selectOption('strike/dip-rhr');
  await form.getByLabel('Weathering and strength grades').selectOption('iso-14689');
  await form.getByRole('button', { name: 'Create project' }).click();
  await expect(form.getByText('This code is already used.')).toBeVisible();
  await expect(form.getByLabel('Project code')).toHaveAttribute('aria-invalid', 'true');
  await page.screenshot({ path: `${shots}new-project.png`, fullPage: true });

  await form.getByLabel('Project code').fill(code);
  await form.getByRole('button', { name: 'Create project' }).click();

  // Setup of the new project, which is now the current one.
  await expect(page).toHaveURL(/\/setup\/headings$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Setup' })).toBeVisible();
  await expect(page.getByText(`${name} · what every round is judged against`)).toBeVisible();
  await expect(page.getByTestId('project-created')).toContainText(`${name} is ready`);
  await expect(page.getByRole('combobox', { name: 'Project' })).toHaveValue(/.+/);
  await expect(page.getByRole('combobox', { name: 'Project' }).locator('option:checked')).toHaveText(name);
  await expect(page.getByText('Project admin').first()).toBeVisible();
  await expect(page.getByRole('button', { name: 'Add heading' })).toBeVisible();
  await page.screenshot({ path: `${shots}new-project-setup.png`, fullPage: true });

  // The settings were kept as chosen.
  await page.getByRole('tab', { name: 'Project' }).click();
  const settings = page.getByRole('form', { name: 'Project settings' });
  await expect(settings.getByLabel('Time zone')).toHaveValue('Europe/Oslo');
  await expect(settings.getByLabel('Orientation notation for entry')).toHaveValue('strike/dip-rhr');
  await expect(settings.getByLabel('Weathering and strength grades')).toHaveValue('iso-14689');

  // The Board lists it, with no headings yet.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Board' }).click();
  const board = page.getByRole('region', { name, exact: true });
  await expect(board).toContainText(`${code} · for Invented Works Ltd · times in Europe/Oslo`);
  await expect(board).toContainText('No headings in this project yet');

  expect(problems).toEqual([]);
});
