// The stereonet as a scene: plain data (circles, paths, text, groups) built from geomath's projection
// functions. No DOM and no React, so the screen (components/stereonet.tsx), the SVG download
// (scene-svg.ts) and later the server's PDFs draw the very same scene. Lower hemisphere; net
// coordinates x east, y north; SVG coordinates y down.
import type { JointKind } from '@roundbook/domain';
import {
  PARALLEL_LIMIT,
  densityContours,
  densityGrid,
  densityLegend,
  formatPlane,
  greatCircle,
  intersectionOf,
  poleOf,
  project,
  smallCircle,
} from '@roundbook/geomath';
import type { Drive, Line, Net, Plane, TerzaghiSampling } from '@roundbook/geomath';
import type { FreeSurface } from './daylight';
import { daylightEnvelope, surfacesOf } from './daylight';
import type { StereonetPalette } from './palette';
import { PRINT_PALETTE, setColour } from './palette';
import { KIND_STYLES, RANDOM_SHAPE, markPath, setShape, shapePath } from './symbols';

export interface SceneStyle {
  stroke?: string;
  fill?: string;
  /** Line width, px. */
  width?: number;
  dash?: string;
  opacity?: number;
  fillOpacity?: number;
  fillRule?: 'evenodd' | 'nonzero';
}

export type SceneNode =
  | ({ type: 'circle'; role: string; cx: number; cy: number; r: number } & SceneStyle)
  | ({ type: 'path'; role: string; d: string } & SceneStyle)
  | {
      type: 'text';
      role: string;
      x: number;
      y: number;
      text: string;
      size: number;
      fill: string;
      anchor: 'start' | 'middle' | 'end';
      weight?: number;
      /** Outline in this colour behind the letters, so a label stays legible over poles and contours. */
      halo?: string;
    }
  | { type: 'group'; role: string; clip?: 'primitive'; children: SceneNode[] };

/** One discontinuity to draw as a pole. */
export interface StereonetJoint {
  id: string;
  kind: JointKind;
  plane: Plane;
  /** Set label ('S1', …) or null for a pole in no set. */
  set: string | null;
}

/** A set to draw: its mean pole, α95 cone and (on request) the great circle of its mean plane. */
export interface StereonetSet {
  label: string;
  /** Mean plane (its pole is drawn). */
  mean: Plane;
  alpha95: number | null;
}

export interface StereonetOptions {
  /** Width and height of the net part of the scene, px. */
  size: number;
  net?: Net;
  grid?: boolean;
  /** 'sets': the great circle of each set's mean plane; 'all': of every joint (up to 400). */
  greatCircles?: 'none' | 'sets' | 'all';
  /** Kamb (1959) density contours in multiples of σ. */
  contours?: boolean;
  /** Weights for the density (Terzaghi), one per joint, and the words saying which weighting it is. */
  weighting?: { weights: number[]; label: string; sampling: TerzaghiSampling } | null;
  /** The drive at the face: tunnel axis and drive direction; the adverse zone is shaded around it. */
  drive?: Drive | null;
  /** Strike-to-axis tolerance of the adverse zone, degrees (default geomath's PARALLEL_LIMIT, 30°). */
  adverseTolerance?: number;
  palette?: StereonetPalette;
  /** Add the legend below the net (the scene grows taller). */
  legend?: boolean;
  /**
   * Friction circle at φ degrees (off when null/absent): the small circle about the vertical at φ from the
   * centre, so the poles of planes dipping less than φ fall inside it (pole-plot convention).
   */
  frictionAngle?: number | null;
  /** Daylight envelopes of these free surfaces (drawn only with a drive). */
  daylight?: readonly FreeSurface[];
  /** Mark the intersection line of each pair of set means. */
  intersections?: boolean;
}

/** Where the intersection line of two set means was drawn, for picking and for the readout. */
export interface DrawnLine {
  id: string;
  /** "S1×S2". */
  label: string;
  x: number;
  y: number;
  line: Line;
  planes: [Plane, Plane];
}

