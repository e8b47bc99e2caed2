import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Page } from '@playwright/test';

// Drives the built app served by the API (started by the root `npm test` / `npm start`).
// Logins are rate-limited per minute, so this file signs in once per role and once with a wrong password.

const password = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';
const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

const roles = [
  { role: 'admin', nav: ['Board', 'Setup', 'Local mail'] },
  { role: 'geologist', nav: ['Board', 'Setup'] },
  { role: 'engineer', nav: ['Board', 'To confirm', 'Setup'] },
  { role: 'supervisor', nav: ['Board', 'Received', 'Setup'] },
  { role: 'viewer', nav: ['Board', 'Setup'] },
] as const;

const sampleMail = [
  {
    id: 'sample-1',
    from: 'roundbook@roundbook.test',
    to: ['night-shift@roundbook.test'],
    subject: 'Handover HR-D, day shift',
    date: '2026-12-01T06:00:00Z',
    text: 'Face at 2+456.0. Support installed to the face.',
    html: null,
    attachments: [],
  },
  {
    id: 'sample-2',
    from: 'roundbook@roundbook.test',
    to: ['shift-engineer@roundbook.test'],
    subject: 'Round 7 on HR-U waiting for review',
    date: '2026-12-01T09:30:00Z',
    text: 'Round 7 at 2+453.5 was submitted and waits for your review.',
    html: '<h1 style="font-family:sans-serif">Round 7</h1><p>Waiting for <b>review</b>.</p>',
    attachments: [{ index: 0, filename: 'rounds.csv', contentType: 'text/csv', size: 2048 }],
  },
];

interface ProjectSummary {
  name: string;
  headings: { code: string; name: string }[];
}

/** Collects console errors and failed same-origin requests, so a test can assert there were none. */
function watchForProblems(page: Page): string[] {
  const problems: string[] = [];
  page.on('console', (message) => {
    // The e-mail HTML frame has an empty sandbox; Chromium reports the scripts it refuses to run there
    // (including the test driver's own). That refusal is the point of the sandbox, not a fault.
    const sandboxRefusal = /^Blocked script execution in 'about:srcdoc'/.test(message.text());
    if (message.type() === 'error' && !sandboxRefusal) problems.push(`console: ${message.text()}`);
  });
  page.on('pageerror', (error) => problems.push(`page: ${error.message}`));
  page.on('response', (response) => {
    if (response.status() >= 500) problems.push(`${response.status()} ${response.url()}`);
  });
  return problems;
}

async function signIn(page: Page, email: string, secret: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(secret);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** What the API says this person should see on the Board, asked with the token the page holds. */
async function projectsFromApi(page: Page): Promise<ProjectSummary[]> {
  return page.evaluate(async () => {
    const session = JSON.parse(window.localStorage.getItem('roundbook.session') ?? '{}') as {
      accessToken?: string;
    };
    const response = await fetch('/api/projects', {
      headers: { Authorization: `Bearer ${session.accessToken}` },
    });
    return (await response.json()) as ProjectSummary[];
  });
}

test('a wrong password is refused with a clear message', async ({ page }) => {
  await signIn(page, 'geologist@roundbook.test', `${password}-not-it`);
  await expect(page.getByRole('alert')).toContainText('E-mail or password not recognised');
  await expect(page).toHaveURL(/\/sign-in$/);
  await page.screenshot({ path: `${shots}sign-in-wrong-password.png` });
});

test('an invalid token sends the person to sign-in, keeping the page to return to', async ({ page }) => {
  await page.goto('/sign-in');
  await page.evaluate(() => {
    window.localStorage.setItem(
      'roundbook.session',
      JSON.stringify({
        accessToken: 'not-a-valid-token',
        expiresAt: '2099-01-01T00:00:00.000Z',
        user: { id: 'x', email: 'x@roundbook.test', name: 'Nobody' },
      }),
    );
  });
  await page.goto('/mail');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fmail&reason=expired$/);
  await expect(page.getByText('Signed out for safety')).toBeVisible();
});

