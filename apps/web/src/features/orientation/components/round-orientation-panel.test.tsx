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

// jsdom has no PointerEvent: without one the event loses its coordinates (as in stereonet.test.tsx).
if (!('PointerEvent' in window)) {
  class TestPointerEvent extends MouseEvent {
    pointerType: string;
    constructor(type: string, init: PointerEventInit = {}) {
      super(type, init);
      this.pointerType = init.pointerType ?? '';
    }
  }
  Object.assign(window, { PointerEvent: TestPointerEvent });
}

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

  it('draws the friction circle, a daylight envelope and the set-pair intersection only when switched on', () => {
    renderWithProviders(
      <MemoryRouter>
        <RoundOrientationPanel joints={joints} sets={sets} drive={drive} highContrast={false} fileName="r" />
      </MemoryRouter>,
    );
    const net = screen.getByRole('img', { name: /15 poles, 2 sets/ });
    for (const role of ['friction-circle', 'daylight-face', 'intersection-S1×S2'])
      expect(net.querySelector(`[data-role="${role}"]`)).toBeNull();
    fireEvent.click(screen.getByRole('switch', { name: 'Friction circle' }));
    expect(net.querySelector('[data-role="friction-circle"]')).not.toBeNull();
    expect(net).toHaveTextContent('friction circle, φ = 30°');
    // The user's own φ redraws it (40°), and a value out of range takes it away with a message.
    const phi = screen.getByRole('spinbutton', { name: /Friction angle/ });
    fireEvent.change(phi, { target: { value: '40' } });
    expect(net).toHaveTextContent('φ = 40°');
    fireEvent.change(phi, { target: { value: '95' } });
    expect(net.querySelector('[data-role="friction-circle"]')).toBeNull();
    expect(screen.getByText('Between 0 and 90°')).toBeInTheDocument();

    fireEvent.click(screen.getByRole('radio', { name: 'Daylights on the face' }));
    expect(net.querySelector('[data-role="daylight-face"]')).not.toBeNull();
    expect(net.querySelector('[data-role="daylight-left-wall"]')).toBeNull();
    fireEvent.click(screen.getByRole('radio', { name: 'Daylights on the left wall' }));
    expect(net.querySelector('[data-role="daylight-left-wall"]')).not.toBeNull();
    expect(net.querySelector('[data-role="daylight-face"]')).toBeNull();

    fireEvent.click(screen.getByRole('switch', { name: 'Intersections of set pairs' }));
    const star = net.querySelector('[data-role="intersection-S1×S2"]');
    expect(star).not.toBeNull();
    expect(net.querySelector('[data-role="intersection-label-S1×S2"]')).toHaveTextContent('S1×S2');
    // Tap its star: the read-out gives the line's trend and plunge. jsdom lays nothing out, so screen px are
    // scene px; the star's first vertex is its top point, 1.7 symbol radii above the centre.
    const d = star?.getAttribute('d') ?? '';
    const vertices = (d.match(/-?\d+(\.\d+)?/g) ?? []).map(Number);
    const x = vertices[0];
    const cy = (vertices[1] + vertices[13]) / 2; // vertex 6 is the bottom point, straight below the top one
    fireEvent.pointerDown(net, { clientX: x, clientY: cy, pointerType: 'touch' });
    const readout = screen.getByLabelText('Pole read-out');
    expect(readout).toHaveTextContent('Intersection S1×S2');
    expect(readout).toHaveTextContent(/Trend \/ plunge\s*\d{3}\/\d{2}/);
  });

  describe('choosing poles for a set (an editable round)', () => {
    const renderPanel = (onAssign: ((ids: string[], label: string | null) => void) | null) =>
      renderWithProviders(
        <MemoryRouter>
          <RoundOrientationPanel
            joints={joints}
            sets={sets}
            drive={drive}
            highContrast={false}
            fileName="r"
            onAssign={onAssign}
          />
        </MemoryRouter>,
      );

    it('puts the poles chosen with the keys in an existing set, a new one, or out of their set', () => {
      const onAssign = jest.fn();
      renderPanel(onAssign);
      fireEvent.click(screen.getByRole('button', { name: 'Choose poles for a set' }));
      const bar = screen.getByRole('group', { name: 'Chosen poles' });
      const net = screen.getByRole('img', { name: /15 poles/ });
      expect(within(bar).getByRole('button', { name: 'Take out of its set' })).toBeDisabled();
      // Joints a0 and a1 (the first two poles); a2 is chosen and let go again (Space twice).
      fireEvent.keyDown(net, { key: 'ArrowRight' });
      fireEvent.keyDown(net, { key: ' ' });
      fireEvent.keyDown(net, { key: 'ArrowRight' });
      fireEvent.keyDown(net, { key: ' ' });
      fireEvent.keyDown(net, { key: 'ArrowRight' });
      fireEvent.keyDown(net, { key: ' ' });
      fireEvent.keyDown(net, { key: ' ' });
      expect(bar).toHaveTextContent('2 poles selected');
      const picker = within(bar).getByLabelText('Set to put them in');
      expect([...picker.querySelectorAll('option')].map((o) => o.textContent)).toEqual([
        'S1',
        'S2',
        'A new set…',
      ]);
      fireEvent.change(picker, { target: { value: 'S2' } });
      fireEvent.click(within(bar).getByRole('button', { name: 'Put in set S2' }));
      expect(onAssign).toHaveBeenLastCalledWith(['a0', 'a1'], 'S2');
      expect(bar).toHaveTextContent('0 poles selected');

      // A new set: named S3 unless the geologist types another name; an empty name puts nothing.
      fireEvent.keyDown(net, { key: ' ' });
      fireEvent.change(picker, { target: { value: ' new' } });
      const name = within(bar).getByLabelText('Name of the new set');
      expect(name).toHaveValue('S3');
      fireEvent.change(name, { target: { value: '  ' } });
      expect(within(bar).getByRole('button', { name: 'Put in set' })).toBeDisabled();
      fireEvent.change(name, { target: { value: 'Sheeting ' } });
      fireEvent.click(within(bar).getByRole('button', { name: 'Put in set Sheeting' }));
      expect(onAssign).toHaveBeenLastCalledWith(['a2'], 'Sheeting');

      fireEvent.keyDown(net, { key: 'Enter' });
      fireEvent.click(within(bar).getByRole('button', { name: 'Take out of its set' }));
      expect(onAssign).toHaveBeenLastCalledWith(['a2'], null);
      expect(screen.getByTestId('pole-choice-done')).toHaveTextContent('1 pole taken out of its set');

      // Clear lets go of the choice without assigning anything.
      fireEvent.keyDown(net, { key: 'Enter' });
      fireEvent.click(within(bar).getByRole('button', { name: 'Clear' }));
      expect(bar).toHaveTextContent('0 poles selected');
      expect(onAssign).toHaveBeenCalledTimes(3);
    });

    it('shows no choosing of poles on a read-only round', () => {
      renderPanel(null);
      expect(screen.getByRole('img', { name: /15 poles/ })).toBeInTheDocument();
      expect(screen.queryByRole('button', { name: 'Choose poles for a set' })).toBeNull();
      expect(screen.queryByRole('group', { name: 'Chosen poles' })).toBeNull();
    });
  });
});