/** Where a pole was drawn, for picking and for the readout. */
export interface DrawnPole {
  id: string;
  index: number;
  x: number;
  y: number;
  kind: JointKind;
  set: string | null;
  plane: Plane;
  pole: Line;
}

export interface StereonetScene {
  width: number;
  height: number;
  centre: { x: number; y: number };
  radius: number;
  net: Net;
  /** Accessible summary of what is drawn. */
  title: string;
  nodes: SceneNode[];
  poles: DrawnPole[];
  /** Intersection lines of set pairs as drawn (empty unless asked). */
  lines: DrawnLine[];
  /** Legend lines (also drawn in the scene when `legend` is on). */
  legendLines: string[];
  /** Density legend, e.g. "multiples of σ, Kamb 1959; uniform = 3σ", or null without contours. */
  densityLegend: string | null;
  /** Why something asked for is not drawn (e.g. too few poles for contours). */
  notes: string[];
}

/** Fewer poles than this give no contours (Kamb's cap would cover much of the net). */
export const CONTOUR_MIN_POLES = 5;
/** At most this many great circles of single joints are drawn. */
export const GREAT_CIRCLE_LIMIT = 400;
/** Density grid cells per side. */
const DENSITY_CELLS = 60;
/** Planes dipping less than this are "fair" whatever their strike (Bieniawski 1989, Table 4.1F). */
const GENTLE_DIP = 20;
const STEEP_DIP = 45;

const f = (n: number): string => String(Math.round(n * 100) / 100);

/** Dash pattern of each free surface's envelope outline (in line widths), so two drawn together differ. */
const SURFACE_DASH: Record<FreeSurface, number[]> = {
  'left wall': [],
  'right wall': [6, 3],
  crown: [2, 2],
  face: [9, 3, 2, 3],
};

/** Words for what daylighting means on each surface (legend). */
const SURFACE_WORDS: Record<FreeSurface, string> = {
  'left wall': 'the left wall (they dip into the tunnel from the left, less steeply than the wall)',
  'right wall': 'the right wall (they dip into the tunnel from the right, less steeply than the wall)',
  crown:
    'the crown (they dip out of the roof, more steeply than the roof slopes that way — for a near-level drive almost every plane)',
  face: 'the face (they dip back out of the face, less steeply than the face)',
};

const lineText = (l: Line): string =>
  `${String(Math.round(l.trend) % 360).padStart(3, '0')}/${String(Math.round(l.plunge)).padStart(2, '0')}`;

/** Six-pointed star of "radius" r (the intersection symbol, Roundbook design). */
function starPath(x: number, y: number, r: number): string {
  const pts: string[] = [];
  for (let i = 0; i < 12; i++) {
    const a = (Math.PI * i) / 6;
    const rr = i % 2 === 0 ? r : r * 0.45;
    pts.push(`${i === 0 ? 'M' : 'L'}${f(x + rr * Math.sin(a))} ${f(y - rr * Math.cos(a))}`);
  }
  return pts.join(' ') + ' Z';
}

export const netLabels: Record<Net, string> = {
  'equal-area': 'Equal-area',
  'equal-angle': 'Equal-angle',
};

/** Set labels in the order their colours and shapes are given (S1, S2, … then others by name). */
export function setOrder(labels: Iterable<string>): string[] {
  const unique = [...new Set(labels)];
  const num = (s: string): number => {
    const m = /^S(\d+)$/.exec(s);
    return m ? Number(m[1]) : Number.POSITIVE_INFINITY;
  };
  return unique.sort((a, b) => num(a) - num(b) || a.localeCompare(b));
}

