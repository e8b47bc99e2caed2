import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { CurrentUser } from '@/api/contract';
import type { ReviewQueueItem } from '@/features/review/api/review';
import { saveSession } from '@/lib/session';
import { adminSession, harrowdale, localConfig } from '@/testing/fixtures';
import { mockApi, restoreFetch } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

// Invented people, rounds and rules.
const engineer: CurrentUser = {
  id: 'u-eng',
  email: 'engineer@roundbook.test',
  name: 'Edda Ravenshaw',
  memberships: [{ projectId: 'p-1', projectName: 'Harrowdale Headrace', role: 'engineer' }],
  canCreateProjects: false,
};
const CAUTION =
  'Roundbook computes and records; the responsible engineer decides under the project’s design and local regulations.';

const item = (n: number, extra: Partial<ReviewQueueItem>): ReviewQueueItem => ({
  roundId: `r-${n}`,
  projectId: 'p-1',
  projectCode: 'HHR',
  projectName: 'Harrowdale Headrace',
  headingId: 'h-1',
  headingCode: 'HR-U',
  roundNumber: n,
  faceChainage: 1240 + n,
  chainageText: `1+24${n}.0`,
  stage: 'top-heading',
  geologistName: 'Gus Tarnfield',
  submittedAt: '2026-11-30T08:00:00.000Z',
  minutesWaiting: 200,
  triggerLevel: 'amber',
  rules: [],
  recommendedClassCode: 'B',
  revision: 1,
  ...extra,
});
// The server's order: red first, then the oldest.
const queue = {
  caution: CAUTION,
  items: [
    item(7, {
      triggerLevel: 'red',
      minutesWaiting: 30,
      rules: [
        {
          ruleId: 'q-red',
          level: 'red',
          summary: 'Q < 0.1 → red',
          action: 'Stop and call the engineer.',
          ownerRole: 'engineer',
          timeAllowedHours: 2,
          dueAt: '2026-11-30T12:00:00.000Z',
          minutesLeft: 90,
          overdue: false,
          acknowledgedAt: null,
        },
      ],
    }),
    item(5, {
      rules: [
        {
          ruleId: 'q-amber',
          level: 'amber',
          summary: 'Q < 1 → amber',
          action: 'Tell the engineer.',
          ownerRole: 'engineer',
          timeAllowedHours: 4,
          dueAt: '2026-11-30T10:00:00.000Z',
          minutesLeft: -45,
          overdue: true,
          acknowledgedAt: null,
        },
      ],
    }),
  ],
};

afterEach(restoreFetch);
beforeEach(() => saveSession(adminSession));

describe('To confirm', () => {
  it('lists the queue in the server’s order, with time waiting, each rule’s time left and overdue in words', async () => {
    const api = mockApi({
      'GET /api/auth/me': engineer,
      'GET /api/config': localConfig,
      'GET /api/projects': [{ ...harrowdale, role: 'engineer' }],
      'GET /api/review/queue': queue,
    });
    renderApp('/to-confirm?heading=h-1');
    const list = await screen.findByRole('list', { name: 'Rounds to confirm' });
    const items = within(list).getAllByTestId('queue-item');
    expect(items.map((i) => within(i).getAllByRole('link')[0].textContent)).toEqual([
      'HR-U round 7 · Top heading · 1+247.0',
      'HR-U round 5 · Top heading · 1+245.0',
    ]);
    expect(within(items[0]).getAllByRole('link')[0]).toHaveAttribute('href', '/projects/p-1/rounds/r-7');
    expect(items[0]).toHaveTextContent('Red');
    expect(items[0]).toHaveTextContent('mapped by Gus Tarnfield · waiting 30 min');
    expect(items[0]).toHaveTextContent('1 h 30 min left');
    const late = within(items[1]).getByTestId('rule-clock');
    expect(late).toHaveTextContent('Overdue by 45 min');
    expect(late.querySelector('[data-overdue="true"]')).not.toBeNull();
    expect(screen.getByText('Heading HR-U only.')).toBeInTheDocument();
    expect(screen.getByTestId('review-caution')).toHaveTextContent(CAUTION);
    const asked = api.mock.calls
      .map(([input]) => new URL((input as Request).url))
      .find((u) => u.pathname === '/api/review/queue');
    expect(asked?.searchParams.get('headingId')).toBe('h-1');
  });

  it('says so when nothing waits', async () => {
    mockApi({
      'GET /api/auth/me': engineer,
      'GET /api/config': localConfig,
      'GET /api/projects': [{ ...harrowdale, role: 'engineer' }],
      'GET /api/review/queue': { caution: CAUTION, items: [] },
    });
    renderApp('/to-confirm');
    expect(await screen.findByText('Nothing waiting for you')).toBeInTheDocument();
  });

  it('is reached from the Board’s “waiting for review” count, filtered to that heading', async () => {
    mockApi({
      'GET /api/auth/me': engineer,
      'GET /api/config': localConfig,
      'GET /api/projects': [{ ...harrowdale, role: 'engineer' }],
      'GET /api/review/queue': queue,
    });
    const { location } = renderApp('/');
    const upstream = await screen.findByRole('article', { name: 'Upstream drive from Adit 2' });
    await userEvent.setup().click(within(upstream).getByRole('link', { name: '2 rounds' }));
    await waitFor(() => expect(location()).toBe('/to-confirm?heading=h-1'));
    expect(await screen.findByRole('list', { name: 'Rounds to confirm' })).toBeInTheDocument();
  });
});
