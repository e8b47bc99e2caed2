import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Handover } from '@/features/handovers/api/handovers';
import { ReceivedList } from '@/features/handovers/components/received-list';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);

const CAUTION =
  'This handover supports the face-to-face briefing at shift change and does not replace it. The competent person on site decides whether the ground is safe to enter; nobody enters unsupported ground.';

/** An invented handover as the API sends it. */
const handover = (over: Partial<Handover> = {}): Handover => ({
  id: 'h-1',
  projectId: 'p-1',
  projectName: 'Invented headrace',
  timeZone: 'UTC',
  shiftDate: '2026-12-03',
  shift: 'night',
  status: 'sent',
  outgoing: { userId: 'u-out', name: 'Invented Outgoing', email: 'out@roundbook.test' },
  incoming: { userId: 'u-in', name: 'Invented Incoming', email: 'in@roundbook.test' },
  headings: [
    {
      headingId: 'hd-1',
      code: 'TH',
      name: 'Invented heading',
      chainageStyle: 'km+m',
      chainageDecimals: 1,
      faceChainage: 1006,
      stage: 'full-face',
      lastRoundNumber: 2,
      lastConfirmed: {
        roundId: 'r-1',
        roundNumber: 1,
        stage: 'full-face',
        faceChainage: 1003,
        classId: 'c-1',
        classCode: 'C1',
        className: 'Spot bolts',
        nextRoundLength: 3,
        confirmedAt: '2026-12-03T10:00:00.000Z',
      },
      triggerLevel: 'amber',
      alerts: [
        { level: 'amber', summary: 'Q below 20', action: 'Tell the engineer.', ownerRole: 'engineer' },
      ],
      hazards: [],
      supportOutstanding: [],
      cycleStage: 'mucking',
      notes: 'Scaling done at the crown.',
    },
  ],
  generalNotes: '',
  recipients: ['in@roundbook.test'],
  emailStatus: 'sent',
  pdfReady: true,
  sentAt: '2026-12-03T17:55:00.000Z',
  ackDueAt: '2026-12-03T18:55:00.000Z',
  overdue: false,
  overdueNotified: false,
  acknowledgedAt: null,
  acknowledgedBy: null,
  acknowledgeComment: null,
  caution: CAUTION,
  ...over,
});

describe('ReceivedList', () => {
  it('shows the handover from the data and acknowledges it with the comment typed', async () => {
    let acknowledged = false;
    const bodies: unknown[] = [];
    mockApi({
      'GET /api/handovers/received': () =>
        jsonResponse([
          acknowledged
            ? handover({
                status: 'acknowledged',
                acknowledgedAt: '2026-12-03T18:02:00.000Z',
                acknowledgeComment: 'Is the probe rig back?',
              })
            : handover(),
        ]),
      'POST /api/projects/p-1/handovers/h-1/acknowledge': async (request) => {
        bodies.push(await request.json());
        acknowledged = true;
        return jsonResponse(handover({ status: 'acknowledged' }));
      },
    });
    renderWithProviders(<ReceivedList />);
    const item = await screen.findByTestId('received-item');
    expect(screen.getByTestId('handover-caution')).toHaveTextContent(CAUTION);
    expect(item).toHaveTextContent('Waiting for you');
    expect(item).toHaveTextContent('TH · Night shift 3 Dec 2026');
    expect(item).toHaveTextContent('Face 1+006.0, Full face');
    expect(item).toHaveTextContent('Last confirmed: round 1 at 1+003.0, class C1, next round 3 m');
    expect(item).toHaveTextContent('Cycle: Mucking out');
    expect(item).toHaveTextContent('Amber: Q below 20 — Tell the engineer.');

    const user = userEvent.setup();
    await user.type(
      within(item).getByRole('textbox', { name: /Comment or question back/ }),
      'Is the probe rig back?',
    );
    await user.click(within(item).getByRole('button', { name: 'Acknowledge' }));
    await waitFor(() =>
      expect(screen.getByTestId('received-item')).toHaveTextContent('Acknowledged 3 Dec 2026, 18:02'),
    );
    expect(screen.getByTestId('received-item')).toHaveTextContent('“Is the probe rig back?”');
    expect(bodies).toEqual([{ comment: 'Is the probe rig back?' }]);
    expect(screen.queryByRole('button', { name: 'Acknowledge' })).not.toBeInTheDocument();
  });
});