export function buildStereonetScene(
  joints: readonly StereonetJoint[],
  sets: readonly StereonetSet[],
  options: StereonetOptions,
): StereonetScene {
  const size = options.size;
  const net = options.net ?? 'equal-area';
  const palette = options.palette ?? PRINT_PALETTE;
  const font = Math.max(11, Math.round(size * 0.03));
  const margin = Math.round(font * 2.6);
  const radius = size / 2 - margin;
  const cx = size / 2;
  const cy = size / 2;
  const line = Math.max(1, size / 400);
  const at = (l: Line): { x: number; y: number } => {
    const p = project(l, net, radius);
    return { x: cx + p.x, y: cy - p.y };
  };
  const polyline = (lines: Line[], breakJumps = false): string => {
    let d = '';
    let prev: { x: number; y: number } | null = null;
    for (const l of lines) {
      const p = at(l);
      const jump = prev !== null && breakJumps && Math.hypot(p.x - prev.x, p.y - prev.y) > radius;
      d += `${prev === null || jump ? 'M' : 'L'}${f(p.x)} ${f(p.y)} `;
      prev = p;
    }
    return d.trim();
  };

  const labels = setOrder([...sets.map((s) => s.label), ...joints.flatMap((j) => (j.set ? [j.set] : []))]);
  const setIndex = new Map(labels.map((l, i) => [l, i]));
  const nodes: SceneNode[] = [];
  const notes: string[] = [];
  const legendLines: string[] = [];

  nodes.push({ type: 'circle', role: 'paper', cx, cy, r: radius, fill: palette.paper });

  // Adverse zone: poles of planes striking within the tolerance of the axis (two opposite sectors).
  const drive = options.drive ?? null;
  const tolerance = options.adverseTolerance ?? PARALLEL_LIMIT;
  if (drive) {
    const zone = (fromDip: number, toDip: number): string => {
      let d = '';
      for (const side of [90, 270]) {
        const centre = drive.trend + side;
        const outer: Line[] = [];
        const inner: Line[] = [];
        for (let i = 0; i <= 24; i++) {
          const t = centre - tolerance + (2 * tolerance * i) / 24;
          outer.push({ trend: t, plunge: 90 - toDip });
          inner.push({ trend: t, plunge: 90 - fromDip });
        }
        d += polyline([...outer, ...inner.reverse()]) + ' Z ';
      }
      return d.trim();
    };
    nodes.push({
      type: 'path',
      role: 'adverse-steep',
      d: zone(STEEP_DIP, 90),
      fill: palette.adverseStrong,
    });
    nodes.push({
      type: 'path',
      role: 'adverse-moderate',
      d: zone(GENTLE_DIP, STEEP_DIP),
      fill: palette.adverseWeak,
    });
    legendLines.push(
      `Shaded: poles of planes striking within ${tolerance}° of the tunnel axis — darker dipping 45–90°, lighter 20–45° (RMR89 Table F, strike parallel to the axis)`,
    );
  }

  if (options.grid) {
    let d = '';
    for (let p = 10; p < 90; p += 10) {
      const ring: Line[] = [];
      for (let t = 0; t <= 360; t += 5) ring.push({ trend: t, plunge: p });
      d += polyline(ring) + ' ';
    }
    for (let t = 0; t < 360; t += 10) {
      d +=
        polyline([
          { trend: t, plunge: 0 },
          { trend: t, plunge: 80 },
        ]) + ' ';
    }
    nodes.push({ type: 'path', role: 'grid', d: d.trim(), stroke: palette.grid, width: line * 0.6 });
    legendLines.push('Grid: plunge rings every 10°, trends every 10°');
  }

  // Density contours (Kamb 1959, multiples of σ), clipped to the primitive.
  let legendText: string | null = null;
  const poles = joints.map((j) => poleOf(j.plane));
  if (options.contours) {
    if (joints.length < CONTOUR_MIN_POLES) {
      notes.push(`Contours need at least ${CONTOUR_MIN_POLES} poles; ${joints.length} in view.`);
    } else {
      const grid = densityGrid(poles, {
        method: 'kamb',
        net,
        cells: DENSITY_CELLS,
        units: 'multiples-of-sigma',
        weights: options.weighting?.weights,
      });
      let max = 0;
      for (const v of grid.values) max = Math.max(max, v);
      const levels: number[] = [];
      for (let l = 2; l <= max && levels.length < 12; l += 2) levels.push(l);
      const children: SceneNode[] = densityContours(grid, levels).map((c, i) => ({
        type: 'path' as const,
        role: `contour-${c.level}`,
        d: c.polygons
          .map((poly) =>
            poly
              .map(
                (ring) =>
                  ring
                    .map(([x, y], k) => `${k === 0 ? 'M' : 'L'}${f(cx + x * radius)} ${f(cy - y * radius)}`)
                    .join(' ') + ' Z',
              )
              .join(' '),
          )
          .join(' '),
        fill: palette.contourFill,
        // Light fills that deepen by level, so the poles on top stay readable (lines carry the levels).
        fillOpacity: Math.min(0.32, 0.06 + 0.035 * i),
        fillRule: 'evenodd' as const,
        stroke: palette.contourLine,
        width: line * 0.8,
      }));
      nodes.push({ type: 'group', role: 'contours', clip: 'primitive', children });
      legendText = densityLegend(grid);
      legendLines.push(
        `Contours at ${levels.length > 0 ? levels.map((l) => `${l}σ`).join(', ') : '— (no cell reaches 2σ)'}: ${legendText}`,
      );
    }
  }
  if (options.weighting) legendLines.push(options.weighting.label);

  // Daylight envelopes: regions of poles whose planes daylight on a free surface (daylight.ts).
  const labelNodes: SceneNode[] = [];
  const asked = options.daylight ?? [];
  if (asked.length > 0 && !drive) notes.push('Daylight envelopes need the drive at the face.');
  if (drive && asked.length > 0) {
    const children: SceneNode[] = [];
    for (const s of surfacesOf(drive)) {
      if (!asked.includes(s.surface)) continue;
      const env = daylightEnvelope(s);
      const role = `daylight-${s.surface.replace(' ', '-')}`;
      children.push({
        type: 'path',
        role,
        d: `${polyline(env.outer)} Z ${polyline([...env.inner].reverse())} Z`,
        fill: palette.daylight,
        fillOpacity: 0.16,
        fillRule: 'evenodd',
        stroke: palette.daylight,
        width: line * 1.8,
        dash: SURFACE_DASH[s.surface].length
          ? SURFACE_DASH[s.surface].map((v) => f(v * line)).join(' ')
          : undefined,
      });
      // Name the region where it is widest, half-way across it.
      const w = env.widest;
      const mid = at({ trend: w.trend, plunge: 90 - (w.low + w.high) / 2 });
      labelNodes.push({
        type: 'text',
        role: `${role}-label`,
        x: mid.x,
        y: mid.y + font * 0.35,
        text: s.surface,
        size: font * 0.9,
        fill: palette.daylight,
        anchor: 'middle',
        weight: 700,
        halo: palette.paper,
      });
      legendLines.push(
        `Tinted region (${s.surface}): poles of planes that daylight on ${SURFACE_WORDS[s.surface]}; from the drive at the face`,
      );
    }
    nodes.push({ type: 'group', role: 'daylight', clip: 'primitive', children });
  }

  // Great circles.
  const circleMode = options.greatCircles ?? 'none';
  if (circleMode !== 'none') {
    const chosen: Array<{ plane: Plane; colour: string; role: string }> =
      circleMode === 'sets'
        ? sets.map((s) => ({
            plane: s.mean,
            colour: setColour(palette, setIndex.get(s.label) ?? 0),
            role: `great-circle-${s.label}`,
          }))
        : joints.slice(0, GREAT_CIRCLE_LIMIT).map((j) => ({
            plane: j.plane,
            colour: j.set ? setColour(palette, setIndex.get(j.set) ?? 0) : palette.random,
            role: `great-circle-${j.id}`,
          }));
    if (circleMode === 'all' && joints.length > GREAT_CIRCLE_LIMIT) {
      notes.push(`Great circles of the first ${GREAT_CIRCLE_LIMIT} of ${joints.length} joints drawn.`);
    }
    nodes.push({
      type: 'group',
      role: 'great-circles',
      clip: 'primitive',
      children: chosen.map((c) => ({
        type: 'path' as const,
        role: c.role,
        d: polyline(greatCircle(c.plane, 90)),
        stroke: c.colour,
        width: line * (circleMode === 'sets' ? 1.4 : 0.7),
      })),
    });
  }

  // Friction circle: about the vertical at φ from the centre (poles of planes gentler than φ inside).
  const phi = options.frictionAngle;
  if (phi !== null && phi !== undefined && Number.isFinite(phi) && phi > 0 && phi < 90) {
    const ring = smallCircle({ trend: 0, plunge: 90 }, phi, 180);
    nodes.push({
      type: 'path',
      role: 'friction-circle',
      d: polyline(ring) + ' Z',
      stroke: palette.friction,
      width: line * 2,
      dash: `${f(line * 1.5)} ${f(line * 3)}`,
    });
    const tag = at({ trend: 180, plunge: 90 - phi });
    labelNodes.push({
      type: 'text',
      role: 'friction-label',
      x: tag.x,
      y: tag.y - font * 0.45,
      text: `φ ${phi}°`,
      size: font * 0.85,
      fill: palette.friction,
      anchor: 'middle',
      weight: 700,
      halo: palette.paper,
    });
    legendLines.push(
      `Dotted circle: friction circle, φ = ${phi}° — poles inside it are of planes dipping less than φ, too gentle to slide on friction alone (pole plot; Hoek & Bray 1981, from memory)`,
    );
  }

  // Tunnel axis (dashed diameter along the drive's trend) and the drive direction (arrow outside).
  if (drive) {
    const a = at({ trend: drive.trend, plunge: 0 });
    const b = at({ trend: drive.trend + 180, plunge: 0 });
    nodes.push({
      type: 'path',
      role: 'tunnel-axis',
      d: `M${f(b.x)} ${f(b.y)} L${f(a.x)} ${f(a.y)}`,
      stroke: palette.axis,
      width: line * 1.6,
      dash: `${f(line * 8)} ${f(line * 5)}`,
    });
    const t = (drive.trend * Math.PI) / 180;
    const ux = Math.sin(t);
    const uy = -Math.cos(t);
    const tip = radius + font * 1.15;
    const base = radius + font * 0.2;
    const half = font * 0.45;
    const p = (r: number, side: number) => `${f(cx + ux * r - uy * side)} ${f(cy + uy * r + ux * side)}`;
    nodes.push({
      type: 'path',
      role: 'drive-arrow',
      d: `M${p(tip, 0)} L${p(base, half)} L${p(base, -half)} Z`,
      fill: palette.axis,
    });
    const plunge =
      Math.abs(drive.plunge) < 0.05
        ? 'level'
        : drive.plunge > 0
          ? `down ${drive.plunge.toFixed(1)}°`
          : `up ${(-drive.plunge).toFixed(1)}°`;
    legendLines.push(
      `Dashed line: tunnel axis; arrow: drive direction ${String(Math.round(((drive.trend % 360) + 360) % 360)).padStart(3, '0')}° (${plunge})`,
    );
  }

  // Primitive, degree scale and cardinal marks.
  nodes.push({
    type: 'circle',
    role: 'primitive',
    cx,
    cy,
    r: radius,
    stroke: palette.ink,
    width: line * 1.5,
  });
  let ticks = '';
  for (let deg = 0; deg < 360; deg += 10) {
    const t = (deg * Math.PI) / 180;
    const len = deg % 90 === 0 ? font * 0.7 : deg % 30 === 0 ? font * 0.5 : font * 0.3;
    const sx = Math.sin(t);
    const sy = -Math.cos(t);
    ticks += `M${f(cx + sx * radius)} ${f(cy + sy * radius)} L${f(cx + sx * (radius + len))} ${f(cy + sy * (radius + len))} `;
    if (deg % 30 === 0) {
      const cardinal = { 0: 'N', 90: 'E', 180: 'S', 270: 'W' }[deg];
      const lr = radius + font * 1.75;
      nodes.push({
        type: 'text',
        role: cardinal ? `cardinal-${cardinal}` : `degree-${deg}`,
        x: cx + sx * lr,
        y: cy + sy * lr + font * 0.36,
        text: cardinal ?? String(deg).padStart(3, '0'),
        size: cardinal ? font * 1.1 : font * 0.8,
        fill: cardinal ? palette.ink : palette.muted,
        anchor: 'middle',
        weight: cardinal ? 700 : 400,
      });
    }
  }
  nodes.push({ type: 'path', role: 'degree-scale', d: ticks.trim(), stroke: palette.ink, width: line });

  // Poles: one path per style (set × kind), so thousands of poles stay cheap to draw.
  const r = Math.max(3.5, size * 0.011);
  const drawn: DrawnPole[] = [];
  const styles = new Map<string, { colour: string; kind: JointKind; body: string; mark: string }>();
  joints.forEach((j, index) => {
    const pole = poles[index];
    const p = at(pole);
    drawn.push({ id: j.id, index, x: p.x, y: p.y, kind: j.kind, set: j.set, plane: j.plane, pole });
    const si = j.set === null ? -1 : (setIndex.get(j.set) ?? 0);
    const key = `${si}|${j.kind}`;
    let s = styles.get(key);
    if (!s) {
      s = { colour: si < 0 ? palette.random : setColour(palette, si), kind: j.kind, body: '', mark: '' };
      styles.set(key, s);
    }
    const shape = si < 0 ? RANDOM_SHAPE : setShape(si);
    s.body += shapePath(shape, p.x, p.y, r) + ' ';
    s.mark += markPath(KIND_STYLES[j.kind].mark, p.x, p.y, r) + ' ';
  });
  const poleNodes: SceneNode[] = [];
  // A paper-coloured outline under every pole keeps it apart from contours, circles and its neighbours.
  for (const [key, s] of styles) {
    poleNodes.push({
      type: 'path',
      role: `pole-halos-${key}`,
      d: s.body.trim(),
      stroke: palette.paper,
      width: line * 3,
    });
  }
  for (const [key, s] of styles) {
    const style = KIND_STYLES[s.kind];
    const solid = style.fill === 'solid';
    poleNodes.push({
      type: 'path',
      role: `poles-${key}`,
      d: s.body.trim(),
      fill: solid ? s.colour : palette.paper,
      fillOpacity: solid ? 1 : 0.6,
      stroke: s.colour,
      width: line * style.outline * 1.1,
    });
    if (style.mark !== 'none') {
      poleNodes.push({
        type: 'path',
        role: `pole-marks-${key}`,
        d: s.mark.trim(),
        ...(style.mark === 'dot'
          ? { fill: s.colour }
          : { stroke: solid ? palette.paper : s.colour, width: line * 1.1 }),
      });
    }
  }
  nodes.push({ type: 'group', role: 'poles', children: poleNodes });

  // Set means with their α95 cones and labels.
  const means: SceneNode[] = [];
  for (const s of sets) {
    const si = setIndex.get(s.label) ?? 0;
    const colour = setColour(palette, si);
    const mp = at(poleOf(s.mean));
    if (s.alpha95 !== null && Number.isFinite(s.alpha95) && s.alpha95 > 0) {
      means.push({
        type: 'path',
        role: `cone-${s.label}`,
        d: polyline(smallCircle(poleOf(s.mean), Math.min(s.alpha95, 90), 90), true),
        stroke: colour,
        width: line * 1.3,
        dash: `${f(line * 3)} ${f(line * 2)}`,
      });
    }
    means.push({
      type: 'path',
      role: `mean-${s.label}`,
      d: shapePath(setShape(si), mp.x, mp.y, r * 1.9),
      fill: palette.paper,
      fillOpacity: 0.5,
      stroke: colour,
      width: line * 2.4,
    });
    // Label to the side of the mean away from the centre, pulled inside the primitive.
    const dx = mp.x - cx;
    const dy = mp.y - cy;
    const away =
      Math.hypot(dx, dy) < 1 ? { x: 1, y: 0 } : { x: dx / Math.hypot(dx, dy), y: dy / Math.hypot(dx, dy) };
    const inward = Math.hypot(dx, dy) > radius - font * 2.2;
    const sign = inward ? -1 : 1;
    means.push({
      type: 'text',
      role: `mean-label-${s.label}`,
      x: mp.x + sign * away.x * (r * 2 + font * 0.9),
      y: mp.y + sign * away.y * (r * 2 + font * 0.9) + font * 0.35,
      text: s.label,
      size: font,
      fill: colour,
      anchor: 'middle',
      weight: 700,
      halo: palette.paper,
    });
  }
  nodes.push({ type: 'group', role: 'set-means', children: means });
  if (sets.length > 0)
    legendLines.push('Large outlined symbol: set mean pole; dashed ring: its α95 cone (Fisher 1953)');

  // Intersection lines of each pair of set means (geomath intersectionOf), with their labels.
  const drawnLines: DrawnLine[] = [];
  if (options.intersections) {
    const marks: SceneNode[] = [];
    const ordered = [...sets].sort((a, b) => (setIndex.get(a.label) ?? 0) - (setIndex.get(b.label) ?? 0));
    for (let i = 0; i < ordered.length; i++) {
      for (let k = i + 1; k < ordered.length; k++) {
        const a = ordered[i];
        const b = ordered[k];
        const l = intersectionOf(a.mean, b.mean);
        if (l === null) continue;
        const label = `${a.label}×${b.label}`;
        const p = at(l);
        drawnLines.push({ id: `x:${label}`, label, x: p.x, y: p.y, line: l, planes: [a.mean, b.mean] });
        marks.push({
          type: 'path',
          role: `intersection-${label}`,
          d: starPath(p.x, p.y, r * 1.7),
          fill: palette.intersection,
          stroke: palette.paper,
          width: line * 1.2,
        });
        // Label beside the star, toward the centre when it sits near the primitive (clear of the marks).
        const dx = p.x - cx;
        const dy = p.y - cy;
        const dist = Math.hypot(dx, dy);
        const nearEdge = dist > radius - font * 3;
        const ux = dist < 1 ? 0 : dx / dist;
        const uy = dist < 1 ? -1 : dy / dist;
        const off = r * 1.7 + font * 0.6;
        const lx = nearEdge ? p.x - ux * (off + font) : p.x + (dist < 1 ? 0 : ux * off);
        const ly = nearEdge ? p.y - uy * (off + font * 0.4) : p.y + (dist < 1 ? -off : uy * off);
        marks.push({
          type: 'text',
          role: `intersection-label-${label}`,
          x: lx,
          y: ly + font * 0.35,
          text: label,
          size: font * 0.85,
          fill: palette.intersection,
          anchor: 'middle',
          weight: 700,
          halo: palette.paper,
        });
      }
    }
    nodes.push({ type: 'group', role: 'intersections', children: marks });
    if (sets.length < 2) notes.push('Intersection lines need at least two sets.');
    else {
      const [a, b] = ordered;
      legendLines.push(
        `Six-pointed star: line of intersection of two set means (${a.label}×${b.label}: where sets ${a.label} and ${b.label} meet), plotted as a line by trend and plunge`,
      );
    }
  }
  if (labelNodes.length > 0) nodes.push({ type: 'group', role: 'overlay-labels', children: labelNodes });

  const title = `${netLabels[net]} lower-hemisphere stereonet: ${joints.length} pole${joints.length === 1 ? '' : 's'}, ${sets.length} set${sets.length === 1 ? '' : 's'}${legendText ? `, contours in ${legendText}` : ''}`;

  let height = size;
  if (options.legend) {
    const lh = font * 1.35;
    const maxChars = Math.max(30, Math.floor((size - 2 * font) / (font * 0.52)));
    const lines = [`${netLabels[net]} net, lower hemisphere`, ...legendLines].flatMap((l) =>
      wrap(l, maxChars),
    );
    lines.forEach((text, i) => {
      nodes.push({
        type: 'text',
        role: 'legend',
        x: font,
        y: size + lh * (i + 0.5),
        text,
        size: font * 0.85,
        fill: palette.ink,
        anchor: 'start',
      });
    });
    height = size + lh * (lines.length + 0.5);
  }

  return {
    width: size,
    height,
    centre: { x: cx, y: cy },
    radius,
    net,
    title,
    nodes,
    poles: drawn,
    lines: drawnLines,
    legendLines,
    densityLegend: legendText,
    notes,
  };
}

