import { execFileSync } from 'node:child_process';
import { mkdirSync, statSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect, test } from '@playwright/test';
import type { Browser, Locator, Page } from '@playwright/test';

// Shift change on the demo project, as the people would do it: the day supervisor composes a handover of
// HR-U and sends it; the operator's local mail view shows the e-mail; the night supervisor, signed out,
// opens the e-mail's link, signs in, lands on Received with that handover outlined and focused, and
// acknowledges it with a question back; the day supervisor then reads it acknowledged in HR-U's history.
// Twice: on a 10-inch tablet (1280 × 800, touch) in the light theme, and on a desktop in high contrast.
// Screenshots of the composer, the mail view, Received and the history, in each.

const password = process.env.ROUNDBOOK_DEMO_PASSWORD ?? 'rb-demo-2026';
const baseURL = process.env.ROUNDBOOK_URL ?? 'http://127.0.0.1:8080';
const shots = fileURLToPath(new URL('./screenshots/', import.meta.url));
mkdirSync(shots, { recursive: true });

const OUTGOING = 'supervisor@roundbook.test';
const INCOMING = 'night-supervisor@roundbook.test';
const INCOMING_NAME = 'Marra Quillan';
/** Gloved hands: the smallest control we accept on these screens. */
const TARGET_PX = 44;

type Body = Record<string, any>;

const variants = [
  { name: 'tablet', viewport: { width: 1280, height: 800 }, hasTouch: true, theme: 'light' },
  { name: 'desktop', viewport: { width: 1600, height: 1000 }, hasTouch: false, theme: 'high-contrast' },
] as const;

/** A fresh browser context (its own storage, so its own session) with the variant's window and theme. */
async function openPage(browser: Browser, v: (typeof variants)[number], problems: string[]): Promise<Page> {
  const context = await browser.newContext({
    baseURL,
    viewport: v.viewport,
    hasTouch: v.hasTouch,
    serviceWorkers: 'block',
  });
  // Runs in every frame; the mail view's sandboxed e-mail frame has no storage, and needs none.
  await context.addInitScript((theme) => {
    try {
      window.localStorage.setItem('roundbook.theme', theme);
    } catch {
      /* a sandboxed frame */
    }
  }, v.theme);
  const page = await context.newPage();
  page.on('pageerror', (error) => problems.push(`page: ${error.message}`));
  page.on('response', (r) => {
    if (r.status() >= 500) problems.push(`${r.status()} ${r.url()}`);
  });
  return page;
}

async function fillSignIn(page: Page, email: string): Promise<void> {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await fillSignIn(page, email);
  await expect(page).toHaveURL(/\/$/);
}

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `${shots}${name}.png`, fullPage: true });
}

/** Every button and text field inside `scope` is at least TARGET_PX high (and buttons as wide). */
async function expectTouchTargets(scope: Locator): Promise<void> {
  for (const b of await scope.getByRole('button').all()) {
    if (!(await b.isVisible())) continue;
    const box = (await b.boundingBox())!;
    expect(Math.min(box.width, box.height), `button ${await b.textContent()}`).toBeGreaterThanOrEqual(
      TARGET_PX,
    );
  }
  // A Fluent field's whole frame takes the tap (the inner element may be smaller).
  for (const f of await scope.locator('.fui-Input, .fui-Select, .fui-Textarea').all()) {
    if (!(await f.isVisible())) continue;
    expect((await f.boundingBox())!.height, 'a field').toBeGreaterThanOrEqual(TARGET_PX - 4);
  }
}

async function openHeadingHandovers(page: Page): Promise<void> {
  await page
    .getByTestId('heading-card')
    .filter({ hasText: 'HR-U' })
    .getByRole('heading', { level: 3 })
    .getByRole('link')
    .click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/headings\/[^/]+$/);
  await page.getByRole('tab', { name: 'Handovers' }).click();
}

