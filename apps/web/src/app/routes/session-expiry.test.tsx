import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { readSession, saveSession } from '@/lib/session';
import { adminSession, adminUser, harrowdale, localConfig, loginAnswer, mailbox } from '@/testing/fixtures';
import { apiError, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);

describe('Signed-out and expired sessions', () => {
  it('sends someone without a session to sign-in, keeping the page to return to', async () => {
    const api = mockApi({});
    const { location } = renderApp('/mail');
    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
    expect(location()).toBe('/sign-in?next=%2Fmail');
    expect(api).not.toHaveBeenCalledWith(
      expect.objectContaining({ url: expect.stringContaining('/api/local/mail') }),
    );
  });

  it('treats a stored token past its expiry time as no session', async () => {
    saveSession({ ...adminSession, expiresAt: '2020-01-01T00:00:00.000Z' });
    mockApi({});
    const { location } = renderApp('/');
    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
    expect(location()).toBe('/sign-in?reason=expired');
    expect(readSession()).toBeNull();
  });

  it('on a 401 while loading a page: drops the token, explains, and returns there after signing in', async () => {
    saveSession(adminSession);
    let tokenValid = false;
    mockApi({
      'GET /api/auth/me': (request) =>
        tokenValid || request.headers.get('Authorization') === 'Bearer fresh'
          ? new Response(JSON.stringify(adminUser), { headers: { 'Content-Type': 'application/json' } })
          : apiError(401, 'UNAUTHORIZED', 'Token expired')(request),
      'GET /api/config': localConfig,
      'GET /api/local/access': { localMode: true, operator: true },
      'GET /api/local/jobs': { counts: { pending: 0, running: 0, done: 0, dead: 0 }, jobs: [] },
      'GET /api/local/mail': mailbox,
      'GET /api/projects': [harrowdale],
      'POST /api/auth/login': { ...loginAnswer, accessToken: 'fresh' },
    });
    const { location } = renderApp('/mail');

    expect(await screen.findByText('Signed out for safety')).toBeInTheDocument();
    expect(location()).toBe('/sign-in?next=%2Fmail&reason=expired');
    expect(readSession()).toBeNull();

    tokenValid = true;
    const user = userEvent.setup();
    await user.type(screen.getByLabelText(/E-mail/), 'admin@roundbook.test');
    await user.type(screen.getByLabelText(/Password/), 'rb-demo-2026');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Local mail' })).toBeInTheDocument();
    expect(location()).toBe('/mail');
  });

  it('on a 401 after the page has loaded (a refresh): goes to sign-in with the page kept', async () => {
    saveSession(adminSession);
    let expired = false;
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/local/access': { localMode: true, operator: true },
      'GET /api/local/jobs': { counts: { pending: 0, running: 0, done: 0, dead: 0 }, jobs: [] },
      'GET /api/local/mail': (request) =>
        expired
          ? apiError(401, 'UNAUTHORIZED')(request)
          : new Response(JSON.stringify(mailbox), { headers: { 'Content-Type': 'application/json' } }),
    });
    const { location } = renderApp('/mail');
    const refresh = await screen.findByRole('button', { name: 'Check for new' });

    expired = true;
    await userEvent.setup().click(refresh);
    await waitFor(() => expect(location()).toBe('/sign-in?next=%2Fmail&reason=expired'));
    expect(await screen.findByText('Signed out for safety')).toBeInTheDocument();
    expect(readSession()).toBeNull();
  });

  it('signs out: token gone, back at sign-in', async () => {
    saveSession(adminSession);
    mockApi({
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/projects': [harrowdale],
    });
    const { location } = renderApp('/');
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Sign out' }));
    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
    expect(location()).toBe('/sign-in');
    expect(readSession()).toBeNull();
  });
});