/** Splits a legend line into lines of at most `max` characters at spaces. */
export function wrap(text: string, max: number): string[] {
  const out: string[] = [];
  let current = '';
  for (const word of text.split(' ')) {
    if (current && current.length + 1 + word.length > max) {
      out.push(current);
      current = word;
    } else current = current ? `${current} ${word}` : word;
  }
  if (current) out.push(current);
  return out;
}

/** The pole nearest to an SVG point within `reach` px (for taps and hovers), or null. */
export function nearestPole(scene: StereonetScene, x: number, y: number, reach: number): DrawnPole | null {
  let best: DrawnPole | null = null;
  let bestD = reach * reach;
  for (const p of scene.poles) {
    const d = (p.x - x) ** 2 + (p.y - y) ** 2;
    if (d <= bestD) {
      bestD = d;
      best = p;
    }
  }
  return best;
}

/** The intersection mark nearest to an SVG point within `reach` px, or null. */
export function nearestLine(scene: StereonetScene, x: number, y: number, reach: number): DrawnLine | null {
  let best: DrawnLine | null = null;
  let bestD = reach * reach;
  for (const l of scene.lines) {
    const d = (l.x - x) ** 2 + (l.y - y) ** 2;
    if (d <= bestD) {
      bestD = d;
      best = l;
    }
  }
  return best;
}

