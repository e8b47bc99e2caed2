// The face sketch written out as an SVG picture from the same document the browser draws (sketch.ts):
// for reports, handovers and e-mail, and for the PNG the API renders from it. Pure string building with
// Roundbook's own colours and marks; y up in the face frame becomes y down in the picture.
import {
  overbreakArea,
  type SketchDocument,
  type SketchPoint,
  type SketchTrace,
  type SketchWater,
} from './sketch.js';

/** Roundbook's sketch colours on white paper (the canvas uses the same ones). */
export const SKETCH_COLOURS = {
  paper: '#ffffff',
  ink: '#1f2328',
  muted: '#5b6470',
  grid: '#dde1e7',
  gridMajor: '#c3c9d2',
  excavation: '#1f2328',
  otherStage: '#a7aeb8',
  axis: '#9c4a00',
  water: '#1b6fd1',
  overbreak: '#c2410c',
  overbreakFill: 'rgba(194, 65, 12, 0.14)',
  selection: '#e11d74',
} as const;

/**
 * Roundbook's set colours for light paper: six hues of different lightness and hue family, chosen so
 * that neighbours in the list differ in lightness as well as hue (each set also has its own symbol
 * shape, so no set is told apart by colour alone).
 */
export const SET_COLOURS_LIGHT: readonly string[] = [
  '#0b5d73', // deep teal
  '#d88a00', // ochre
  '#7a2e8c', // plum
  '#4f9a2f', // moss
  '#b0302a', // brick
  '#2f4fa8', // indigo
];
/**
 * The colour of a trace: the colour of its set (directly, or through its joint's set) in the order of the
 * round's sets, on light paper; the ink when it is not linked or its set is not known.
 */
export function traceColourBySet(
  setLabels: readonly string[],
  joints: readonly { id: string; setLabel?: string | null }[],
  colours: readonly string[] = SET_COLOURS_LIGHT,
): (trace: SketchTrace) => string {
  return (trace) => {
    const link = trace.link;
    if (link === null) return SKETCH_COLOURS.ink;
    const label = 'jointId' in link ? joints.find((j) => j.id === link.jointId)?.setLabel : link.setLabel;
    const i = label ? setLabels.indexOf(label) : -1;
    return i < 0 || colours.length === 0 ? SKETCH_COLOURS.ink : colours[i % colours.length];
  };
}

/** The heading's profile as the picture shows it, metres in the face frame. */
export interface SketchSvgProfile {
  /** The whole excavation line (a closed ring). */
  outline: readonly SketchPoint[];
  /** The round's stage part of it, drawn bold (default: the whole outline). */
  part?: readonly SketchPoint[];
  axisHeight?: number | null;
  springline?: number | null;
  benchLine?: number | null;
}

export interface SketchSvgOptions {
  /** Pixels per metre of the picture (default 60). */
  pxPerMetre?: number;
  /** Paper around the drawing, metres (default 1.5). */
  marginM?: number;
  /** A line of text at the top, e.g. the face's chainage. */
  title?: string;
  /** Colour of a trace (its set's colour); default the ink. */
  traceColour?: (trace: SketchTrace) => string;
  /** The round's photos pinned on the face (each photo keeps its own pin), numbered as in the gallery. */
  pins?: readonly SketchSvgPin[];
}

/** A photo's pin: its number in the round's gallery and its spot, metres in the face frame. */
export interface SketchSvgPin {
  number: number;
  at: SketchPoint;
}

/** The pin's disc: this far above its spot, and this big, px (the canvas draws the same). */
export const SKETCH_PIN_DISC_RISE_PX = 26;
export const SKETCH_PIN_DISC_RADIUS_PX = 12;

/** Where the face frame lies in the picture. */
export interface SketchSvgView {
  scale: number;
  minX: number;
  maxY: number;
  width: number;
  height: number;
}

export const SKETCH_SVG_TRACE_WIDTH_PX = 4;

const pointsOf = (doc: SketchDocument): SketchPoint[] =>
  doc.elements.flatMap((e) => ('points' in e ? e.points : [e.at]));

/** The picture's size and placement: the profile and every element, with the margin all round. */
export function sketchSvgView(
  doc: SketchDocument,
  profile: SketchSvgProfile,
  options: SketchSvgOptions = {},
): SketchSvgView {
  const scale = options.pxPerMetre ?? 60;
  const margin = options.marginM ?? 1.5;
  const all = [...profile.outline, ...pointsOf(doc), ...(options.pins ?? []).map((p) => p.at)];
  if (all.length === 0) throw new RangeError('A sketch picture needs the profile outline.');
  const xs = all.map((p) => p[0]);
  const ys = all.map((p) => p[1]);
  const minX = Math.min(...xs) - margin;
  const maxX = Math.max(...xs) + margin;
  const minY = Math.min(...ys) - margin;
  const maxY = Math.max(...ys) + margin;
  return {
    scale,
    minX,
    maxY,
    width: Math.ceil((maxX - minX) * scale),
    height: Math.ceil((maxY - minY) * scale),
  };
}

