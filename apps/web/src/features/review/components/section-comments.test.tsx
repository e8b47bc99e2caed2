import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SectionComments } from '@/features/review/components/section-comments';
import { returnedReview, submittedReview } from '@/features/review/testing/review-fixtures';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

afterEach(restoreFetch);

const REVIEW = 'GET /api/projects/p-1/rounds/r-1/review';
const RESOLVE = 'POST /api/projects/p-1/rounds/r-1/review/comments/cm-1/resolve';

/** A returned round with comments on Ground, Ratings and the round as a whole. */
function withComments() {
  const base = returnedReview();
  const comment = base.openComments[0];
  return {
    ...base,
    openComments: [
      comment,
      { ...comment, id: 'cm-2', section: 'ratings' as const, text: 'Check Jn: two sets and random?' },
      { ...comment, id: 'cm-3', section: 'general' as const, text: 'Photos of the left wall, please.' },
    ],
  };
}

describe('SectionComments', () => {
  it('shows the open comments of a section at its top, and not those of other sections', async () => {
    mockApi({ [REVIEW]: withComments() });
    renderWithProviders(<SectionComments projectId="p-1" roundId="r-1" place="ground" />);
    const callout = await screen.findByTestId('section-comments-ground');
    const items = within(callout).getAllByTestId('section-comment');
    expect(items).toHaveLength(1);
    expect(items[0]).toHaveTextContent('Say where the water comes from.');
    expect(items[0]).toHaveTextContent('Edda Ravenshaw, on revision 2');
    expect(callout).not.toHaveTextContent('Check Jn');
  });

  it('maps the Ratings comments to the Rating section; above the sections, the general ones and where the rest are', async () => {
    mockApi({ [REVIEW]: withComments() });
    const { unmount } = renderWithProviders(<SectionComments projectId="p-1" roundId="r-1" place="rating" />);
    expect(await screen.findByTestId('section-comments-rating')).toHaveTextContent('Check Jn');
    unmount();
    renderWithProviders(<SectionComments projectId="p-1" roundId="r-1" place="round" />);
    const top = await screen.findByTestId('section-comments-round');
    expect(top).toHaveTextContent('General: Photos of the left wall, please.');
    expect(top).toHaveTextContent('Open comments are also shown on: Ground, Ratings.');
  });

  it('Resolve marks the comment resolved and the callout goes once none is open', async () => {
    const api = mockApi({
      [REVIEW]: returnedReview(),
      [RESOLVE]: () => jsonResponse({ ...returnedReview(), openComments: [], returnComments: [] }),
    });
    renderWithProviders(<SectionComments projectId="p-1" roundId="r-1" place="ground" />);
    const user = userEvent.setup();
    const callout = await screen.findByTestId('section-comments-ground');
    await user.click(within(callout).getByRole('button', { name: 'Resolve' }));
    await waitFor(() => expect(screen.queryByTestId('section-comments-ground')).not.toBeInTheDocument());
    expect(
      api.mock.calls.some(
        ([r]) => (r as Request).method === 'POST' && (r as Request).url.endsWith('/resolve'),
      ),
    ).toBe(true);
  });

  it('shows nothing when no comment is open, and no Resolve for a member who may not resolve', async () => {
    const api = mockApi({ [REVIEW]: submittedReview() });
    const { unmount } = renderWithProviders(<SectionComments projectId="p-1" roundId="r-1" place="ground" />);
    await waitFor(() => expect(api).toHaveBeenCalled());
    expect(screen.queryByTestId('section-comments-ground')).not.toBeInTheDocument();
    unmount();
    mockApi({ [REVIEW]: { ...returnedReview(), canResolve: false } });
    renderWithProviders(<SectionComments projectId="p-1" roundId="r-1" place="ground" />);
    const callout = await screen.findByTestId('section-comments-ground');
    expect(within(callout).queryByRole('button', { name: 'Resolve' })).not.toBeInTheDocument();
  });
});
