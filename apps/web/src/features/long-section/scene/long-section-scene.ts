// The long section as pure data: bands along chainage (one column per round) and the section through the
// axis with the traces of mapped faults, drawn from the API's long section. The same nodes are drawn on
// screen (React) and written to an SVG file, so both show the same picture.
import type { LongSection } from '@/api/resources/long-sections';

export type LongSectionNode =
  | {
      type: 'rect';
      x: number;
      y: number;
      w: number;
      h: number;
      fill: string;
      roundId?: string;
      title?: string;
    }
  | {
      type: 'line';
      x1: number;
      y1: number;
      x2: number;
      y2: number;
      stroke: string;
      width: number;
      dash?: string;
    }
  | {
      type: 'text';
      x: number;
      y: number;
      text: string;
      fill: string;
      size: number;
      anchor: 'start' | 'middle' | 'end';
    };

export interface LongSectionPalette {
  paper: string;
  ink: string;
  muted: string;
  grid: string;
  tunnel: string;
  ahead: string;
  trace: string;
  bar: string;
  levels: { green: string; amber: string; red: string };
  units: readonly string[];
}

export interface LongSectionScene {
  width: number;
  height: number;
  title: string;
  nodes: LongSectionNode[];
}

export const LABEL_WIDTH = 120;
const SECTION_HEIGHT = 170;
const BAND = 26;
const TALL_BAND = 56;

/** Q on a log scale from 0.001 to 1000 (the Q-system's range, Barton et al. 1974): 0 at the bottom, 1 at the top. */
export function qFraction(q: number): number {
  const f = (Math.log10(Math.max(q, 0.001)) + 3) / 6;
  return Math.min(1, Math.max(0, f));
}

/** A stable colour per rock unit name, from the palette's list. */
function unitColour(palette: LongSectionPalette, name: string): string {
  let h = 0;
  for (const ch of name) h = (h * 31 + ch.charCodeAt(0)) >>> 0;
  return palette.units[h % palette.units.length];
}

/**
 * The scene for the chainage window [from, to] (drawn left to right in increasing chainage).
 * `width` is the whole picture, the first LABEL_WIDTH pixels hold the band names.
 */