for (const { role, nav } of roles) {
  test(`${role}: signs in and sees the Board`, async ({ page }) => {
    const problems = watchForProblems(page);
    await signIn(page, `${role}@roundbook.test`, password);
    await expect(page).toHaveURL(/\/$/);

    const projects = await projectsFromApi(page);
    expect(projects.length).toBeGreaterThanOrEqual(1);
    const headingCount = projects.reduce((sum, p) => sum + p.headings.length, 0);
    expect(headingCount).toBeGreaterThanOrEqual(2);

    for (const project of projects) {
      // Exact names: the admin may also have projects made by new-project.spec.ts.
      const board = page.getByRole('region', { name: project.name, exact: true });
      await expect(board.getByRole('heading', { level: 1, name: project.name, exact: true })).toBeVisible();
      for (const heading of project.headings) {
        // Heading codes are unique in a project; names need not be.
        const card = board
          .getByRole('article', { name: heading.name })
          .filter({ has: page.getByText(heading.code, { exact: true }) });
        await expect(card).toBeVisible();
        await expect(card).toContainText('Face chainage');
      }
    }
    await expect(page.getByTestId('heading-card')).toHaveCount(headingCount);
    await expect(page.getByTestId('caution-note')).toContainText('Nobody goes under unsupported ground');

    const links = page.getByRole('navigation', { name: 'Main' }).getByRole('link');
    await expect(links).toHaveText([...nav]);

    // Gloved hands: every control in the header and navigation is at least 44 px high.
    for (const control of await page.locator('header button, nav[aria-label="Main"] a').all()) {
      const box = await control.boundingBox();
      expect(box?.height ?? 0).toBeGreaterThanOrEqual(44);
    }
    expect(await page.evaluate(() => document.fonts.check('16px "Open Sans"'))).toBe(true);

    await page.screenshot({ path: `${shots}board-${role}.png` });

    if (role === 'admin') {
      await links.filter({ hasText: 'Local mail' }).click();
      await expect(page).toHaveURL(/\/mail$/);
      await expect(page.getByRole('heading', { level: 1, name: 'Local mail' })).toBeVisible();
      await page.screenshot({ path: `${shots}mail-admin.png` });

      // The demo inbox may be empty, so also check how messages render, with invented ones
      // answered by the browser in place of the API (nothing is sent to the SMTP fake).
      await page.route('**/api/local/mail', (route) => route.fulfill({ json: sampleMail }));
      await page.route('**/api/local/mail/sample-2/attachments/0', (route) =>
        route.fulfill({ body: 'chainage,class\n2+453.5,B2\n', contentType: 'text/csv' }),
      );
      await page.getByRole('button', { name: 'Check for new' }).click();
      const received = page.getByRole('navigation', { name: 'Received e-mails' }).getByRole('button');
      await expect(received).toHaveCount(2);
      await expect(received.first()).toContainText('Round 7 on HR-U waiting for review');
      const detail = page.getByTestId('mail-detail');
      await expect(detail).toContainText('shift-engineer@roundbook.test');
      await expect(detail.locator('iframe[sandbox=""]')).toHaveCount(1);
      const downloading = page.waitForEvent('download');
      await detail.getByRole('button', { name: /rounds\.csv/ }).click();
      expect((await downloading).suggestedFilename()).toBe('rounds.csv');
      await page.screenshot({ path: `${shots}mail-admin-sample.png` });
      await page.unrouteAll();
    }

    if (role === 'geologist') {
      // The last handover's state by mark and words (issue 15 item 6). The demo has no handover yet, so the
      // browser answers /api/projects with the API's own body plus an overdue and an acknowledged one.
      const hour = 3_600_000;
      const at = (h: number) => new Date(Date.now() + h * hour).toISOString();
      await page.route('**/api/projects', async (route) => {
        const response = await route.fetch();
        const body = (await response.json()) as { headings: Record<string, unknown>[] }[];
        const [first, second] = body[0].headings;
        first.lastHandover = { sentAt: at(-3), acknowledgedAt: null, ackDueAt: at(-2), overdue: true };
        if (second)
          second.lastHandover = {
            sentAt: at(-15),
            acknowledgedAt: at(-14.5),
            ackDueAt: at(-14),
            overdue: false,
          };
        await route.fulfill({ response, json: body });
      });
      await page.reload();
      const states = page.getByTestId('handover-state');
      await expect(states.first()).toHaveAttribute('data-state', 'overdue');
      await expect(states.first()).toContainText('Overdue: not acknowledged, was due by');
      await expect(states.nth(1)).toHaveAttribute('data-state', 'acknowledged');
      const toHandovers = page.getByRole('link', { name: /^sent / });
      await expect(toHandovers).toHaveCount(2);
      for (const link of await toHandovers.all()) {
        await expect(link).toHaveAttribute('href', /\/headings\/[^/?]+\?view=handovers$/);
        expect((await link.boundingBox())?.height ?? 0).toBeGreaterThanOrEqual(44);
      }
      await page.screenshot({ path: `${shots}board-geologist-handovers.png`, fullPage: true });

      await page.getByRole('switch', { name: 'High contrast' }).click();
      await expect(page.locator('[data-theme-mode="high-contrast"]')).toBeVisible();
      await page.screenshot({ path: `${shots}board-geologist-high-contrast.png`, fullPage: true });
      await page.reload();
      await expect(page.getByRole('switch', { name: 'High contrast' })).toBeChecked();
      await page.unrouteAll();
    }

    if (role === 'viewer') {
      await page.getByRole('button', { name: 'Sign out' }).click();
      await expect(page).toHaveURL(/\/sign-in$/);
      await page.goto('/');
      await expect(page).toHaveURL(/\/sign-in$/);
      await expect(page.getByRole('button', { name: 'Sign in' })).toBeVisible();
    }

    expect(problems).toEqual([]);
  });
}