/** An intersection line in words for the readout. */
export function lineNotations(l: DrawnLine): Array<{ label: string; value: string }> {
  return [
    { label: 'Trend / plunge', value: lineText(l.line) },
    { label: 'Planes', value: l.planes.map((p) => formatPlane(p, 'dip-direction/dip')).join(' and ') },
  ];
}

/** A pole in every notation the product reads (geomath's formatters). */
export function poleNotations(plane: Plane): Array<{ label: string; value: string }> {
  const pole = poleOf(plane);
  const line = (l: Line) =>
    `${String(Math.round(l.trend) % 360).padStart(3, '0')}/${String(Math.round(l.plunge)).padStart(2, '0')}`;
  return [
    { label: 'Dip direction / dip', value: formatPlane(plane, 'dip-direction/dip') },
    { label: 'Dip / dip direction', value: formatPlane(plane, 'dip/dip-direction') },
    { label: 'Strike / dip (right-hand rule)', value: formatPlane(plane, 'strike/dip-rhr') },
    { label: 'Quadrant strike and dip', value: formatPlane(plane, 'quadrant') },
    { label: 'Pole trend / plunge', value: line(pole) },
  ];
}

/** A point in the scene's SVG coordinates. */
export interface ScenePoint {
  x: number;
  y: number;
}

