import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { HeadingHandovers } from './heading-handovers';
import type { Handover } from '@/features/handovers/api/handovers';
import { acknowledged, CAUTION, draft, handover } from '@/features/handovers/testing/handover-fixtures';
import { saveSession } from '@/lib/session';
import { adminSession, harrowdale } from '@/testing/fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

const HISTORY = '/api/projects/p-1/headings/h-1/handovers';
// The history's handover: sent on the night of the 2nd, not acknowledged within the hour.
const late = (over: Partial<Handover> = {}): Handover =>
  handover({
    shiftDate: '2026-12-02',
    sentAt: '2026-12-02T18:00:00.000Z',
    ackDueAt: '2026-12-02T19:00:00.000Z',
    overdue: true,
    overdueNotified: true,
    ...over,
  });

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

describe('HeadingHandovers', () => {
  it('lists the history with overdue and acknowledged states, and filters by date and shift', async () => {
    mockApi({
      [`GET ${HISTORY}`]: [
        late({ emailStatus: 'failed' }),
        acknowledged({
          id: 'ho-0',
          shiftDate: '2026-12-01',
          shift: 'day',
          acknowledgedAt: '2026-12-01T06:20:00.000Z',
          acknowledgeComment: 'Is the probe rig back?',
          pdfReady: false,
          emailStatus: 'queued',
        }),
      ],
    });
    const user = userEvent.setup();
    renderWithProviders(
      <HeadingHandovers
        projectId="p-1"
        heading={harrowdale.headings[0]}
        headings={harrowdale.headings}
        role="viewer"
      />,
    );
    const list = await screen.findByRole('list', { name: 'Handovers of HR-U' });
    const items = within(list).getAllByTestId('handover-history-item');
    expect(items).toHaveLength(2);
    expect(within(items[0]).getByText('Overdue — was due by 2 Dec 2026, 19:00')).toBeInTheDocument();
    expect(within(items[0]).getByTestId('handover-email-status')).toHaveTextContent(
      'E-mail could not be sent',
    );
    expect(within(items[0]).getByText(/Invented Outgoing → Invented Incoming/)).toBeInTheDocument();
    expect(within(items[0]).getByRole('button', { name: 'Open PDF' })).toBeEnabled();
    expect(
      within(items[1]).getByText('Acknowledged 1 Dec 2026, 06:20 by Invented Incoming'),
    ).toBeInTheDocument();
    expect(within(items[1]).getByText('Comment back: “Is the probe rig back?”')).toBeInTheDocument();
    expect(within(items[1]).getByText(/E-mail waiting to be sent/)).toBeInTheDocument();
    expect(within(items[1]).getByRole('button', { name: 'PDF being made' })).toBeDisabled();
    // Viewers do not compose.
    expect(screen.queryByRole('button', { name: 'Compose handover' })).not.toBeInTheDocument();

    await user.selectOptions(screen.getByRole('combobox', { name: 'Shift' }), 'day');
    expect(within(list).getAllByTestId('handover-history-item')).toHaveLength(1);
    expect(screen.getByText(/^Acknowledged 1 Dec 2026, 06:20/)).toBeInTheDocument();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Shift' }), 'night');
    expect(within(list).getAllByTestId('handover-history-item')).toHaveLength(1);
    expect(screen.getByText(/^Overdue — was due by/)).toBeInTheDocument();
    await user.type(screen.getByLabelText('Shift date'), '2026-12-01');
    expect(await screen.findByText('No handover for this date and shift')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Clear filter' }));
    expect(
      within(screen.getByRole('list', { name: 'Handovers of HR-U' })).getAllByTestId('handover-history-item'),
    ).toHaveLength(2);
  });

  it('composes from the draft (figures, hazards, alerts), asks for the cycle, sends and shows it sent', async () => {
    const bodies: unknown[] = [];
    let sent = false;
    mockApi({
      [`GET ${HISTORY}`]: () => jsonResponse(sent ? [late({ overdue: false, overdueNotified: false })] : []),
      'GET /api/projects/p-1/handovers/draft': (req) => {
        expect(new URL(req.url).searchParams.get('headingIds')).toBe('h-1');
        return jsonResponse(draft());
      },
      'POST /api/projects/p-1/handovers': async (req) => {
        bodies.push(await req.json());
        sent = true;
        return jsonResponse(late({ overdue: false }), 201);
      },
    });
    const user = userEvent.setup();
    renderWithProviders(
      <HeadingHandovers
        projectId="p-1"
        heading={harrowdale.headings[0]}
        headings={harrowdale.headings}
        role="supervisor"
      />,
    );
    expect(await screen.findByText('No handovers yet')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Compose handover' }));
    const form = await screen.findByLabelText('Compose a handover');
    const section = await within(form).findByRole('region', { name: 'HR-U — Upstream drive from Adit 2' });
    expect(within(section).getByText('Face 1+006.0, Full face')).toBeInTheDocument();
    expect(
      within(section).getByText(/Last confirmed: round 1 at 1\+003.0, class C1, next round 3 m/),
    ).toBeInTheDocument();
    expect(within(section).getByTestId('handover-hazard')).toHaveTextContent(
      'RedWedge, 1+004.0 – 1+006.0 — Invented wedge in the right shoulder',
    );
    expect(within(section).getByTestId('handover-support-outstanding')).toHaveTextContent(
      'Round 7 (full face, class C2): Rock bolts — planned 3 m bolts; nothing recorded',
    );
    expect(within(section).getByTestId('handover-alert')).toHaveTextContent(
      'AmberQ below 20 — Tell the engineer. (owner: Engineer)',
    );
    expect(within(form).getByText(CAUTION)).toBeInTheDocument();
    // Prefilled: the shift now and the only other supervisor.
    expect(within(form).getByLabelText(/^Shift date/)).toHaveValue('2026-12-03');
    expect(within(form).getByRole('combobox', { name: /Incoming supervisor/ })).toHaveValue('u-in');

    await user.click(within(form).getByRole('button', { name: 'Send handover' }));
    expect(await within(form).findByText('Say where the cycle stands.')).toBeInTheDocument();
    expect(bodies).toHaveLength(0);

    await user.selectOptions(within(section).getByRole('combobox', { name: /Cycle at HR-U/ }), 'mucking');
    await user.type(within(section).getByRole('textbox', { name: 'Notes for HR-U' }), 'Scaling done.');
    await user.type(
      within(form).getByRole('textbox', { name: 'General notes' }),
      'Loader 2 in the workshop.',
    );
    await user.type(within(form).getByRole('textbox', { name: /Extra recipients/ }), 'Site@Roundbook.test');
    await user.click(within(form).getByRole('button', { name: 'Send handover' }));

    expect(await screen.findByText('Handover sent')).toBeInTheDocument();
    expect(bodies).toEqual([
      {
        shiftDate: '2026-12-03',
        shift: 'day',
        incomingUserId: 'u-in',
        headings: [{ headingId: 'h-1', cycleStage: 'mucking', notes: 'Scaling done.' }],
        generalNotes: 'Loader 2 in the workshop.',
        extraRecipients: ['site@roundbook.test'],
      },
    ]);
    await waitFor(() => expect(screen.getAllByTestId('handover-history-item')).toHaveLength(1));
    expect(screen.getByText('Waiting — due by 2 Dec 2026, 19:00')).toBeInTheDocument();
  });
});

/**
 * The tallest minimum height (or height) the page's style rules give an element, in px. jsdom lays nothing
 * out and does not order Griffel's style buckets as a browser does (a reset rule can outrank a class that
 * the browser lets win), so this reads the rules that match rather than the computed style; handover.spec.ts
 * measures the real boxes in Chromium.
 */
function styledMinHeight(el: Element): number {
  let px = 0;
  for (const sheet of Array.from(document.styleSheets))
    for (const rule of Array.from(sheet.cssRules)) {
      // Pseudo-elements (placeholders, scrollbars) are not the element.
      if (!(rule instanceof CSSStyleRule) || rule.selectorText.includes('::')) continue;
      if (!el.matches(rule.selectorText)) continue;
      for (const prop of ['min-height', 'height'])
        px = Math.max(px, parseFloat(rule.style.getPropertyValue(prop)) || 0);
    }
  return px;
}

describe('HeadingHandovers composer, gloved hands', () => {
  it('gives every control of the composer a target of at least 44 px', async () => {
    mockApi({
      [`GET ${HISTORY}`]: [],
      'GET /api/projects/p-1/handovers/draft': draft(),
    });
    const user = userEvent.setup();
    renderWithProviders(
      <HeadingHandovers
        projectId="p-1"
        heading={harrowdale.headings[0]}
        headings={harrowdale.headings}
        role="supervisor"
      />,
    );
    await user.click(await screen.findByRole('button', { name: 'Compose handover' }));
    const form = await screen.findByLabelText('Compose a handover');
    await within(form).findByRole('combobox', { name: /Incoming supervisor/ });
    const selects = within(form).getAllByRole('combobox');
    // Shift, incoming supervisor and the cycle of the one heading.
    expect(selects).toHaveLength(3);
    const wrapped = [...form.querySelectorAll('input')];
    // A <select> or <textarea> is the target itself; an <input> fills Fluent's root wrapper.
    const boxes = [
      ...[...selects, ...form.querySelectorAll('textarea')].map((el) => ({ el, box: el })),
      ...wrapped.map((el) => ({ el, box: el.parentElement! })),
      ...within(form)
        .getAllByRole('button')
        .map((el) => ({ el, box: el })),
    ];
    expect(boxes.length).toBeGreaterThanOrEqual(10);
    const small = boxes
      .filter(({ box }) => styledMinHeight(box) < 44)
      .map(({ el }) => (el as HTMLInputElement).labels?.[0]?.textContent ?? el.textContent);
    expect(small).toEqual([]);
  });
});
