import { screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import type { RoundPage, RoundSummary } from '@/features/rounds/api/types';
import { RoundsTable } from '@/features/rounds/components/rounds-table';
import { heading, renderWithProviders } from '@/features/rounds/testing/round-fixtures';
import { mockApi, restoreFetch } from '@/testing/mock-api';

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
});
