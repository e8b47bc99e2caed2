import { screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import type { HandoverSummary, HeadingSummary } from '@/api/contract';
import { HeadingCard } from '@/features/projects/components/heading-card';
import { harrowdale } from '@/testing/fixtures';
import { renderWithProviders } from '@/testing/render-with-providers';

const upstream = harrowdale.headings[0];
const sent: HandoverSummary = {
  sentAt: '2026-11-30T18:05:00Z',
  acknowledgedAt: null,
  ackDueAt: '2026-11-30T19:05:00Z',
  overdue: false,
};

function renderCard(heading: Partial<HeadingSummary>, links = true) {
  renderWithProviders(
    <MemoryRouter>
      <HeadingCard
        heading={{ ...upstream, ...heading }}
        timeZone="UTC"
        to="/projects/p-1/headings/h-1"
        reviewTo={links ? '/to-confirm?heading=h-1' : undefined}
        handoversTo={links ? '/projects/p-1/headings/h-1?view=handovers' : undefined}
      />
    </MemoryRouter>,
  );
  return screen.getByRole('article', { name: 'Upstream drive from Adit 2' });
}

describe('HeadingCard, last handover (issue 15 item 6)', () => {
  it.each([
    ['waiting', sent, 'Waiting for acknowledgement, due by 30 Nov 2026, 19:05'],
    ['overdue', { ...sent, overdue: true }, 'Overdue: not acknowledged, was due by 30 Nov 2026, 19:05'],
    ['acknowledged', { ...sent, acknowledgedAt: '2026-11-30T18:40:00Z' }, 'Acknowledged 30 Nov 2026, 18:40'],
  ] as const)('reads %s by mark and words, and links to the handover', (state, handover, words) => {
    const card = renderCard({ lastHandover: handover });
    const line = within(card).getByTestId('handover-state');
    expect(line).toHaveAttribute('data-state', state);
    expect(line).toHaveTextContent(words);
    // The mark is drawn, hidden from screen readers (the words say it).
    const mark = line.querySelector('[aria-hidden="true"] svg');
    expect(mark).not.toBeNull();
    expect(within(card).getByRole('link', { name: 'sent 30 Nov 2026, 18:05' })).toHaveAttribute(
      'href',
      '/projects/p-1/headings/h-1?view=handovers',
    );
  });

  it('gives each state a mark of its own shape, not only its own colour', () => {
    const marks = (
      [sent, { ...sent, overdue: true }, { ...sent, acknowledgedAt: '2026-11-30T18:40:00Z' }] as const
    ).map((handover) => {
      const { unmount } = renderWithProviders(
        <MemoryRouter>
          <HeadingCard heading={{ ...upstream, lastHandover: handover }} timeZone="UTC" />
        </MemoryRouter>,
      );
      const svg = screen.getByTestId('handover-state').querySelector('svg')!.innerHTML;
      unmount();
      return svg;
    });
    expect(new Set(marks).size).toBe(3);
  });

  it('says none yet, with no state and no link, when the heading has no handover', () => {
    const card = renderCard({ lastHandover: null });
    expect(card).toHaveTextContent('Last handovernone yet');
    expect(within(card).queryByTestId('handover-state')).not.toBeInTheDocument();
    expect(within(card).queryByRole('link', { name: /^sent/ })).not.toBeInTheDocument();
  });

  it('shows the time as text where no link is given', () => {
    const card = renderCard({ lastHandover: sent }, false);
    expect(card).toHaveTextContent('sent 30 Nov 2026, 18:05');
    expect(within(card).queryByRole('link', { name: /^sent/ })).not.toBeInTheDocument();
  });
});

describe('HeadingCard, face and review (issue 19 item 13)', () => {
  it('links the rounds waiting for review where the app says', () => {
    const card = renderCard({ roundsToConfirm: 1 });
    expect(within(card).getByRole('link', { name: '1 round' })).toHaveAttribute(
      'href',
      '/to-confirm?heading=h-1',
    );
  });

  it('keeps the face at the last round handed in and marks a draft beyond it as a draft', () => {
    const card = renderCard({ faceChainage: 1250, draftFaceChainage: 1253.5 });
    expect(card).toHaveTextContent('Face chainage1+250.0');
    expect(card).toHaveTextContent('Draft at 1+253.5, not yet submitted');
  });

  it('says none has been handed in yet when the only round is a draft', () => {
    const card = renderCard({ faceChainage: null, draftFaceChainage: 1003 });
    expect(card).toHaveTextContent('none handed in yet (starts at 1+000.0)');
    expect(card).toHaveTextContent('Draft at 1+003.0, not yet submitted');
  });
});
