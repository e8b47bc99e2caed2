import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { saveSession } from '@/lib/session';
import { adminSession, adminUser, localConfig, mailbox, viewerUser } from '@/testing/fixtures';
import { mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

describe('Local mail', () => {
  it('lists received e-mails newest first and shows the newest one', async () => {
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
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

  it('is closed to people who are admin nowhere, without asking for the mail', async () => {
    const api = mockApi({ 'GET /api/auth/me': viewerUser, 'GET /api/config': localConfig });
    renderApp('/mail');
    expect(await screen.findByRole('region', { name: 'For project admins' })).toBeInTheDocument();
    expect(requestedRoutes(api)).not.toContain('GET /api/local/mail');
  });

  it('says local mail is off when Roundbook is not in local mode', async () => {
    mockApi({ 'GET /api/auth/me': adminUser, 'GET /api/config': { ...localConfig, localMode: false } });
    renderApp('/mail');
    expect(await screen.findByRole('region', { name: 'Local mail is off' })).toBeInTheDocument();
  });
});