/** A face-frame point in picture pixels. */
export const svgPx = (v: SketchSvgView, p: SketchPoint): [number, number] => [
  (p[0] - v.minX) * v.scale,
  (v.maxY - p[1]) * v.scale,
];

const n = (v: number) => String(Math.round(v * 100) / 100);

export const escapeXml = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

const FONT = `font-family="Open Sans, DejaVu Sans, sans-serif"`;

function waterMark(v: SketchSvgView, w: SketchWater): string {
  const [x, y] = svgPx(v, w.at);
  const c = SKETCH_COLOURS.water;
  switch (w.state) {
    case 'damp':
      return `<circle cx="${n(x)}" cy="${n(y)}" r="9" fill="none" stroke="${c}" stroke-width="2" stroke-dasharray="3 3"/>`;
    case 'dripping':
      return (
        `<circle cx="${n(x)}" cy="${n(y)}" r="9" fill="none" stroke="${c}" stroke-width="2"/>` +
        `<line x1="${n(x)}" y1="${n(y + 9)}" x2="${n(x)}" y2="${n(y + 20)}" stroke="${c}" stroke-width="2"/>` +
        `<circle cx="${n(x)}" cy="${n(y + 24)}" r="3" fill="${c}"/>`
      );
    case 'flowing':
      return (
        `<circle cx="${n(x)}" cy="${n(y)}" r="9" fill="${c}"/>` +
        `<polyline points="${n(x)},${n(y + 9)} ${n(x - 5)},${n(y + 17)} ${n(x + 5)},${n(y + 25)} ${n(x)},${n(y + 33)}" fill="none" stroke="${c}" stroke-width="2"/>` +
        (w.inflowLpm !== null
          ? `<text x="${n(x + 12)}" y="${n(y + 4)}" font-size="13" fill="${c}" ${FONT}>${escapeXml(`${w.inflowLpm} l/min`)}</text>`
          : '')
      );
  }
}

const pathOf = (v: SketchSvgView, points: readonly SketchPoint[]) =>
  points.map((p) => svgPx(v, p).map(n).join(',')).join(' ');

/**
 * The sketch as a standalone SVG document: paper, 1 m grid, the excavation line (the stage part bold),
 * axis, springline and bench line, then traces, overbreak outlines with their areas, water marks and
 * labels, the photo pins, and a 1 m scale bar.
 */
