import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import type { RoundPage, RoundSummary } from '@/features/rounds/api/types';
import { RoundsTable } from '@/features/rounds/components/rounds-table';
import { heading, renderWithProviders } from '@/features/rounds/testing/round-fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';

afterEach(restoreFetch);

const summary = (n: number, extra: Partial<RoundSummary>): RoundSummary => ({
  id: `r-${n}`,
  stage: 'full-face',
  roundNumber: n,
  faceChainage: 1000 + n * 3,
  shiftDate: '2026-12-01',
  shift: 'day',
  mapperName: 'Gale Tremlow',
  q: 2.5,
  rmr: 55,
  recommendedClassCode: 'B',
  confirmedClassCode: null,
  triggersNotEvaluated: 0,
  status: 'submitted',
  triggerLevel: null,
  ...extra,
});

describe('RoundsTable', () => {
  it('has a Trigger column with each round’s level as a word, and "no rules" when there is none', async () => {
    const page: RoundPage = {
      items: [
        summary(3, { triggerLevel: 'red' }),
        summary(2, { triggerLevel: 'amber' }),
        summary(1, { triggerLevel: 'green' }),
        summary(0, { triggerLevel: null }),
      ],
      total: 4,
      page: 1,
      pageSize: 25,
    };
    mockApi({ 'GET /api/projects/p-1/headings/h-1/rounds': page });
    renderWithProviders(
      <MemoryRouter>
        <RoundsTable projectId="p-1" heading={heading} />
      </MemoryRouter>,
    );
    const table = screen.getByRole('table', { name: 'Rounds of HR-U' });
    expect(within(table).getByRole('columnheader', { name: 'Trigger' })).toBeInTheDocument();
    const rows = await within(table).findAllByTestId('round-row');
    expect(rows).toHaveLength(4);
    const cells = within(table).getAllByTestId('round-trigger');
    expect(cells.map((c) => c.textContent)).toEqual(['Red', 'Amber', 'Green', 'no rules']);
    expect(within(cells[0]).getByText('Red')).toHaveAttribute('data-level', 'red');
    expect(within(cells[3]).getByText('no rules')).toHaveAttribute('data-level', 'none');
  });

  it('shows the class the engineer confirmed beside the recommended one, marked when it differs', async () => {
    const page: RoundPage = {
      items: [
        summary(3, { status: 'confirmed', recommendedClassCode: 'B', confirmedClassCode: 'C' }),
        summary(2, { status: 'confirmed', recommendedClassCode: 'B', confirmedClassCode: 'B' }),
        summary(1, { status: 'submitted', recommendedClassCode: 'B', confirmedClassCode: null }),
      ],
      total: 3,
      page: 1,
      pageSize: 25,
    };
    mockApi({ 'GET /api/projects/p-1/headings/h-1/rounds': page });
    renderWithProviders(
      <MemoryRouter>
        <RoundsTable projectId="p-1" heading={heading} />
      </MemoryRouter>,
    );
    const table = screen.getByRole('table', { name: 'Rounds of HR-U' });
    const rows = await within(table).findAllByTestId('round-row');
    expect(within(table).getByRole('columnheader', { name: 'Class confirmed' })).toBeInTheDocument();
    expect(rows[0]).toHaveTextContent('C (changed)');
    expect(rows[1]).not.toHaveTextContent('changed');
    expect(rows[2]).toHaveTextContent('not yet');
  });

  it('reads its filters from the address and refuses a chainage it cannot read, with the reason (issue 19 item 9)', async () => {
    const queries: string[] = [];
    mockApi({
      'GET /api/projects/p-1/headings/h-1/rounds': (request: Request) => {
        queries.push(new URL(request.url).search);
        return jsonResponse({ items: [summary(1, {})], total: 1, page: 1, pageSize: 25 });
      },
    });
    renderWithProviders(
      <MemoryRouter initialEntries={['/?status=submitted&from=1%2B000&sort=q']}>
        <RoundsTable projectId="p-1" heading={heading} />
      </MemoryRouter>,
    );
    await screen.findAllByTestId('round-row');
    // The address's filters reach the server's query (a reload keeps them).
    const first = new URLSearchParams(queries[0]);
    expect(first.get('status')).toBe('submitted');
    expect(first.get('fromChainage')).toBe('1000');
    expect(first.get('sort')).toBe('q');
    expect(screen.getByLabelText('From chainage')).toHaveValue('1+000');

    const user = userEvent.setup();
    const to = screen.getByLabelText('To chainage');
    await user.type(to, 'xyz{Enter}');
    expect(await screen.findByText(/xyz/)).toBeInTheDocument();
    expect(to).toHaveAttribute('aria-invalid', 'true');
    // Nothing was applied: no query with a "to" limit was sent.
    expect(queries.some((q) => new URLSearchParams(q).has('toChainage'))).toBe(false);

    await user.clear(to);
    await user.type(to, '1+050{Enter}');
    await waitFor(() =>
      expect(queries.some((q) => new URLSearchParams(q).get('toChainage') === '1050')).toBe(true),
    );
  });
});
