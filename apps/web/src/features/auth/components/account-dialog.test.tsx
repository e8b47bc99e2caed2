import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { readSession, saveSession } from '@/lib/session';
import { adminSession, adminUser, harrowdale, localConfig, loginAnswer, mailbox } from '@/testing/fixtures';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

afterEach(restoreFetch);

const shellRoutes = {
  'GET /api/auth/me': adminUser,
  'GET /api/config': localConfig,
  'GET /api/local/access': { localMode: true, operator: true },
  'GET /api/local/jobs': { counts: { pending: 0, running: 0, done: 0, dead: 0 }, jobs: [] },
  'GET /api/local/mail': mailbox,
  'GET /api/projects': [harrowdale],
  // The account dialog shows the current project's notice settings (issue 11 item 4).
  'GET /api/projects/p-1/notice-settings': {
    projectId: 'p-1',
    submitted: true,
    ruleOverdue: true,
    returned: true,
    confirmedOtherClass: true,
    red: true,
    redLockedReason: 'Red notices cannot be switched off.',
    updatedAt: null,
  },
};

async function openAccount() {
  const user = userEvent.setup();
  // The page first, so nothing mounts behind the open dialog.
  await screen.findByRole('heading', { level: 1, name: 'Local mail' });
  await user.click(screen.getByRole('button', { name: 'Account' }));
  const dialog = await screen.findByRole('dialog', { name: 'Your account' }, { timeout: 5000 });
  return { user, dialog };
}

describe('Account dialog (issue 18 item 6: sessions can be ended)', () => {
  it('changes the password with the current one asked again and keeps the new token for this device', async () => {
    saveSession(adminSession);
    let sent: unknown = null;
    const api = mockApi({
      ...shellRoutes,
      'POST /api/auth/password': async (request) => {
        sent = await request.json();
        return jsonResponse({ ...loginAnswer, accessToken: 'token-after-change' });
      },
    });
    renderApp('/mail');
    const { user, dialog } = await openAccount();
    expect(within(dialog).getByText(adminUser.email)).toBeInTheDocument();

    const form = within(dialog).getByRole('form', { name: 'Change password' });
    await user.type(within(form).getByLabelText(/Current password/), 'rb-demo-2026');
    await user.type(within(form).getByLabelText(/New password \(at least/), 'a-longer-secret');
    await user.type(within(form).getByLabelText(/New password again/), 'a-longer-secret');
    await user.click(within(form).getByRole('button', { name: 'Change password' }));

    expect(await within(dialog).findByText('Password changed')).toBeInTheDocument();
    expect(sent).toEqual({ currentPassword: 'rb-demo-2026', newPassword: 'a-longer-secret' });
    expect(readSession()?.accessToken).toBe('token-after-change');
    expect(requestedRoutes(api)).toContain('POST /api/auth/password');
  });

  it('says what is wrong before sending: too short, not repeated the same', async () => {
    saveSession(adminSession);
    const api = mockApi(shellRoutes);
    renderApp('/mail');
    const { user, dialog } = await openAccount();
    const form = within(dialog).getByRole('form', { name: 'Change password' });
    await user.type(within(form).getByLabelText(/Current password/), 'rb-demo-2026');
    await user.type(within(form).getByLabelText(/New password \(at least/), 'short');
    await user.type(within(form).getByLabelText(/New password again/), 'shorter');
    await user.click(within(form).getByRole('button', { name: 'Change password' }));

    expect(await within(form).findByText('Choose a password of at least 10 characters.')).toBeInTheDocument();
    expect(within(form).getByText('The two new passwords are not the same.')).toBeInTheDocument();
    expect(requestedRoutes(api)).not.toContain('POST /api/auth/password');
    expect(readSession()?.accessToken).toBe(adminSession.accessToken);
  });

  it('shows the API refusing a wrong current password beside the field, and keeps the session', async () => {
    saveSession(adminSession);
    mockApi({
      ...shellRoutes,
      'POST /api/auth/password': () =>
        jsonResponse(
          {
            code: 'VALIDATION_FAILED',
            message: 'Your current password is not right.',
            fields: { currentPassword: 'Your current password is not right.' },
          },
          400,
        ),
    });
    renderApp('/mail');
    const { user, dialog } = await openAccount();
    const form = within(dialog).getByRole('form', { name: 'Change password' });
    await user.type(within(form).getByLabelText(/Current password/), 'not-the-password');
    await user.type(within(form).getByLabelText(/New password \(at least/), 'a-longer-secret');
    await user.type(within(form).getByLabelText(/New password again/), 'a-longer-secret');
    await user.click(within(form).getByRole('button', { name: 'Change password' }));

    // Beside the field (its message) and in the form's summary.
    expect(await within(form).findAllByText('Your current password is not right.')).toHaveLength(2);
    expect(within(form).getByLabelText(/Current password/)).toHaveAttribute('aria-invalid', 'true');
    expect(within(form).queryByText('Password changed')).not.toBeInTheDocument();
    expect(readSession()?.accessToken).toBe(adminSession.accessToken);
  });

  it('signs out on every device only after a second tap, then goes to sign-in with no token kept', async () => {
    saveSession(adminSession);
    const api = mockApi({
      ...shellRoutes,
      'POST /api/auth/sign-out-everywhere': () => new Response(null, { status: 204 }),
    });
    const { location } = renderApp('/mail');
    const { user, dialog } = await openAccount();

    await user.click(within(dialog).getByRole('button', { name: 'Sign out on every device…' }));
    expect(requestedRoutes(api)).not.toContain('POST /api/auth/sign-out-everywhere');
    await user.click(within(dialog).getByRole('button', { name: 'Keep me signed in' }));
    expect(requestedRoutes(api)).not.toContain('POST /api/auth/sign-out-everywhere');

    await user.click(within(dialog).getByRole('button', { name: 'Sign out on every device…' }));
    await user.click(within(dialog).getByRole('button', { name: 'Yes, sign out everywhere now' }));
    await waitFor(() => expect(location()).toBe('/sign-in'));
    expect(readSession()).toBeNull();
    expect(requestedRoutes(api).filter((r) => r === 'POST /api/auth/sign-out-everywhere')).toHaveLength(1);
  });
});
