// The sketch as SVG: the picture's placement and what it draws, checked against positions worked out by
// hand for an 8 m × 6 m rectangular face at 50 px/m with 1 m of paper all round.
import {
  emptySketch,
  sketchSvgView,
  sketchToSvg,
  svgPx,
  traceColourBySet,
  SET_COLOURS_LIGHT,
  type SketchDocument,
  type SketchPoint,
} from '../src/index.js';

const outline: SketchPoint[] = [
  [-4, 0],
  [4, 0],
  [4, 6],
  [-4, 6],
];
const doc: SketchDocument = {
  ...emptySketch(),
  elements: [
    {
      id: 't1',
      kind: 'trace',
      mode: 'polyline',
      points: [
        [-2, 1],
        [1, 3],
      ],
      link: { setLabel: 'S2' },
    },
    {
      id: 'o1',
      kind: 'overbreak',
      points: [
        [0, 6],
        [2, 6],
        [1, 7],
      ],
    },
    { id: 'w1', kind: 'water', at: [3, 2], state: 'flowing', inflowLpm: 12 },
    { id: 'l1', kind: 'label', at: [-3, 4], text: 'Clay & <soft> "seam"' },
  ],
};
const options = { pxPerMetre: 50, marginM: 1 };

describe('sketchToSvg', () => {
  it('places the face frame: the profile and every element with the margin, y down', () => {
    const v = sketchSvgView(doc, { outline }, options);
    // x from −4 − 1 to 4 + 1 (10 m); y from 0 − 1 to 7 (the overbreak apex) + 1 (9 m)
    expect(v).toEqual({ scale: 50, minX: -5, maxY: 8, width: 500, height: 450 });
    // (−2, 1): ((−2 + 5) × 50, (8 − 1) × 50) = (150, 350)
    expect(svgPx(v, [-2, 1])).toEqual([150, 350]);
    expect(svgPx(v, [1, 3])).toEqual([300, 250]);
  });

  it('draws the trace where it is, in its set colour; the overbreak with its area; water and labels', () => {
    const svg = sketchToSvg(
      doc,
      { outline, axisHeight: 3, springline: 6, benchLine: null },
      {
        ...options,
        title: 'Face at 1+234 · looking in the drive direction',
        traceColour: (t) => (t.link && 'setLabel' in t.link ? '#d88a00' : '#000'),
      },
    );
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg" width="500" height="450"')).toBe(true);
    expect(svg.trim().endsWith('</svg>')).toBe(true);
    expect(svg).toMatch(/<polyline data-id="t1" points="150,350 300,250" fill="none" stroke="#d88a00"/);
    // the overbreak ring (0,6) (2,6) (1,7) → (250,100) (350,100) (300,50); ½ × 2 × 1 = 1 m²
    expect(svg).toMatch(/<polygon data-id="o1" points="250,100 350,100 300,50"/);
    expect(svg).toContain('>1.00 m²</text>');
    // the flowing mark at (3, 2) → (400, 300), its inflow written beside it
    expect(svg).toContain('<circle cx="400" cy="300" r="9" fill="#1b6fd1"/>');
    expect(svg).toContain('>12 l/min</text>');
    // text is escaped
    expect(svg).toContain('>Clay &amp; &lt;soft&gt; &quot;seam&quot;</text>');
    expect(svg).not.toContain('<soft>');
    // axis at 3 m → y = (8 − 3) × 50 = 250; springline at 6 m → y = 100; no bench line
    expect(svg).toMatch(/<line x1="\d+(\.\d+)?" y1="250" x2="\d+(\.\d+)?" y2="250" stroke="#9c4a00"/);
    expect(svg).toContain('>Springline</text>');
    expect(svg).not.toContain('Bench line');
    // the excavation line: (−4,0) (4,0) (4,6) (−4,6) → (50,400) (450,400) (450,100) (50,100)
    expect(svg).toContain('points="50,400 450,400 450,100 50,100" fill="none" stroke="#1f2328"');
    // 1 m grid: x = −5 … 5 (11 lines), y = −1 … 8 (10 lines)
    expect(svg.match(/y1="0" x2="[\d.]+" y2="450" stroke="#(dde1e7|c3c9d2)"/g)).toHaveLength(11);
    expect(svg.match(/<line x1="0" y1="[\d.]+" x2="500"/g)).toHaveLength(10);
    // the scale bar is 1 m long: 50 px
    expect(svg).toMatch(/<rect x="12" y="[\d.]+" width="50" height="6"/);
    expect(svg).toContain('Face at 1+234 · looking in the drive direction');
  });

  it('an unlinked trace is drawn in the ink; an empty sketch still shows the face', () => {
    const plain = sketchToSvg(
      { ...emptySketch(), elements: [{ ...doc.elements[0], link: null } as never] },
      { outline },
    );
    expect(plain).toMatch(/<polyline data-id="t1" [^>]*stroke="#1f2328"/);
    const empty = sketchToSvg(emptySketch(), { outline });
    expect(empty).toContain('points="');
    expect(empty).not.toContain('<polyline data-id');
    expect(() => sketchToSvg(emptySketch(), { outline: [] })).toThrow(/needs the profile outline/);
  });
});

describe('traceColourBySet', () => {
  const trace = (link: Record<string, string> | null) =>
    ({ id: 't', kind: 'trace', mode: 'polyline', points: [], link }) as never;
  const colourOf = traceColourBySet(
    ['S1', 'S2'],
    [
      { id: 'j1', setLabel: 'S2' },
      { id: 'j2', setLabel: null },
    ],
  );
  it('takes the set colour in set order, through the joint or the set; the ink otherwise', () => {
    expect(colourOf(trace({ setLabel: 'S1' }))).toBe(SET_COLOURS_LIGHT[0]);
    expect(colourOf(trace({ jointId: 'j1' }))).toBe(SET_COLOURS_LIGHT[1]);
    expect(colourOf(trace({ jointId: 'j2' }))).toBe('#1f2328');
    expect(colourOf(trace({ jointId: 'gone' }))).toBe('#1f2328');
    expect(colourOf(trace({ setLabel: 'S9' }))).toBe('#1f2328');
    expect(colourOf(trace(null))).toBe('#1f2328');
    // more sets than colours: the colours repeat
    expect(traceColourBySet(['S1', 'S2', 'S3'], [], ['#111111', '#222222'])(trace({ setLabel: 'S3' }))).toBe(
      '#111111',
    );
  });
});
