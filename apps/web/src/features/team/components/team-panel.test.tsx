import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { Suspense } from 'react';
import type { Team } from '@/api/contract';
import { TeamPanel } from '@/features/team/components/team-panel';
import { saveSession } from '@/lib/session';
import { findDialog } from '@/testing/dialogs';
import { adminSession } from '@/testing/fixtures';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

// An invented team: no members shown, one open invitation.
const team = {
  members: [],
  invitations: [
    {
      id: 'i-1',
      email: 'ada@example.test',
      name: 'Ada Quarrell',
      role: 'viewer',
      emailStatus: 'sent',
      expiresAt: '2026-12-10T12:00:00.000Z',
      invitedBy: 'Test admin',
      emailSent: true,
    },
  ],
} as unknown as Team;

const WITHDRAW = 'DELETE /api/projects/p-1/invitations/i-1';

describe('TeamPanel: withdrawing an invitation (issue 19, item 8)', () => {
  it('asks first; Keep it keeps it, and only the confirmation withdraws it', async () => {
    const api = mockApi({
      'GET /api/projects/p-1/team': team,
      [WITHDRAW]: () => jsonResponse({ ...team, invitations: [] }),
    });
    renderWithProviders(
      <Suspense fallback={<p>Loading</p>}>
        <TeamPanel projectId="p-1" canEdit myUserId="u-admin" timeZone="Europe/Oslo" />
      </Suspense>,
    );
    const user = userEvent.setup();
    const withdraw = await screen.findByRole('button', {
      name: 'Withdraw the invitation to ada@example.test',
    });
    await user.click(withdraw);
    let dialog = await findDialog('Withdraw the invitation to ada@example.test?');
    expect(dialog).toHaveTextContent('The link in their e-mail stops working at once.');
    await user.click(within(dialog).getByRole('button', { name: 'Keep it', hidden: true }));
    expect(requestedRoutes(api)).not.toContain(WITHDRAW);

    await user.click(withdraw);
    dialog = await findDialog('Withdraw the invitation to ada@example.test?');
    await user.click(within(dialog).getByRole('button', { name: 'Withdraw the invitation', hidden: true }));
    await waitFor(() => expect(requestedRoutes(api)).toContain(WITHDRAW));
  });
});
