import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { clearSession, readSession, saveSession } from '@/lib/session';
import { adminSession, adminUser, harrowdale, localConfig } from '@/testing/fixtures';
import { apiError, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

// Invented test data.
const TOKEN = 'tok-abc123';
const info = {
  projectName: 'Harrowdale Headrace',
  email: 'new.geologist@roundbook.test',
  name: 'Nell Ashgrove',
  role: 'geologist',
  expiresAt: '2099-01-01T00:00:00.000Z',
};
const newSession = {
  accessToken: 'token-new',
  expiresAt: '2099-01-01T00:00:00.000Z',
  user: { id: 'u-new', email: info.email, name: 'Nell Ashgrove' },
};
/** What the Board needs once the person has joined. */
const board = (me: typeof adminUser) => ({
  'GET /api/config': localConfig,
  'GET /api/auth/me': me,
  'GET /api/projects': [harrowdale],
  [`GET /api/projects/${harrowdale.id}`]: harrowdale,
});

afterEach(() => {
  restoreFetch();
  clearSession();
});

describe('Invitation page', () => {
  it('shows the invited address and the name the admin typed, and creates the account without a session', async () => {
    const api = mockApi({
      [`GET /api/invitations/${TOKEN}`]: info,
      [`POST /api/invitations/${TOKEN}/accept`]: { projectId: 'p-1', newAccount: true, session: newSession },
      ...board({ ...adminUser, id: 'u-new', email: info.email }),
    });
    const { location } = renderApp(`/invitation/${TOKEN}`);
    expect(await screen.findByText(info.email)).toBeInTheDocument();
    expect(screen.getByLabelText(/Your name/)).toHaveValue('Nell Ashgrove');
    expect(screen.getByRole('link', { name: 'Sign in with it' })).toHaveAttribute(
      'href',
      `/sign-in?next=${encodeURIComponent(`/invitation/${TOKEN}`)}`,
    );
    const user = userEvent.setup();
    await user.type(screen.getByLabelText(/Choose a password/), 'a-long-enough-pw');
    await user.type(screen.getByLabelText(/Type it again/), 'a-long-enough-pw');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    await waitFor(() => expect(location()).toBe('/'));
    const accept = api.mock.calls.map(([r]) => r as Request).find((r) => r.url.endsWith('/accept'))!;
    expect(accept.headers.get('Authorization')).toBeNull();
    expect(await accept.json()).toEqual({ name: 'Nell Ashgrove', password: 'a-long-enough-pw' });
    expect(readSession()?.user.email).toBe(info.email);
  });

  it('shows the server’s answer when the address already has an account (sign in first)', async () => {
    mockApi({
      [`GET /api/invitations/${TOKEN}`]: info,
      [`POST /api/invitations/${TOKEN}/accept`]: apiError(
        409,
        'CONFLICT',
        `${info.email} already has a Roundbook account. Sign in with it, then open this link again to join.`,
      ),
    });
    renderApp(`/invitation/${TOKEN}`);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText(/Choose a password/), 'a-long-enough-pw');
    await user.type(screen.getByLabelText(/Type it again/), 'a-long-enough-pw');
    await user.click(screen.getByRole('button', { name: 'Create account and join' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('already has a Roundbook account');
  });

  it('signed in as someone else: says whom the invitation is for and offers to sign out, no form', async () => {
    saveSession(adminSession);
    const api = mockApi({ [`GET /api/invitations/${TOKEN}`]: info });
    renderApp(`/invitation/${TOKEN}`);
    expect(await screen.findByText('This invitation is for another address')).toBeInTheDocument();
    expect(screen.getByText(/You are signed in as admin@roundbook.test/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Create account and join' })).not.toBeInTheDocument();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Sign out' }));
    expect(readSession()).toBeNull();
    expect(await screen.findByRole('button', { name: 'Create account and join' })).toBeInTheDocument();
    expect(requestedRoutes(api)).not.toContain(`POST /api/invitations/${TOKEN}/accept`);
  });

  it('signed in as the invited address: joins with one button, sending the session', async () => {
    saveSession({ ...adminSession, user: { ...adminSession.user, email: info.email } });
    const api = mockApi({
      [`GET /api/invitations/${TOKEN}`]: info,
      [`POST /api/invitations/${TOKEN}/accept`]: { projectId: 'p-1', newAccount: false },
      ...board({ ...adminUser, email: info.email }),
    });
    const { location } = renderApp(`/invitation/${TOKEN}`);
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Join the project' }));
    await waitFor(() => expect(location()).toBe('/'));
    const accept = api.mock.calls.map(([r]) => r as Request).find((r) => r.url.endsWith('/accept'))!;
    expect(accept.headers.get('Authorization')).toBe('Bearer token-admin');
    expect(readSession()?.accessToken).toBe('token-admin');
  });
});
