import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { readSession } from '@/lib/session';
import { adminUser, harrowdale, localConfig, loginAnswer, mailbox } from '@/testing/fixtures';
import { apiError, jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);

async function fillAndSubmit(email: string, password: string) {
  const user = userEvent.setup();
  const emailInput = await screen.findByLabelText(/E-mail/);
  if (email !== '') await user.type(emailInput, email);
  if (password !== '') await user.type(screen.getByLabelText(/Password/), password);
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
  return user;
}

describe('Sign-in page', () => {
  it('explains what is missing before anything is sent', async () => {
    const api = mockApi({});
    renderApp('/sign-in');
    await fillAndSubmit('', '');
    expect(await screen.findByText('Type the e-mail address you sign in with.')).toBeInTheDocument();
    expect(screen.getByText('Type your password.')).toBeInTheDocument();
    expect(requestedRoutes(api)).not.toContain('POST /api/auth/login');
  });

  it('rejects something that is not an e-mail address', async () => {
    mockApi({});
    renderApp('/sign-in');
    await fillAndSubmit('ada.quarrington', 'secret');
    expect(
      await screen.findByText('That does not look like an e-mail address (name@company.com).'),
    ).toBeInTheDocument();
  });

  it('shows the wrong-credentials answer from the API and stays on the page', async () => {
    mockApi({ 'POST /api/auth/login': apiError(401, 'INVALID_CREDENTIALS', 'Invalid e-mail or password') });
    const { location } = renderApp('/sign-in');
    await fillAndSubmit('admin@roundbook.test', 'wrong-one');
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('E-mail or password not recognised');
    expect(location()).toBe('/sign-in');
    expect(readSession()).toBeNull();
  });

  it('says when there were too many attempts', async () => {
    mockApi({ 'POST /api/auth/login': apiError(429, 'TOO_MANY_REQUESTS') });
    renderApp('/sign-in');
    await fillAndSubmit('admin@roundbook.test', 'again');
    expect(await screen.findByRole('alert')).toHaveTextContent('Too many attempts');
  });

  it('says when the server cannot be reached', async () => {
    mockApi({
      'POST /api/auth/login': () => Promise.reject(new TypeError('Failed to fetch')),
    });
    renderApp('/sign-in');
    await fillAndSubmit('admin@roundbook.test', 'rb-demo-2026');
    expect(await screen.findByRole('alert')).toHaveTextContent('Roundbook server not reachable');
  });

  it('puts field messages from the API under their fields', async () => {
    mockApi({
      'POST /api/auth/login': () =>
        jsonResponse(
          {
            code: 'VALIDATION_FAILED',
            message: 'Invalid',
            fields: { email: 'This address is not allowed here.' },
          },
          400,
        ),
    });
    renderApp('/sign-in');
    await fillAndSubmit('admin@roundbook.test', 'rb-demo-2026');
    expect(await screen.findByText('This address is not allowed here.')).toBeInTheDocument();
  });

  it('signs in, keeps the session and goes on to the page in ?next=', async () => {
    const api = mockApi({
      'POST /api/auth/login': (request) =>
        request.json().then((body: unknown) => {
          expect(body).toEqual({ email: 'admin@roundbook.test', password: 'rb-demo-2026' });
          return jsonResponse(loginAnswer);
        }),
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/local/access': { localMode: true, operator: true },
      'GET /api/local/jobs': { counts: { pending: 0, running: 0, done: 0, dead: 0 }, jobs: [] },
      'GET /api/local/mail': mailbox,
      'GET /api/projects': [harrowdale],
    });
    const { location } = renderApp('/sign-in?next=%2Fmail');
    await fillAndSubmit('admin@roundbook.test', 'rb-demo-2026');

    expect(await screen.findByRole('heading', { level: 1, name: 'Local mail' })).toBeInTheDocument();
    expect(location()).toBe('/mail');
    expect(readSession()?.accessToken).toBe('token-admin');
    const me = api.mock.calls.map(([r]) => r as Request).find((r) => r.url.endsWith('/api/auth/me'));
    expect(me?.headers.get('Authorization')).toBe('Bearer token-admin');
  });

  it('ignores a ?next= that leads off Roundbook', async () => {
    mockApi({
      'POST /api/auth/login': loginAnswer,
      'GET /api/auth/me': adminUser,
      'GET /api/config': localConfig,
      'GET /api/projects': [harrowdale],
    });
    const { location } = renderApp('/sign-in?next=%2F%2Fevil.example%2Fx');
    await fillAndSubmit('admin@roundbook.test', 'rb-demo-2026');
    await waitFor(() => expect(location()).toBe('/'));
    expect(await screen.findByRole('heading', { level: 1, name: 'Harrowdale Headrace' })).toBeInTheDocument();
  });
});
