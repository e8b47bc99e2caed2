import { fireEvent, screen } from '@testing-library/react';
import type { LongSection } from '@/api/resources/long-sections';
import { LongSectionPlot } from '@/features/long-section/components/heading-long-section';
import { qFraction } from '@/features/long-section/scene/long-section-scene';
import { renderWithProviders } from '@/testing/render-with-providers';

const round = (id: string, n: number, from: number, q: number) => ({
  id,
  roundNumber: n,
  stage: 'full-face' as const,
  status: 'confirmed' as const,
  fromChainage: from,
  faceChainage: from + 3,
  rockUnit: 'Granite',
  q,
  rmr: 50,
  gsi: 45,
  recommendedClass: 'B',
  confirmedClass: 'B',
  installedClass: null,
  triggerLevel: 'green' as const,
  inflowLpmPer10m: 4,
  overbreakM3PerM: 0.2,
});

const data: LongSection = {
  headingId: 'h',
  chainageSense: 'increasing',
  faceChainage: 106,
  faceRoundNumber: 2,
  lookAheadRoundLength: 3,
  crownHeight: 2.7,
  invertDepth: 2.7,
  rounds: [round('r1', 1, 100, 0.1), round('r2', 2, 103, 10)],
  hazards: [],
  traces: [
    {
      jointId: 'j',
      featureKey: 'j',
      roundId: 'r2',
      roundNumber: 2,
      kind: 'fault',
      label: 'Fault of round 2',
      dipDirection: 130,
      dip: 60,
      crownChainage: 108,
      invertChainage: 111,
      crownAhead: 2,
      invertAhead: 5,
      crownRoundsAhead: 1,
      invertRoundsAhead: 2,
      traceKnown: false,
    },
  ],
};

describe('LongSectionPlot', () => {
  it('puts Q on a log scale: each decade the same height, 0.001 at the bottom and 1000 at the top (Barton et al. 1974 range)', () => {
    expect(qFraction(0.001)).toBe(0);
    expect(qFraction(1000)).toBe(1);
    expect(qFraction(10) - qFraction(1)).toBeCloseTo(qFraction(1) - qFraction(0.1), 12);
  });

  it('shows the fault reaching the crown in the next round, and opens a round when it is tapped', () => {
    const opened: string[] = [];
    const { container } = renderWithProviders(
      <LongSectionPlot data={data} onOpenRound={(id) => opened.push(id)} />,
    );
    expect(screen.getByText('Fault of round 2: crown in round 1 ahead')).toBeInTheDocument();
    const target = container.querySelector('rect[data-round-id="r2"]')!;
    fireEvent.click(target);
    expect(opened).toEqual(['r2']);
  });

  it('drops a trace label a row when it would print over another (faults of one zone crossing close together)', () => {
    const second = {
      ...data.traces[0],
      jointId: 'k',
      featureKey: 'k',
      label: 'Fault B',
      crownChainage: 108.4,
    };
    const third = { ...data.traces[0], jointId: 'l', featureKey: 'l', label: 'Fault C', crownChainage: 140 };
    renderWithProviders(
      <LongSectionPlot
        data={{ ...data, traces: [data.traces[0], second, third] }}
        onOpenRound={() => undefined}
      />,
    );
    const y = (text: string) => Number(screen.getByText(text).getAttribute('y'));
    expect(y('Fault B: crown in round 1 ahead')).toBeGreaterThan(
      y('Fault of round 2: crown in round 1 ahead'),
    );
    // Far enough along the tunnel, a label stays on the first row.
    expect(y('Fault C: crown in round 1 ahead')).toBe(y('Fault of round 2: crown in round 1 ahead'));
  });

  it('zooms in around the middle of the view', () => {
    renderWithProviders(<LongSectionPlot data={data} onOpenRound={() => undefined} />);
    const before = screen.getByRole('img').getAttribute('aria-label');
    fireEvent.click(screen.getByRole('button', { name: 'Closer' }));
    expect(screen.getByRole('img').getAttribute('aria-label')).not.toBe(before);
  });
});
