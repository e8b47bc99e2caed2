import { findRoundSets } from '@roundbook/domain';
import { fireEvent, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import type { PanelJoint } from '@/features/orientation/components/round-orientation-panel';
import { RoundOrientationPanel } from '@/features/orientation/components/round-orientation-panel';
import { renderWithProviders } from '@/testing/render-with-providers';

// Nine joints of one set near 300/70, six of another near 040/30, one unreadable text.
const joints: PanelJoint[] = [
  ...Array.from({ length: 9 }, (_, i) => ({
    id: `a${i}`,
    kind: 'joint' as const,
    dipDirection: 300 + (i % 3) - 1,
    dip: 70 + (i % 2),
    seq: i + 1,
    orientationText: `${300 + (i % 3) - 1}/${70 + (i % 2)}`,
  })),
  ...Array.from({ length: 6 }, (_, i) => ({
    id: `b${i}`,
    kind: 'foliation' as const,
    dipDirection: 40 + (i % 3) - 1,
    dip: 30 + (i % 2),
    seq: 10 + i,
  })),
  { id: 'x', kind: 'fault' as const, dipDirection: null, dip: null, seq: 16, orientationText: 'N30E 40NE' },
];
const drive = { trend: 47, plunge: 0 };
const sets = findRoundSets(
  joints.flatMap((j) =>
    j.dipDirection === null || j.dip === null
      ? []
      : [{ id: j.id, plane: { dipDirection: j.dipDirection, dip: j.dip }, spacingM: null, override: null }],
  ),
  [],
  drive,
  { windowM: 25, count: 2 },
);

describe('RoundOrientationPanel', () => {
  it("plots the round's readable joints with the assessment's sets and says what is left out", () => {
    renderWithProviders(
      <MemoryRouter>
        <RoundOrientationPanel joints={joints} sets={sets} drive={drive} highContrast={false} fileName="r" />
      </MemoryRouter>,
    );
    expect(sets.sets.map((s) => s.label)).toEqual(['S1', 'S2']);
    const net = screen.getByRole('img', { name: /15 poles, 2 sets/ });
    expect(net.querySelector('[data-role="cone-S1"]')).not.toBeNull();
    expect(net.querySelector('[data-role="mean-label-S2"]')).toHaveTextContent('S2');
    expect(screen.getByText(/1 joint not plotted/)).toBeInTheDocument();
    const rows = within(screen.getByRole('table', { name: 'Sets' }))
      .getAllByRole('row')
      .slice(1);
    expect(rows[0]).toHaveTextContent(/S1\s*9/);
    expect(rows[1]).toHaveTextContent(/S2\s*6/);
    // Set S1 strikes 210/030, 17° from the 047° drive: parallel, dip ≥ 45 → very unfavourable
    // (Bieniawski 1989 Table 4.1F, with Roundbook's 30° rule).
    expect(rows[0]).toHaveTextContent('very unfavourable');
  });

  it('reads a pole of the round with its text as typed', () => {
    renderWithProviders(
      <MemoryRouter>
        <RoundOrientationPanel joints={joints} sets={sets} drive={null} highContrast fileName="r" />
      </MemoryRouter>,
    );
    const net = screen.getByRole('img', { name: /stereonet/ });
    expect(net.querySelector('[data-role="tunnel-axis"]')).toBeNull();
    fireEvent.keyDown(net, { key: 'ArrowRight' });
    const readout = screen.getByLabelText('Pole read-out');
    expect(readout).toHaveTextContent('299/70');
    expect(readout).toHaveTextContent(/As typed\s*299\/70/);
    expect(readout).toHaveTextContent(/Set\s*S1/);
    expect(readout).toHaveTextContent(/Joint\s*Joint 1/);
  });
});