export function sketchToSvg(
  doc: SketchDocument,
  profile: SketchSvgProfile,
  options: SketchSvgOptions = {},
): string {
  const v = sketchSvgView(doc, profile, options);
  const out: string[] = [];
  const c = SKETCH_COLOURS;
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${v.width}" height="${v.height}" viewBox="0 0 ${v.width} ${v.height}">`,
    `<rect x="0" y="0" width="${v.width}" height="${v.height}" fill="${c.paper}"/>`,
  );
  // 1 m grid, every fifth metre darker
  const minY = v.maxY - v.height / v.scale;
  const maxX = v.minX + v.width / v.scale;
  out.push('<g stroke-width="1">');
  for (let m = Math.ceil(v.minX); m <= Math.floor(maxX); m++) {
    const [x] = svgPx(v, [m, 0]);
    out.push(
      `<line x1="${n(x)}" y1="0" x2="${n(x)}" y2="${v.height}" stroke="${m % 5 === 0 ? c.gridMajor : c.grid}"/>`,
    );
  }
  for (let m = Math.ceil(minY); m <= Math.floor(v.maxY); m++) {
    const [, y] = svgPx(v, [0, m]);
    out.push(
      `<line x1="0" y1="${n(y)}" x2="${v.width}" y2="${n(y)}" stroke="${m % 5 === 0 ? c.gridMajor : c.grid}"/>`,
    );
  }
  out.push('</g>');
  // the excavation line
  const half = Math.max(...profile.outline.map((p) => Math.abs(p[0])));
  out.push(
    `<polygon points="${pathOf(v, profile.outline)}" fill="none" stroke="${c.otherStage}" stroke-width="1.5" stroke-dasharray="6 4"/>`,
    `<polygon points="${pathOf(v, profile.part ?? profile.outline)}" fill="none" stroke="${c.excavation}" stroke-width="3"/>`,
  );
  const across = (y: number, colour: string, dash: string, text: string) => {
    const [x1, py] = svgPx(v, [-half - 0.3, y]);
    const [x2] = svgPx(v, [half + 0.3, y]);
    out.push(
      `<line x1="${n(x1)}" y1="${n(py)}" x2="${n(x2)}" y2="${n(py)}" stroke="${colour}" stroke-width="1" stroke-dasharray="${dash}"/>`,
      `<text x="${n(x2 + 6)}" y="${n(py + 4)}" font-size="12" fill="${colour}" ${FONT}>${escapeXml(text)}</text>`,
    );
  };
  if (profile.axisHeight !== null && profile.axisHeight !== undefined)
    across(profile.axisHeight, c.axis, '10 4 2 4', 'Axis');
  if (profile.springline !== null && profile.springline !== undefined)
    across(profile.springline, c.muted, '2 4', 'Springline');
  if (profile.benchLine !== null && profile.benchLine !== undefined)
    across(profile.benchLine, c.ink, '12 6', 'Bench line');
  const [cx0, cy0] = svgPx(v, [0, Math.min(...profile.outline.map((p) => p[1])) - 0.4]);
  const [, cy1] = svgPx(v, [0, Math.max(...profile.outline.map((p) => p[1])) + 0.4]);
  out.push(
    `<line x1="${n(cx0)}" y1="${n(cy0)}" x2="${n(cx0)}" y2="${n(cy1)}" stroke="${c.axis}" stroke-width="1" stroke-dasharray="10 4 2 4"/>`,
  );
  const wallY =
    (Math.min(...profile.outline.map((p) => p[1])) + Math.max(...profile.outline.map((p) => p[1]))) / 2;
  const [lx, ly] = svgPx(v, [-half - 0.2, wallY]);
  const [rx] = svgPx(v, [half + 0.2, wallY]);
  out.push(
    `<text x="${n(lx)}" y="${n(ly)}" font-size="13" fill="${c.ink}" text-anchor="end" ${FONT}>Left wall</text>`,
    `<text x="${n(rx)}" y="${n(ly)}" font-size="13" fill="${c.ink}" ${FONT}>Right wall</text>`,
  );
  // the document's elements, in their order
  for (const e of doc.elements) {
    switch (e.kind) {
      case 'trace':
        out.push(
          `<polyline data-id="${escapeXml(e.id)}" points="${pathOf(v, e.points)}" fill="none" stroke="${escapeXml(options.traceColour?.(e) ?? c.ink)}" stroke-width="${SKETCH_SVG_TRACE_WIDTH_PX}" stroke-linecap="round" stroke-linejoin="round"/>`,
        );
        break;
      case 'overbreak': {
        const cx = e.points.reduce((s, p) => s + p[0], 0) / e.points.length;
        const cy = e.points.reduce((s, p) => s + p[1], 0) / e.points.length;
        const [tx, ty] = svgPx(v, [cx, cy]);
        out.push(
          `<polygon data-id="${escapeXml(e.id)}" points="${pathOf(v, e.points)}" fill="${c.overbreakFill}" stroke="${c.overbreak}" stroke-width="2" stroke-dasharray="8 4"/>`,
          `<text x="${n(tx)}" y="${n(ty + 5)}" font-size="13" font-weight="bold" fill="${c.overbreak}" text-anchor="middle" ${FONT}>${overbreakArea(e.points).toFixed(2)} m²</text>`,
        );
        break;
      }
      case 'water':
        out.push(waterMark(v, e));
        break;
      case 'label': {
        const [x, y] = svgPx(v, e.at);
        out.push(
          `<text x="${n(x + 4)}" y="${n(y + 17)}" font-size="15" fill="${c.ink}" ${FONT}>${escapeXml(e.text)}</text>`,
        );
        break;
      }
    }
  }
  // photo pins over everything: a numbered disc on a short stem whose foot is the spot
  for (const pin of options.pins ?? []) {
    const [x, y] = svgPx(v, pin.at);
    const cy = y - SKETCH_PIN_DISC_RISE_PX;
    out.push(
      `<g data-pin="${pin.number}">`,
      `<line x1="${n(x)}" y1="${n(y)}" x2="${n(x)}" y2="${n(y - 14)}" stroke="${c.ink}" stroke-width="2"/>`,
      `<circle cx="${n(x)}" cy="${n(y)}" r="3" fill="${c.ink}"/>`,
      `<circle cx="${n(x)}" cy="${n(cy)}" r="${SKETCH_PIN_DISC_RADIUS_PX}" fill="${c.ink}" stroke="${c.paper}" stroke-width="2"/>`,
      `<text x="${n(x)}" y="${n(cy + 4.5)}" font-size="13" font-weight="bold" fill="${c.paper}" text-anchor="middle" ${FONT}>${pin.number}</text>`,
      '</g>',
    );
  }
  // title and a 1 m scale bar
  if (options.title)
    out.push(
      `<text x="12" y="22" font-size="15" font-weight="bold" fill="${c.ink}" ${FONT}>${escapeXml(options.title)}</text>`,
    );
  const barY = v.height - 16;
  out.push(
    `<rect x="12" y="${n(barY - 6)}" width="${n(v.scale)}" height="6" fill="${c.ink}"/>`,
    `<text x="${n(16 + v.scale)}" y="${n(barY)}" font-size="12" fill="${c.muted}" ${FONT}>1 m</text>`,
    '</svg>',
  );
  return out.join('\n');
}