describe('RoundOrientationPanel roof wedges', () => {
  const wedgeSets = (planes: [number, number][]) => ({
    sets: planes.map(([dipDirection, dip], i) => ({
      ...sets.sets[0],
      label: `S${i + 1}`,
      mean: { dipDirection, dip },
    })),
    membership: {},
  });
  const show = (s: ReturnType<typeof wedgeSets>) =>
    renderWithProviders(
      <MemoryRouter>
        <RoundOrientationPanel joints={[]} sets={s} drive={drive} highContrast={false} fileName="r" />
      </MemoryRouter>,
    );

  it('lists the falling and the sliding wedge of methods.md §5 at φ 30°', () => {
    // methods.md §5 [computed here]: 045/60, 165/60, 285/60 falls; 060/70, 160/70, 110/20 slides along 110/60.5.
    show(
      wedgeSets([
        [45, 60],
        [165, 60],
        [285, 60],
      ]),
    );
    const list = screen.getByRole('list', { name: 'Roof wedges that fall or slide' });
    expect(within(list).getAllByRole('listitem')).toHaveLength(1);
    expect(list.textContent).toContain('S1, S2 and S3: falls straight down');
    expect(list.textContent).toContain('105/41, 225/41, 345/41');
  });

  it('names the sliding line of 060/70, 160/70, 110/20 (methods.md §5 [computed here])', () => {
    show(
      wedgeSets([
        [60, 70],
        [160, 70],
        [110, 20],
      ]),
    );
    const list = screen.getByRole('list', { name: 'Roof wedges that fall or slide' });
    expect(list.textContent).toContain('slides along the line where S1 and S2 meet, 110/60');
    expect(list.textContent).toContain('φ 30°');
  });

  it('says when no wedge falls or slides, and when there are fewer than three sets', () => {
    // S1 and S2 of the fixture (near 300/70 and 040/30) are two sets only.
    renderWithProviders(
      <MemoryRouter>
        <RoundOrientationPanel joints={joints} sets={sets} drive={drive} highContrast={false} fileName="r" />
      </MemoryRouter>,
    );
    expect(screen.getByText(/Fewer than three sets in this round \(2\)/)).toBeTruthy();
  });

  it('says none when the three sets close off no wedge that falls or slides', () => {
    // 060/70, 160/70, 110/20 at φ 70°: the steepest line 110/60.5 is gentler than φ (methods.md §5 [computed here]).
    renderWithProviders(
      <MemoryRouter>
        <RoundOrientationPanel
          joints={[]}
          sets={wedgeSets([
            [60, 70],
            [160, 70],
            [110, 20],
          ])}
          drive={drive}
          highContrast={false}
          fileName="r"
          frictionAngle={70}
        />
      </MemoryRouter>,
    );
    expect(screen.getByText(/None of the 1 combination of three sets .* at φ 70°/)).toBeTruthy();
    expect(screen.queryByRole('list', { name: 'Roof wedges that fall or slide' })).toBeNull();
  });
});