export function longSectionScene(
  data: LongSection,
  view: { from: number; to: number },
  palette: LongSectionPalette,
  width = 960,
  title = 'Long section',
): LongSectionScene {
  const nodes: LongSectionNode[] = [];
  const plot = width - LABEL_WIDTH - 8;
  const span = Math.max(view.to - view.from, 1e-6);
  const x = (ch: number) => LABEL_WIDTH + ((ch - view.from) / span) * plot;
  const visible = (a: number, b: number) => Math.max(a, b) >= view.from && Math.min(a, b) <= view.to;
  const clampX = (v: number) => Math.min(LABEL_WIDTH + plot, Math.max(LABEL_WIDTH, v));
  let y = 8;

  // The section through the axis: crown and invert lines, the face, the ground ahead, the traces.
  const crownY = y + 24;
  const scale = (SECTION_HEIGHT - 48) / Math.max(data.crownHeight + data.invertDepth, 1e-6);
  const invertY = crownY + (data.crownHeight + data.invertDepth) * scale;
  const hy = (h: number) => crownY + (data.crownHeight - h) * scale;
  nodes.push({
    type: 'text',
    x: 4,
    y: crownY + 14,
    text: 'Section',
    fill: palette.ink,
    size: 12,
    anchor: 'start',
  });
  if (data.faceChainage !== null) {
    const f = x(data.faceChainage);
    const aheadSign = data.chainageSense === 'decreasing' ? -1 : 1;
    const a = clampX(aheadSign === 1 ? f : LABEL_WIDTH);
    const b = clampX(aheadSign === 1 ? LABEL_WIDTH + plot : f);
    if (b > a)
      nodes.push({
        type: 'rect',
        x: a,
        y: crownY,
        w: b - a,
        h: invertY - crownY,
        fill: palette.ahead,
        title: 'Ahead of the face',
      });
  }
  for (const r of data.rounds) {
    if (!visible(r.fromChainage, r.faceChainage)) continue;
    const a = clampX(x(Math.min(r.fromChainage, r.faceChainage)));
    const b = clampX(x(Math.max(r.fromChainage, r.faceChainage)));
    nodes.push({
      type: 'rect',
      x: a,
      y: crownY,
      w: Math.max(b - a, 1),
      h: invertY - crownY,
      fill: palette.tunnel,
      roundId: r.id,
      title: `Round ${r.roundNumber}`,
    });
  }
  nodes.push({
    type: 'line',
    x1: LABEL_WIDTH,
    y1: crownY,
    x2: LABEL_WIDTH + plot,
    y2: crownY,
    stroke: palette.muted,
    width: 1,
  });
  nodes.push({
    type: 'line',
    x1: LABEL_WIDTH,
    y1: invertY,
    x2: LABEL_WIDTH + plot,
    y2: invertY,
    stroke: palette.muted,
    width: 1,
  });
  nodes.push({
    type: 'line',
    x1: LABEL_WIDTH,
    y1: hy(0),
    x2: LABEL_WIDTH + plot,
    y2: hy(0),
    stroke: palette.grid,
    width: 1,
    dash: '6 4',
  });
  if (data.faceChainage !== null && visible(data.faceChainage, data.faceChainage)) {
    const f = x(data.faceChainage);
    nodes.push({
      type: 'line',
      x1: f,
      y1: crownY - 12,
      x2: f,
      y2: invertY + 4,
      stroke: palette.ink,
      width: 2.5,
    });
    nodes.push({
      type: 'text',
      x: f,
      y: crownY - 14,
      text: 'face',
      fill: palette.ink,
      size: 11,
      anchor: 'middle',
    });
  }
  // Trace labels go in rows: one that would overlap a label already placed drops a row, inside the section
  // (several faults of one zone cross the crown within a few metres and would print over one another).
  const placed: Array<{ row: number; from: number; to: number }> = [];
  const labelRow = (cx: number, text: string, size: number): number => {
    const half = (text.length * size * 0.58) / 2 + 4;
    for (let row = 0; ; row += 1)
      if (!placed.some((p) => p.row === row && p.from < cx + half && cx - half < p.to)) {
        placed.push({ row, from: cx - half, to: cx + half });
        return row;
      }
  };
  for (const t of data.traces) {
    if (t.crownChainage === null || t.invertChainage === null) continue;
    if (!visible(t.crownChainage, t.invertChainage)) continue;
    const ahead = (t.crownAhead ?? 0) > 0 || (t.invertAhead ?? 0) > 0;
    nodes.push({
      type: 'line',
      x1: x(t.crownChainage),
      y1: crownY,
      x2: x(t.invertChainage),
      y2: invertY,
      stroke: palette.trace,
      width: 2.5,
      dash: ahead ? '8 4' : undefined,
    });
    const note =
      t.crownRoundsAhead !== null
        ? `${t.label}: crown in round ${t.crownRoundsAhead} ahead`
        : t.invertRoundsAhead !== null
          ? `${t.label}: invert in round ${t.invertRoundsAhead} ahead`
          : t.label;
    const row = labelRow(x(t.crownChainage), note, 11);
    nodes.push({
      type: 'text',
      x: x(t.crownChainage),
      y: row === 0 ? crownY - 2 : crownY + 2 + 12 * row,
      text: note,
      fill: palette.trace,
      size: 11,
      anchor: 'middle',
    });
  }
  y += SECTION_HEIGHT;

  const band = (label: string, h: number, draw: (top: number, h: number) => void) => {
    nodes.push({
      type: 'text',
      x: 4,
      y: y + Math.min(h, BAND) / 2 + 4,
      text: label,
      fill: palette.ink,
      size: 12,
      anchor: 'start',
    });
    nodes.push({
      type: 'line',
      x1: LABEL_WIDTH,
      y1: y + h,
      x2: LABEL_WIDTH + plot,
      y2: y + h,
      stroke: palette.grid,
      width: 1,
    });
    draw(y, h);
    y += h + 4;
  };
  const columns = data.rounds.filter((r) => visible(r.fromChainage, r.faceChainage));
  const colOf = (r: LongSection['rounds'][number]) => {
    const a = clampX(x(Math.min(r.fromChainage, r.faceChainage)));
    const b = clampX(x(Math.max(r.fromChainage, r.faceChainage)));
    return { a, w: Math.max(b - a - 0.5, 0.5) };
  };
  const bars =
    (value: (r: LongSection['rounds'][number]) => number | null, max: number, unit: string) =>
    (top: number, h: number) => {
      for (const r of columns) {
        const v = value(r);
        if (v === null) continue;
        const { a, w } = colOf(r);
        const bh = Math.max(1, Math.min(1, v / max) * h);
        nodes.push({
          type: 'rect',
          x: a,
          y: top + h - bh,
          w,
          h: bh,
          fill: palette.bar,
          roundId: r.id,
          title: `Round ${r.roundNumber}: ${v}${unit}`,
        });
      }
    };
  const codes = (value: (r: LongSection['rounds'][number]) => string | null) => (top: number, h: number) => {
    for (const r of columns) {
      const v = value(r);
      if (!v) continue;
      const { a, w } = colOf(r);
      nodes.push({
        type: 'rect',
        x: a,
        y: top + 2,
        w,
        h: h - 4,
        fill: palette.tunnel,
        roundId: r.id,
        title: `Round ${r.roundNumber}: ${v}`,
      });
      if (w > 22)
        nodes.push({
          type: 'text',
          x: a + w / 2,
          y: top + h / 2 + 4,
          text: v,
          fill: palette.ink,
          size: 11,
          anchor: 'middle',
        });
    }
  };

  band('Rock unit', BAND, (top, h) => {
    for (const r of columns) {
      if (!r.rockUnit) continue;
      const { a, w } = colOf(r);
      nodes.push({
        type: 'rect',
        x: a,
        y: top,
        w,
        h,
        fill: unitColour(palette, r.rockUnit),
        roundId: r.id,
        title: `Round ${r.roundNumber}: ${r.rockUnit}`,
      });
    }
  });
  band('Q (log)', TALL_BAND, (top, h) => {
    for (const q of [0.01, 1, 100]) {
      const gy = top + h - qFraction(q) * h;
      nodes.push({
        type: 'line',
        x1: LABEL_WIDTH,
        y1: gy,
        x2: LABEL_WIDTH + plot,
        y2: gy,
        stroke: palette.grid,
        width: 0.75,
        dash: '2 3',
      });
      nodes.push({
        type: 'text',
        x: LABEL_WIDTH - 4,
        y: gy + 4,
        text: String(q),
        fill: palette.muted,
        size: 10,
        anchor: 'end',
      });
    }
    for (const r of columns) {
      if (r.q === null) continue;
      const { a, w } = colOf(r);
      const bh = Math.max(1, qFraction(r.q) * h);
      nodes.push({
        type: 'rect',
        x: a,
        y: top + h - bh,
        w,
        h: bh,
        fill: palette.bar,
        roundId: r.id,
        title: `Round ${r.roundNumber}: Q ${r.q}`,
      });
    }
  });
  band(
    'RMR89',
    TALL_BAND,
    bars((r) => r.rmr, 100, ''),
  );
  band(
    'GSI',
    TALL_BAND,
    bars((r) => r.gsi, 100, ''),
  );
  band(
    'Recommended',
    BAND,
    codes((r) => r.recommendedClass),
  );
  band(
    'Confirmed',
    BAND,
    codes((r) => r.confirmedClass),
  );
  band(
    'Installed',
    BAND,
    codes((r) => r.installedClass),
  );
  band('Trigger', BAND, (top, h) => {
    for (const r of columns) {
      if (!r.triggerLevel) continue;
      const { a, w } = colOf(r);
      nodes.push({
        type: 'rect',
        x: a,
        y: top + 4,
        w,
        h: h - 8,
        fill: palette.levels[r.triggerLevel],
        roundId: r.id,
        title: `Round ${r.roundNumber}: ${r.triggerLevel}`,
      });
    }
  });
  const maxInflow = Math.max(1, ...columns.map((r) => r.inflowLpmPer10m ?? 0));
  band(
    'Inflow /10 m',
    TALL_BAND,
    bars((r) => r.inflowLpmPer10m, maxInflow, ' l/min per 10 m'),
  );
  const maxOver = Math.max(0.1, ...columns.map((r) => r.overbreakM3PerM ?? 0));
  band(
    'Overbreak /m',
    TALL_BAND,
    bars((r) => r.overbreakM3PerM, maxOver, ' m³/m'),
  );
  band('Hazards', BAND, (top, h) => {
    for (const z of data.hazards) {
      if (!visible(z.fromChainage, z.toChainage)) continue;
      const a = clampX(x(Math.min(z.fromChainage, z.toChainage)));
      const b = clampX(x(Math.max(z.fromChainage, z.toChainage)));
      nodes.push({
        type: 'rect',
        x: a,
        y: top + 3,
        w: Math.max(b - a, 2),
        h: h - 6,
        fill: palette.levels[z.level],
        title: `${z.kind}: ${z.description}`,
      });
    }
  });

  // The chainage scale.
  const step = niceStep(span / 8);
  for (let c = Math.ceil(view.from / step) * step; c <= view.to; c += step) {
    nodes.push({ type: 'line', x1: x(c), y1: y, x2: x(c), y2: y + 5, stroke: palette.muted, width: 1 });
    nodes.push({
      type: 'text',
      x: x(c),
      y: y + 18,
      text: c.toFixed(step < 1 ? 1 : 0),
      fill: palette.muted,
      size: 11,
      anchor: 'middle',
    });
  }
  y += 26;
  return { width, height: y, title, nodes };
}