for (const v of variants) {
  test(`${v.name} (${v.theme}): a handover goes from the day supervisor to the night supervisor and back acknowledged`, async ({
    browser,
  }) => {
    test.setTimeout(180_000);
    const problems: string[] = [];
    const note = `Scaling done at the crown (${v.name} walk).`;
    const question = `Is the probe rig back on the face? (${v.name})`;

    // 1. The day supervisor composes the handover of HR-U and sends it.
    const outgoing = await openPage(browser, v, problems);
    await signIn(outgoing, OUTGOING);
    await expect(outgoing.locator(`[data-theme-mode="${v.theme}"]`).first()).toBeAttached();
    await openHeadingHandovers(outgoing);
    await outgoing.getByRole('button', { name: 'Compose handover' }).click();
    const form = outgoing.getByLabel('Compose a handover');
    const section = form.getByRole('region', { name: /^HR-U — / });
    await expect(section).toBeVisible();
    // Prefilled: the only other supervisor of the project is the incoming one.
    const incomingSelect = form.getByRole('combobox', { name: /Incoming supervisor/ });
    await expect(incomingSelect.locator('option:checked')).toHaveText(INCOMING_NAME);
    await expect(form.getByText(/does not replace/).first()).toBeVisible();
    await section.getByRole('combobox', { name: /Cycle at HR-U/ }).selectOption({ label: 'Mucking out' });
    await section.getByRole('textbox', { name: 'Notes for HR-U' }).fill(note);
    await form.getByRole('textbox', { name: 'General notes' }).fill('Loader 2 is in the workshop.');
    await expectTouchTargets(form);
    await shot(outgoing, `handover-composer-${v.name}`);
    const posted = outgoing.waitForResponse(
      (r) => r.request().method() === 'POST' && /\/api\/projects\/[^/]+\/handovers$/.test(r.url()),
    );
    await form.getByRole('button', { name: 'Send handover' }).click();
    const sent = (await (await posted).json()) as Body;
    expect(sent.incoming.name).toBe(INCOMING_NAME);
    await expect(outgoing.getByText('Handover sent', { exact: true })).toBeVisible();
    const history = outgoing.getByRole('list', { name: 'Handovers of HR-U' });
    await expect(history.getByTestId('handover-history-item').first()).toContainText('Waiting — due by');

    // 2. The operator's local mail view: the handover e-mail arrives once its PDF is made.
    const operator = await openPage(browser, v, problems);
    await signIn(operator, 'admin@roundbook.test');
    await operator
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Local mail' })
      .click();
    await expect(operator.getByRole('heading', { level: 1, name: 'Local mail' })).toBeVisible();
    const link = `/received?handover=${sent.id as string}`;
    let index = -1;
    let message: Body | undefined;
    await expect(async () => {
      await operator.getByRole('button', { name: /Check for new|Checking/ }).click();
      const mail = await operator.evaluate(async () => {
        const session = JSON.parse(window.localStorage.getItem('roundbook.session') ?? '{}') as {
          accessToken?: string;
        };
        const r = await fetch('/api/local/mail', {
          headers: { Authorization: `Bearer ${session.accessToken}` },
        });
        return (await r.json()) as Body[];
      });
      index = mail.findIndex(
        (m) => String(m.text ?? '').includes(link) && !/^Not acknowledged/.test(m.subject),
      );
      expect(index).toBeGreaterThanOrEqual(0);
      message = mail[index];
    }).toPass({ timeout: 60_000, intervals: [1_000, 2_000, 3_000] });
    expect(message!.to).toContain(INCOMING);
    const pdf = (message!.attachments as Body[]).find((a) => a.contentType === 'application/pdf');
    expect(pdf).toBeDefined();
    // The PDF's first page rendered to PNG (pdftoppm, poppler-utils), as the incoming supervisor sees it.
    const bytes = await operator.evaluate(
      async ({ id, index }) => {
        const session = JSON.parse(window.localStorage.getItem('roundbook.session') ?? '{}') as {
          accessToken?: string;
        };
        const r = await fetch(`/api/local/mail/${id}/attachments/${index}`, {
          headers: { Authorization: `Bearer ${session.accessToken}` },
        });
        return [...new Uint8Array(await r.arrayBuffer())];
      },
      { id: message!.id as string, index: pdf!.index as number },
    );
    expect(Buffer.from(bytes).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const pdfFile = `${shots}handover-pdf-${v.name}.pdf`;
    writeFileSync(pdfFile, Buffer.from(bytes));
    execFileSync('pdftoppm', [
      '-png',
      '-r',
      '60',
      '-f',
      '1',
      '-l',
      '1',
      '-singlefile',
      pdfFile,
      `${shots}handover-pdf-page1-${v.name}`,
    ]);
    expect(statSync(`${shots}handover-pdf-page1-${v.name}.png`).size).toBeGreaterThan(10_000);
    const inbox = operator.getByRole('navigation', { name: 'Received e-mails' }).getByRole('button');
    await expect(inbox.nth(index)).toContainText(message!.subject as string);
    await inbox.nth(index).click();
    const detail = operator.getByTestId('mail-detail');
    await expect(detail).toContainText(message!.subject as string);
    await expect(detail).toContainText(link);
    await shot(operator, `handover-mail-${v.name}`);

    // 3. The night supervisor, signed out, opens the e-mail's link: sign-in first, then back to it.
    const url = new URL(/https?:\/\/\S+\/received\?handover=[\w-]+/.exec(message!.text as string)![0]);
    expect(`${url.pathname}${url.search}`).toBe(link);
    const incoming = await openPage(browser, v, problems);
    await incoming.goto(link);
    await expect(incoming).toHaveURL(
      `${baseURL}/sign-in?next=${encodeURIComponent(link).replace(/%20/g, '+')}`,
    );
    await fillSignIn(incoming, INCOMING);
    await expect(incoming).toHaveURL(`${baseURL}${link}`);
    const item = incoming.locator('[data-testid="received-item"][data-highlighted="true"]');
    await expect(item).toHaveCount(1);
    await expect(item).toBeFocused();
    await expect(item).toBeInViewport();
    await expect(item).toContainText('Opened from your e-mail link');
    await expect(item).toContainText(note);
    await expect(item.getByRole('region', { name: /^Open hazards at HR-U/ })).toBeVisible();
    await expect(item.getByRole('region', { name: /^Support outstanding at HR-U/ })).toBeVisible();
    await expect(item.getByRole('region', { name: /^Trigger alerts at HR-U/ })).toBeVisible();
    await expect(incoming.getByTestId('handover-caution')).toContainText('does not replace');
    await expectTouchTargets(item);
    await shot(incoming, `handover-received-${v.name}`);
    await item.getByRole('textbox', { name: /Comment or question back/ }).fill(question);
    await item.getByRole('button', { name: 'Acknowledge' }).click();
    await expect(item).toContainText(`by ${INCOMING_NAME}`);
    await expect(item).toContainText(`Your comment: “${question}”`);
    await expect(item.getByRole('button', { name: 'Acknowledge' })).toHaveCount(0);

    // 4. The day supervisor reads it acknowledged in HR-U's history.
    await outgoing.reload();
    await outgoing.getByRole('tab', { name: 'Handovers' }).click();
    const first = outgoing
      .getByRole('list', { name: 'Handovers of HR-U' })
      .getByTestId('handover-history-item')
      .first();
    await expect(first).toContainText(`Acknowledged`);
    await expect(first).toContainText(`by ${INCOMING_NAME}`);
    await expect(first).toContainText(`Comment back: “${question}”`);
    await expect(first.getByTestId('handover-email-status')).toHaveText('E-mail sent');
    await expect(first.getByRole('button', { name: 'Open PDF' })).toBeEnabled();
    await shot(outgoing, `handover-history-${v.name}`);

    expect(problems).toEqual([]);
    for (const p of [outgoing, operator, incoming]) await p.context().close();
  });
}
