import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { saveSession } from '@/lib/session';
import { adminSession, adminUser, localConfig, mailbox, viewerUser } from '@/testing/fixtures';
import { mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

const operator = { localMode: true, operator: true };
const noJobs = { counts: { pending: 0, running: 0, done: 12, dead: 0 }, jobs: [] };
const waitingJobs = {
  counts: { pending: 1, running: 0, done: 12, dead: 1 },
  jobs: [
    {
      id: '7b0f4f3e-5d0c-4a9a-9f1e-2b6f0c1d2e3f',
      kind: 'mail.send',
      state: 'dead',
      attempts: 12,
      maxAttempts: 12,
      nextAttemptAt: '2026-12-02T06:00:00.000Z',
      lastError: 'connect ECONNREFUSED 127.0.0.1:2525',
      summary: 'To engineer@roundbook.test: Round 42 submitted on HR-U',
      createdAt: '2026-12-02T05:00:00.000Z',
      updatedAt: '2026-12-02T06:00:00.000Z',
    },
    {
      id: '0c1d2e3f-7b0f-4f3e-9f1e-5d0c4a9a2b6f',
      kind: 'mail.send',
      state: 'pending',
      attempts: 2,
      maxAttempts: 12,
      nextAttemptAt: '2026-12-02T06:05:00.000Z',
      lastError: 'Greeting never received',
      summary: 'To viewer@roundbook.test: You are invited',
      createdAt: '2026-12-02T06:00:00.000Z',
      updatedAt: '2026-12-02T06:01:00.000Z',
    },
  ],
};

describe('Local mail', () => {
  it('lists received e-mails newest first and shows the newest one', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/local/access': operator,
      'GET /api/local/jobs': noJobs,
      'GET /api/local/mail': mailbox,
    });
    renderApp('/mail');

    const list = await screen.findByRole('navigation', { name: 'Received e-mails' });
    const items = within(list).getAllByRole('button');
    expect(items.map((b) => b.textContent)).toEqual([
      expect.stringContaining('Round 42 submitted on HR-U'),
      expect.stringContaining('Handover HR-U, day shift'),
    ]);

    const detail = screen.getByTestId('mail-detail');
    expect(detail).toHaveTextContent('roundbook@roundbook.test');
    expect(detail).toHaveTextContent('engineer@roundbook.test, site-office@roundbook.test');
    expect(detail).toHaveTextContent('Round 42 at 1+253.5 is waiting for your review.');
    const frame = within(detail).getByTitle('Formatted version of “Round 42 submitted on HR-U”');
    expect(frame).toHaveAttribute('sandbox', '');
    expect(within(detail).getByRole('button', { name: 'round-42.pdf (48.2 kB)' })).toBeInTheDocument();

    await userEvent.setup().click(items[1]);
    expect(screen.getByTestId('mail-detail')).toHaveTextContent(
      'Face at 1+250.0. Two rounds waiting for review.',
    );
    expect(screen.queryByTitle(/Formatted version/)).not.toBeInTheDocument();
  });

  it('downloads an attachment with the bearer token', async () => {
    const api = mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/local/access': operator,
      'GET /api/local/jobs': noJobs,
      'GET /api/local/mail': mailbox,
      'GET /api/local/mail/m-new/attachments/0': () =>
        new Response(new Blob(['%PDF-1.7']), { headers: { 'Content-Type': 'application/pdf' } }),
    });
    const createObjectURL = jest.fn(() => 'blob:round-42');
    Object.assign(URL, { createObjectURL, revokeObjectURL: jest.fn() });
    const click = jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    renderApp('/mail');

    await userEvent.setup().click(await screen.findByRole('button', { name: 'round-42.pdf (48.2 kB)' }));
    await waitFor(() => expect(click).toHaveBeenCalled());
    expect(createObjectURL).toHaveBeenCalled();
    const download = api.mock.calls.map(([r]) => r as Request).find((r) => r.url.includes('/attachments/0'));
    expect(download?.headers.get('Authorization')).toBe('Bearer token-admin');
  });

  it('is closed to people who are not the instance operator, project admins included, without asking for the mail', async () => {
    for (const user of [viewerUser, adminUser]) {
      const api = mockApi({
        'GET /api/auth/me': user,
        'GET /api/config': localConfig,
        'GET /api/local/access': { localMode: true, operator: false },
      });
      const view = renderApp('/mail');
      expect(await screen.findByRole('region', { name: 'For the instance operator' })).toBeInTheDocument();
      expect(requestedRoutes(api)).not.toContain('GET /api/local/mail');
      expect(requestedRoutes(api)).not.toContain('GET /api/local/jobs');
      view.unmount();
      restoreFetch();
    }
  });

  it('shows the operator the jobs that wait or gave up, with their errors, and retries one', async () => {
    const api = mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/local/access': operator,
      'GET /api/local/jobs': waitingJobs,
      'GET /api/local/mail': mailbox,
      'POST /api/local/jobs/7b0f4f3e-5d0c-4a9a-9f1e-2b6f0c1d2e3f/retry': {
        ...waitingJobs.jobs[0],
        state: 'pending',
        attempts: 0,
      },
    });
    renderApp('/mail');
    const table = await screen.findByRole('table', { name: 'Jobs not done' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows[0]).toHaveTextContent('To engineer@roundbook.test: Round 42 submitted on HR-U');
    expect(rows[0]).toHaveTextContent('Gave up');
    expect(rows[0]).toHaveTextContent('12 of 12');
    expect(rows[0]).toHaveTextContent('connect ECONNREFUSED 127.0.0.1:2525');
    expect(rows[1]).toHaveTextContent('Waiting');
    expect(rows[1]).toHaveTextContent('2026-12-02 06:05:00 UTC');
    expect(screen.getByLabelText('Jobs by state')).toHaveTextContent('1 waiting');
    expect(screen.getByLabelText('Jobs by state')).toHaveTextContent('1 gave up');

    await userEvent.setup().click(
      screen.getByRole('button', {
        name: 'Retry To engineer@roundbook.test: Round 42 submitted on HR-U now',
      }),
    );
    await waitFor(() =>
      expect(requestedRoutes(api)).toContain(
        'POST /api/local/jobs/7b0f4f3e-5d0c-4a9a-9f1e-2b6f0c1d2e3f/retry',
      ),
    );
    // The list is read again after the retry.
    await waitFor(() =>
      expect(requestedRoutes(api).filter((r) => r === 'GET /api/local/jobs').length).toBeGreaterThanOrEqual(
        2,
      ),
    );
  });

  it('says local mail is off when Roundbook is not in local mode', async () => {
    mockApi({ 'GET /api/auth/me': adminUser, 'GET /api/config': { ...localConfig, localMode: false } });
    renderApp('/mail');
    expect(await screen.findByRole('region', { name: 'Local mail is off' })).toBeInTheDocument();
  });
});
