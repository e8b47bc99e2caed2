import { TERZAGHI_SAMPLING_LABELS } from '@roundbook/geomath';
import { TOUCH_TARGET_PX } from '@roundbook/ui';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import type { Heading } from '@/api/contract';
import type { WindowJoint } from '@/features/orientation/api/get-window-joints';
import {
  HeadingOrientation,
  readChainage,
  windowBehindFace,
} from '@/features/orientation/components/heading-orientation';
import { jsonResponse, mockApi, restoreFetch } from '@/testing/mock-api';
import { renderWithProviders } from '@/testing/render-with-providers';

const heading: Heading = {
  id: 'h-1',
  projectId: 'p-1',
  code: 'HR-U',
  name: 'Upstream drive',
  chainageStyle: 'km+m',
  chainageDecimals: 1,
  startChainage: 1000,
  driveTrend: 47,
  gradientPercent: 0,
  profileShape: 'horseshoe',
  profileWidth: 6.2,
  profileHeight: 6.4,
  axisHeight: 3.2,
  plannedRoundLength: 3,
  stages: ['full-face'],
  startEasting: null,
  startNorthing: null,
  startElevation: null,
  version: 1,
};

const joint = (
  i: number,
  chainage: number,
  kind: WindowJoint['kind'],
  dd: number,
  dip: number,
): WindowJoint => ({
  id: `j-${i}`,
  roundId: `r-${Math.floor(chainage)}`,
  roundNumber: Math.round((chainage - 1000) / 3),
  faceChainage: chainage,
  kind,
  dipDirection: dd,
  dip,
  setLabel: null,
});

// Two tight sets (137/60 and 230/35, ±3°) on the last 50 m, a few older joints and two faults.
const all: WindowJoint[] = [
  ...Array.from({ length: 12 }, (_, i) =>
    joint(i, 1205 + i * 4, 'joint', 137 + ((i % 5) - 2) * 1.5, 60 + ((i % 3) - 1) * 2),
  ),
  ...Array.from({ length: 10 }, (_, i) =>
    joint(20 + i, 1206 + i * 4, 'bedding', 230 + ((i % 4) - 1.5), 35 + ((i % 3) - 1)),
  ),
  joint(40, 1230, 'fault', 310, 80),
  joint(41, 1240, 'fault', 20, 15),
  ...Array.from({ length: 6 }, (_, i) => joint(50 + i, 1110 + i * 5, 'joint', 90 + i * 40, 50)),
];

// jsdom has no ResizeObserver; Fluent's MessageBar measures itself with one.
if (!('ResizeObserver' in window)) {
  Object.assign(window, {
    ResizeObserver: class {
      observe() {}
      unobserve() {}
      disconnect() {}
    },
  });
}

/** min-height of an element from the style rules Griffel wrote for its classes (jsdom applies none). */
function ruleMinHeight(element: Element): string | null {
  const classes = [...element.classList];
  for (const sheet of [...document.styleSheets]) {
    for (const rule of [...sheet.cssRules]) {
      const r = rule as CSSStyleRule;
      const value = r.style?.getPropertyValue('min-height');
      if (value && classes.some((c) => r.selectorText === `.${c}`)) return value;
    }
  }
  return null;
}

let requests: URL[] = [];

/** Joints a test adds to the window's answer. */
let extra: WindowJoint[] = [];

beforeEach(() => {
  requests = [];
  extra = [];
  mockApi({
    'GET /api/projects/p-1/headings/h-1/rounds': (request: Request) => {
      const sort = new URL(request.url).searchParams.get('sort');
      const faceChainage = sort === '-faceChainage' ? 1250 : 1100;
      return jsonResponse({ items: [{ id: 'r', faceChainage }], total: 40, page: 1, pageSize: 1 });
    },
    'GET /api/projects/p-1/headings/h-1/joints': (request: Request) => {
      const url = new URL(request.url);
      requests.push(url);
      const from = Number(url.searchParams.get('fromChainage'));
      const to = Number(url.searchParams.get('toChainage'));
      return jsonResponse([...all, ...extra].filter((j) => j.faceChainage >= from && j.faceChainage <= to));
    },
  });
});
afterEach(restoreFetch);

const renderTab = (highContrast = false) =>
  renderWithProviders(
    <MemoryRouter>
      <HeadingOrientation projectId="p-1" heading={heading} highContrast={highContrast} />
    </MemoryRouter>,
  );