/**
 * Is the point inside the closed polygon (the last vertex joins the first)? Even–odd rule by a ray cast to
 * the right (common practice), so a free-hand lasso that is concave, or crosses itself, still gives a
 * sensible answer. A polygon of fewer than three vertices holds nothing.
 */
export function insidePolygon(p: ScenePoint, polygon: readonly ScenePoint[]): boolean {
  if (polygon.length < 3) return false;
  let inside = false;
  for (let i = 0, k = polygon.length - 1; i < polygon.length; k = i++) {
    const a = polygon[i];
    const b = polygon[k];
    if (a.y > p.y !== b.y > p.y && p.x < a.x + ((p.y - a.y) * (b.x - a.x)) / (b.y - a.y)) inside = !inside;
  }
  return inside;
}

/** The poles drawn inside a lasso (a free-hand polygon in the scene's coordinates). */
export function polesInLasso(scene: StereonetScene, lasso: readonly ScenePoint[]): DrawnPole[] {
  if (lasso.length < 3) return [];
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const q of lasso) {
    minX = Math.min(minX, q.x);
    maxX = Math.max(maxX, q.x);
    minY = Math.min(minY, q.y);
    maxY = Math.max(maxY, q.y);
  }
  return scene.poles.filter(
    (p) => p.x >= minX && p.x <= maxX && p.y >= minY && p.y <= maxY && insidePolygon(p, lasso),
  );
}