/** 1, 2 or 5 times a power of ten, at least `raw`. */
export function niceStep(raw: number): number {
  const p = 10 ** Math.floor(Math.log10(Math.max(raw, 1e-6)));
  for (const m of [1, 2, 5, 10]) if (m * p >= raw) return m * p;
  return 10 * p;
}

const esc = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const n = (v: number): string => String(Math.round(v * 100) / 100);

/** The scene as a standalone SVG file's text, on the palette's paper. */
export function longSectionSvg(scene: LongSectionScene, paper: string): string {
  const body = scene.nodes.map((d) => {
    switch (d.type) {
      case 'rect':
        return `<rect x="${n(d.x)}" y="${n(d.y)}" width="${n(d.w)}" height="${n(d.h)}" fill="${esc(d.fill)}"/>`;
      case 'line':
        return `<line x1="${n(d.x1)}" y1="${n(d.y1)}" x2="${n(d.x2)}" y2="${n(d.y2)}" stroke="${esc(d.stroke)}" stroke-width="${n(d.width)}"${d.dash ? ` stroke-dasharray="${d.dash}"` : ''}/>`;
      case 'text':
        return `<text x="${n(d.x)}" y="${n(d.y)}" font-size="${n(d.size)}" fill="${esc(d.fill)}" text-anchor="${d.anchor}">${esc(d.text)}</text>`;
    }
  });
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(scene.width)}" height="${n(scene.height)}" viewBox="0 0 ${n(scene.width)} ${n(scene.height)}" font-family="'Open Sans', sans-serif">`,
    `<title>${esc(scene.title)}</title>`,
    `<rect width="100%" height="100%" fill="${esc(paper)}"/>`,
    ...body,
    '</svg>',
  ].join('');
}
