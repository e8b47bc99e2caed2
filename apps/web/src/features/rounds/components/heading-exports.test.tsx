import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { HeadingExports, exportPath } from '@/features/rounds/components/heading-exports';
import { renderWithProviders } from '@/features/rounds/testing/round-fixtures';
import { jsonResponse, mockApi, requestedRoutes, restoreFetch } from '@/testing/mock-api';

const created: Blob[] = [];
beforeEach(() => {
  created.length = 0;
  // jsdom has no object URLs: record what would have been saved.
  URL.createObjectURL = jest.fn((b: Blob) => {
    created.push(b);
    return 'blob:test';
  });
  URL.revokeObjectURL = jest.fn();
});
afterEach(restoreFetch);

const heading = { id: 'h-1', code: 'HR-U' };

describe('HeadingExports', () => {
  it('downloads the rounds and the joints of the heading as CSV files named after it', async () => {
    const clicked: string[] = [];
    jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push(this.download);
    });
    const csv = (name: string) => () =>
      new Response(`\ufeff${name}\r\n`, { headers: { 'Content-Type': 'text/csv; charset=utf-8' } });
    const mock = mockApi({
      [`GET ${exportPath('p-1', 'h-1', 'rounds')}`]: csv('stage,round number'),
      [`GET ${exportPath('p-1', 'h-1', 'joints')}`]: csv('stage,joint number'),
    });
    const user = userEvent.setup();
    renderWithProviders(<HeadingExports projectId="p-1" heading={heading} />);
    await user.click(screen.getByRole('button', { name: 'Rounds as CSV' }));
    await waitFor(() => expect(clicked).toEqual(['HR-U-rounds.csv']));
    await user.click(screen.getByRole('button', { name: 'Joints as CSV' }));
    await waitFor(() => expect(clicked).toEqual(['HR-U-rounds.csv', 'HR-U-joints.csv']));
    expect(requestedRoutes(mock)).toEqual([
      'GET /api/projects/p-1/headings/h-1/exports/rounds.csv',
      'GET /api/projects/p-1/headings/h-1/exports/joints.csv',
    ]);
    expect(await created[1].text()).toContain('joint number');
  });

  it('says why when the file cannot be made, and nothing is saved', async () => {
    mockApi({
      [`GET ${exportPath('p-1', 'h-1', 'rounds')}`]: () =>
        jsonResponse(
          { code: 'DATABASE_UNAVAILABLE', message: 'The database is not answering. Try again.' },
          503,
        ),
    });
    const user = userEvent.setup();
    renderWithProviders(<HeadingExports projectId="p-1" heading={heading} />);
    await user.click(screen.getByRole('button', { name: 'Rounds as CSV' }));
    expect(await screen.findByTestId('export-error')).toHaveTextContent(
      'The file could not be made. The database is not answering. Try again.',
    );
    expect(created).toEqual([]);
  });
});