describe('HeadingOrientation', () => {
  it('opens on the last 50 m behind the face and lists the sets of the window', async () => {
    renderTab();
    const table = await screen.findByRole('table', { name: 'Sets' });
    expect(requests[0].searchParams.get('fromChainage')).toBe('1200');
    expect(requests[0].searchParams.get('toChainage')).toBe('1250');
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(2);
    // Set means near the generating orientations (Fisher means of ±3° scatter; computed here).
    expect(rows[0]).toHaveTextContent(/W1\s*12/);
    expect(rows[0]).toHaveTextContent(/13[6-8](\.\d)?\/(59|60|61)/);
    expect(rows[1]).toHaveTextContent(/W2\s*10/);
    expect(rows[1]).toHaveTextContent(/2(29|30|31)(\.\d)?\/3[4-6]/);
    expect(screen.getByText(/24 of 24 poles from 1\+200\.0 to 1\+250\.0/)).toBeInTheDocument();
    const net = screen.getByRole('img', { name: /Equal-area lower-hemisphere stereonet: 24 poles, 2 sets/ });
    expect(net).toHaveTextContent('multiples of σ, Kamb 1959; uniform = 3σ');
  });

  it('changes the window: the new chainages are asked of the API', async () => {
    const user = userEvent.setup();
    renderTab();
    await screen.findByRole('table', { name: 'Sets' });
    const from = screen.getByRole('textbox', { name: 'From chainage' });
    await user.clear(from);
    await user.type(from, '1+100');
    await user.click(screen.getByRole('button', { name: 'Show window' }));
    await screen.findByText(/30 of 30 poles from 1\+100\.0 to 1\+250\.0/);
    expect(requests.at(-1)?.searchParams.get('fromChainage')).toBe('1100');
    await user.click(screen.getByRole('button', { name: 'Last 25 m' }));
    await screen.findByText(/from 1\+225\.0 to 1\+250\.0/);
    expect(requests.at(-1)?.searchParams.get('fromChainage')).toBe('1225');
  });

  it('refuses a chainage it cannot read and keeps the window shown', async () => {
    const user = userEvent.setup();
    renderTab();
    await screen.findByRole('table', { name: 'Sets' });
    const to = screen.getByRole('textbox', { name: 'To chainage' });
    await user.clear(to);
    await user.type(to, '12x0');
    expect(screen.getByRole('button', { name: 'Show window' })).toBeDisabled();
    expect(screen.getByText(/Type both chainages/)).toBeInTheDocument();
    expect(requests).toHaveLength(1);
  });

  it('filters by kind', async () => {
    const user = userEvent.setup();
    renderTab();
    await screen.findByRole('table', { name: 'Sets' });
    await user.click(screen.getByRole('button', { name: 'Fault' }));
    expect(screen.getByText(/22 of 24 poles .* \(hidden: fault\)/)).toBeInTheDocument();
    expect(screen.getByRole('img', { name: /22 poles/ })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Bedding' }));
    const rows = within(screen.getByRole('table', { name: 'Sets' }))
      .getAllByRole('row')
      .slice(1);
    expect(rows).toHaveLength(1);
  });

  it('counts a fault linked across two faces once, at its later face (issue 10 item 2)', async () => {
    // The fault j-41 (020/15 at 1+240) mapped again at 1+248 and linked to its first sighting.
    extra = [{ ...joint(42, 1248, 'fault', 24, 17), sameAsJointId: 'j-41' }];
    renderTab();
    await screen.findByRole('table', { name: 'Sets' });
    expect(
      screen.getByText(
        /24 of 25 poles .*; 1 earlier sighting of features mapped again on a later face is counted once/,
      ),
    ).toBeInTheDocument();
    expect(screen.getByRole('img', { name: /24 poles/ })).toBeInTheDocument();
  });

  it('reads a pole in every notation, with its round', async () => {
    renderTab();
    await screen.findByRole('table', { name: 'Sets' });
    const net = screen.getByRole('img', { name: /stereonet/ });
    fireEvent.keyDown(net, { key: 'ArrowRight' });
    const readout = screen.getByLabelText('Pole read-out');
    // First joint of the window: 134/58 (137 − 3, 60 − 1): strike 044, quadrant N44E 58SE, pole 314/31.
    expect(readout).toHaveTextContent('134/58');
    expect(readout).toHaveTextContent('58/134');
    expect(readout).toHaveTextContent('044/58');
    expect(readout).toHaveTextContent('N44E 58SE');
    expect(readout).toHaveTextContent('314/32');
    expect(readout).toHaveTextContent(/Round\s*68 at 1\+205\.0/);
    expect(within(readout).getByRole('link')).toHaveAttribute('href', '/projects/p-1/rounds/r-1205');
    expect(net.querySelector('[data-role="selected-pole"]')).not.toBeNull();
  });

  it('states the Terzaghi weighting on the plot when asked for', async () => {
    const user = userEvent.setup();
    renderTab();
    await screen.findByRole('table', { name: 'Sets' });
    await user.click(screen.getByRole('radio', { name: 'Terzaghi, faces pooled along the axis' }));
    const net = screen.getByRole('img', { name: /stereonet/ });
    await waitFor(() => expect(net).toHaveTextContent(/Terzaghi weighting, scanline/));
    expect(screen.getAllByText(TERZAGHI_SAMPLING_LABELS.scanline).length).toBeGreaterThan(0);
  });

  it('gives every control a touch target of at least 44 px (WCAG 2.5.5)', async () => {
    renderTab();
    await screen.findByRole('table', { name: 'Sets' });
    for (const name of ['Show window', 'Last 50 m', 'Whole heading', 'Joint', 'Save as SVG']) {
      const px = Number.parseFloat(ruleMinHeight(screen.getByRole('button', { name })) ?? '0');
      expect([name, px]).toEqual([name, TOUCH_TARGET_PX]);
      expect(px).toBeGreaterThanOrEqual(44);
    }
  });
});

describe('window helpers', () => {
  it('takes the window back from the face against the chainage sense', () => {
    expect(windowBehindFace({ from: 900, to: 1000 }, 50, 'increasing')).toEqual({
      fromChainage: 950,
      toChainage: 1000,
    });
    expect(windowBehindFace({ from: 900, to: 1000 }, 50, 'decreasing')).toEqual({
      fromChainage: 900,
      toChainage: 950,
    });
  });
  it('reads metres and km+m', () => {
    expect(readChainage('1+250.5')).toBe(1250.5);
    expect(readChainage(' 1250,5 ')).toBe(1250.5);
    expect(readChainage('-0+012')).toBe(-12);
    expect(readChainage('12x')).toBeNull();
  });

  it("draws each round's set means along the chainage beside the net, with a table behind a toggle", async () => {
    // Invented: the round at 1230 put two joints in S1, the one at 1242 one in S1 and one in S2.
    extra = [
      { ...joint(90, 1230, 'joint', 300, 70), setLabel: 'S1' },
      { ...joint(91, 1230, 'joint', 302, 72), setLabel: 'S1' },
      { ...joint(92, 1242, 'joint', 305, 68), setLabel: 'S1' },
      { ...joint(93, 1242, 'joint', 40, 30), setLabel: 'S2' },
    ];
    renderTab();
    const chart = await screen.findByRole('img', {
      name: "Chart of each set's mean along the chainage from 1+200.0 to 1+250.0: 2 sets over 2 rounds",
    });
    // Dip direction above, dip below; S1 twice in each, S2 once.
    for (const panel of ['dipDirection', 'dip']) {
      const g = chart.querySelector(`[data-role="panel-${panel}"]`)!;
      expect(g.querySelectorAll('[data-role="history-S1"] [data-role="history-mean"]')).toHaveLength(2);
      expect(g.querySelectorAll('[data-role="history-S2"] [data-role="history-mean"]')).toHaveLength(1);
    }
    expect(screen.queryByRole('table', { name: 'Sets along the chainage' })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Show as a table' }));
    const table = screen.getByRole('table', { name: 'Sets along the chainage' });
    const rows = within(table)
      .getAllByRole('row')
      .slice(1)
      .map((r) => [...r.querySelectorAll('td')].map((c) => c.textContent));
    // The mean of 300/70 and 302/72 is near 301/71 (computed here); one joint is its own mean.
    expect(rows).toEqual([
      ['S1', '77', '1+230.0', expect.stringMatching(/^30[01](\.\d)?\/7[01](\.\d)?$/), '2'],
      ['S1', '81', '1+242.0', '305/68', '1'],
      ['S2', '81', '1+242.0', '040/30', '1'],
    ]);
    expect(screen.getByRole('button', { name: 'Hide the table' })).toHaveAttribute('aria-expanded', 'true');
  });

  it('says so when no round of the window has a set', async () => {
    renderTab();
    expect(await screen.findByText('No round in this window has a set yet.')).toBeInTheDocument();
    expect(screen.queryByRole('img', { name: /Chart of each set/ })).toBeNull();
  });
});
