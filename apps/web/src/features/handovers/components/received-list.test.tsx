import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ReceivedList } from '@/features/handovers/components/received-list';
import { acknowledged, CAUTION, handover } from '@/features/handovers/testing/handover-fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

// Only the clock is fixed (the due time reads "18:55" on the same day, with the date on another day).
const onlyDate: Parameters<typeof jest.useFakeTimers>[0] = {
  now: new Date('2026-12-03T19:30:00Z'),
  doNotFake: [
    'setTimeout',
    'clearTimeout',
    'setInterval',
    'clearInterval',
    'setImmediate',
    'clearImmediate',
    'queueMicrotask',
    'nextTick',
    'requestAnimationFrame',
    'cancelAnimationFrame',
    'requestIdleCallback',
    'cancelIdleCallback',
    'hrtime',
    'performance',
  ],
};
beforeEach(() => jest.useFakeTimers(onlyDate));
afterEach(() => {
  jest.useRealTimers();
  restoreFetch();
});

describe('ReceivedList', () => {
  it('shows what the incoming supervisor needs per heading and acknowledges with the comment typed', async () => {
    let done = false;
    const bodies: unknown[] = [];
    mockApi({
      'GET /api/handovers/received': () =>
        jsonResponse([done ? acknowledged({ acknowledgeComment: 'Is the probe rig back?' }) : handover()]),
      'POST /api/projects/p-1/handovers/ho-1/acknowledge': async (request) => {
        bodies.push(await request.json());
        done = true;
        return jsonResponse(acknowledged());
      },
    });
    renderWithProviders(<ReceivedList />);
    const item = await screen.findByTestId('received-item');
    expect(screen.getByTestId('handover-caution')).toHaveTextContent(CAUTION);
    expect(within(item).getByText('Waiting — due by 18:55')).toBeInTheDocument();
    expect(item).toHaveTextContent('HR-U · Night shift 3 Dec 2026');
    const heading = within(item).getByRole('region', { name: 'HR-U — Upstream drive from Adit 2' });
    expect(heading).toHaveTextContent('Face 1+006.0, Full face');
    expect(heading).toHaveTextContent('Cycle: Mucking out');
    expect(heading).toHaveTextContent('Last confirmed: round 1 at 1+003.0, class C1, next round 3 m');
    // Look-ahead: where a mapped fault reaches the crown ahead of the face, and in which coming round.
    expect(within(heading).getByTestId('handover-look-ahead')).toHaveTextContent(
      'Fault 1 (round 2): reaches the crown 1.7 m ahead, in the next round — crown 1+007.7, invert 1+002.3',
    );
    // Hazards: level, kind, chainage range, description.
    const hazard = within(heading).getByTestId('handover-hazard');
    expect(hazard).toHaveTextContent('Red');
    expect(hazard).toHaveTextContent('Wedge, 1+004.0 – 1+006.0 — Invented wedge in the right shoulder');
    expect(within(heading).getByTestId('handover-support-outstanding')).toHaveTextContent(
      'Round 7 (full face, class C2): Rock bolts — planned 3 m bolts; nothing recorded',
    );
    // The alert with who owns it.
    expect(within(heading).getByTestId('handover-alert')).toHaveTextContent(
      'AmberQ below 20 — Tell the engineer. (owner: Engineer)',
    );
    expect(heading).toHaveTextContent('Notes: Scaling done at the crown.');

    const user = userEvent.setup();
    await user.type(
      within(item).getByRole('textbox', { name: /Comment or question back/ }),
      'Is the probe rig back?',
    );
    await user.click(within(item).getByRole('button', { name: 'Acknowledge' }));
    await waitFor(() =>
      expect(screen.getByTestId('received-item')).toHaveTextContent(
        'Acknowledged 3 Dec 2026, 18:02 by Invented Incoming',
      ),
    );
    expect(screen.getByTestId('received-item')).toHaveTextContent('Your comment: “Is the probe rig back?”');
    expect(bodies).toEqual([{ comment: 'Is the probe rig back?' }]);
    expect(screen.queryByRole('button', { name: 'Acknowledge' })).not.toBeInTheDocument();
  });

  it('puts overdue ones first, flagged by mark, colour and words, then waiting, then acknowledged', async () => {
    mockApi({
      // The API's order: waiting (newest first), then acknowledged.
      'GET /api/handovers/received': [
        handover({ id: 'ho-new', ackDueAt: '2026-12-03T20:30:00.000Z' }),
        handover({ id: 'ho-late', overdue: true, ackDueAt: '2026-12-03T14:30:00.000Z' }),
        handover({ id: 'ho-older', overdue: true, ackDueAt: '2026-12-02T07:00:00.000Z' }),
        acknowledged({ id: 'ho-done' }),
      ],
    });
    renderWithProviders(<ReceivedList />);
    await screen.findAllByTestId('received-item');
    const badges = screen.getAllByTestId('received-item').map((li) => li.querySelector('[data-state]')!);
    expect(badges.map((b) => b.getAttribute('data-state'))).toEqual([
      'overdue',
      'overdue',
      'waiting',
      'acknowledged',
    ]);
    expect(badges.map((b) => b.textContent)).toEqual([
      'Overdue — was due by 14:30',
      'Overdue — was due by 2 Dec 2026, 07:00',
      'Waiting — due by 20:30',
      'Acknowledged 3 Dec 2026, 18:02 by Invented Incoming',
    ]);
    // A mark beside the words (an icon), not colour alone.
    for (const b of badges) expect(b.querySelector('svg')).not.toBeNull();
  });

  it('scrolls to, outlines and focuses the handover the link names', async () => {
    const scrolled: Element[] = [];
    const scrollIntoView = jest.fn(function (this: Element) {
      scrolled.push(this);
    });
    Element.prototype.scrollIntoView = scrollIntoView;
    mockApi({
      'GET /api/handovers/received': [handover({ id: 'ho-a' }), handover({ id: 'ho-b', shift: 'day' })],
    });
    renderWithProviders(<ReceivedList highlightId="ho-b" />);
    const items = await screen.findAllByTestId('received-item');
    const target = items[1];
    expect(target).toHaveAttribute('data-highlighted', 'true');
    expect(items[0]).not.toHaveAttribute('data-highlighted');
    expect(within(target).getByText('Opened from your e-mail link')).toBeInTheDocument();
    await waitFor(() => expect(target).toHaveFocus());
    expect(scrolled).toEqual([target]);
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
    // @ts-expect-error jsdom has none; put it back as it was
    delete Element.prototype.scrollIntoView;
  });

  it('says plainly when the link names a handover not among those sent to the caller', async () => {
    mockApi({ 'GET /api/handovers/received': [handover()] });
    renderWithProviders(<ReceivedList highlightId="ho-someone-else" />);
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'The handover in your link is not hereIt is not among the handovers sent to you',
    );
    expect(screen.getByTestId('received-item')).not.toHaveAttribute('data-highlighted');
  });
});
