// Excavation profiles as metre polylines, in the face frame looking in the drive direction: x to the
// right (0 on the centre line), y up from the invert (0). The shapes are Roundbook's own simple
// constructions, the same as the web's profile preview:
// - rectangular: a box, width × height;
// - circular: a circle of the width (the height is taken as the width);
// - D-shaped: straight walls under a half-ellipse crown as wide as the profile, rising min(w/2, h);
// - horseshoe: a half-ellipse crown rising min(w/2, 0.6h) over walls that narrow in a quadratic curve
//   (control point at the wall, 0.35 of the wall height) to a flat invert three quarters as wide.
// Each stage (top heading, bench, invert, full face) is the part of the outline between two horizontal
// lines, with its top and bottom heights relative to the axis for the crown-reach rule.
import { RatingError } from './types.js';

export type ProfileShape = 'circular' | 'horseshoe' | 'd-shaped' | 'rectangular';
export const PROFILE_SHAPES: readonly ProfileShape[] = ['circular', 'horseshoe', 'd-shaped', 'rectangular'];

export type ExcavationStage = 'full-face' | 'top-heading' | 'bench' | 'invert';
export const EXCAVATION_STAGES: readonly ExcavationStage[] = ['full-face', 'top-heading', 'bench', 'invert'];

/** A point of an outline: [x right, y up from the invert], metres. */
export type ProfilePoint = [number, number];

export interface ProfileInput {
  shape: ProfileShape;
  /** Metres, > 0. */
  width: number;
  /** Metres, invert to crown, > 0 (ignored for a circle, whose height is its width). */
  height: number;
}

export interface ProfileOutline {
  shape: ProfileShape;
  width: number;
  /** Invert to crown as drawn (the width for a circle). */
  height: number;
  /**
   * Closed ring, counter-clockwise (y up), the first point not repeated at the end; starts on the invert
   * at the left (or at the left springline of a circle).
   */
  points: ProfilePoint[];
  /** Area of the polygon, m² (shoelace). */
  area: number;
}

/** Pieces per full turn for arcs (an ellipse half gets half); Bézier walls get a quarter. */
const DEFAULT_SEGMENTS = 128;

function checkSize(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0 || value > 1000) {
    throw new RatingError(
      `${name} ${String(value)} m is not valid: expected more than 0 m (and at most 1000 m)`,
    );
  }
}

/** Shoelace area of a closed ring (positive counter-clockwise). */
export function polygonArea(points: readonly ProfilePoint[]): number {
  let sum = 0;
  for (let i = 0; i < points.length; i++) {
    const [x1, y1] = points[i];
    const [x2, y2] = points[(i + 1) % points.length];
    sum += x1 * y2 - x2 * y1;
  }
  return sum / 2;
}

function dedupe(points: ProfilePoint[]): ProfilePoint[] {
  const out: ProfilePoint[] = [];
  for (const p of points) {
    const last = out[out.length - 1];
    if (last === undefined || Math.abs(last[0] - p[0]) > 1e-12 || Math.abs(last[1] - p[1]) > 1e-12)
      out.push(p);
  }
  while (out.length > 1) {
    const first = out[0];
    const last = out[out.length - 1];
    if (Math.abs(last[0] - first[0]) > 1e-12 || Math.abs(last[1] - first[1]) > 1e-12) break;
    out.pop();
  }
  return out;
}

/** Half-ellipse from (a, y0) over the top to (−a, y0), excluding the first point. */
function crown(a: number, rise: number, y0: number, pieces: number): ProfilePoint[] {
  const out: ProfilePoint[] = [];
  for (let i = 1; i <= pieces; i++) {
    const t = (Math.PI * i) / pieces;
    out.push(i === pieces ? [-a, y0] : [a * Math.cos(t), y0 + rise * Math.sin(t)]);
  }
  return out;
}

/** Quadratic Bézier from p0 (excluded) through control c to p2 (included). */
function bezier(p0: ProfilePoint, c: ProfilePoint, p2: ProfilePoint, pieces: number): ProfilePoint[] {
  const out: ProfilePoint[] = [];
  for (let i = 1; i <= pieces; i++) {
    const t = i / pieces;
    const u = 1 - t;
    out.push(
      i === pieces
        ? [p2[0], p2[1]]
        : [
            u * u * p0[0] + 2 * u * t * c[0] + t * t * p2[0],
            u * u * p0[1] + 2 * u * t * c[1] + t * t * p2[1],
          ],
    );
  }
  return out;
}

/**
 * The outline of an excavation profile as a closed metre polyline (x right, y up from the invert, in the
 * face frame looking in the drive direction). `segments`: pieces per full turn of an arc (default 128).
 */
export function profileOutline(input: ProfileInput, options?: { segments?: number }): ProfileOutline {
  const segments = options?.segments ?? DEFAULT_SEGMENTS;
  if (!Number.isInteger(segments) || segments < 8 || segments > 4096) {
    throw new RangeError(`Profile segments must be a whole number from 8 to 4096, not ${segments}.`);
  }
  checkSize('profile width', input.width);
  const shape = input.shape;
  if (shape !== 'circular') checkSize('profile height', input.height);
  const w = input.width / 2;
  const h = shape === 'circular' ? input.width : input.height;
  let points: ProfilePoint[];
  switch (shape) {
    case 'rectangular':
      points = [
        [-w, 0],
        [w, 0],
        [w, h],
        [-w, h],
      ];
      break;
    case 'circular': {
      points = [];
      // from the left springline, counter-clockwise: down through the invert, up through the crown
      for (let i = 0; i < segments; i++) {
        const t = Math.PI + (2 * Math.PI * i) / segments;
        points.push([w * Math.cos(t), w + w * Math.sin(t)]);
      }
      points[0] = [-w, w];
      break;
    }
    case 'd-shaped': {
      const rise = Math.min(w, h);
      const wall = h - rise;
      points = [[-w, 0], [w, 0], [w, wall], ...crown(w, rise, wall, Math.ceil(segments / 2))];
      break;
    }
    case 'horseshoe': {
      const rise = Math.min(w, h * 0.6);
      const spring = h - rise;
      const foot = w * 0.75;
      const quarter = Math.max(4, Math.ceil(segments / 4));
      points = [
        [-foot, 0],
        [foot, 0],
        ...bezier([foot, 0], [w, spring * 0.35], [w, spring], quarter),
        ...crown(w, rise, spring, Math.ceil(segments / 2)),
        ...bezier([-w, spring], [-w, spring * 0.35], [-foot, 0], quarter),
      ];
      break;
    }
    default:
      throw new RatingError(
        `profile shape "${String(shape)}" is not known: expected ${PROFILE_SHAPES.join(', ')}`,
      );
  }
  points = dedupe(points);
  return { shape, width: input.width, height: h, points, area: polygonArea(points) };
}

/** The part of a closed ring between y = bottom and y = top (Sutherland–Hodgman; the shapes are convex). */
export function clipBetween(points: readonly ProfilePoint[], bottom: number, top: number): ProfilePoint[] {
  const clip = (ring: readonly ProfilePoint[], keep: (y: number) => boolean, yc: number): ProfilePoint[] => {
    const out: ProfilePoint[] = [];
    for (let i = 0; i < ring.length; i++) {
      const a = ring[i];
      const b = ring[(i + 1) % ring.length];
      const ina = keep(a[1]);
      const inb = keep(b[1]);
      if (ina) out.push(a);
      if (ina !== inb) {
        const t = (yc - a[1]) / (b[1] - a[1]);
        out.push([a[0] + t * (b[0] - a[0]), yc]);
      }
    }
    return out;
  };
  const above = clip(points, (y) => y >= bottom, bottom);
  return dedupe(clip(above, (y) => y <= top, top));
}

export interface StageGeometryInput extends ProfileInput {
  /** Height of the tunnel axis above the invert, metres (0 … height). */
  axisHeight: number;
  /**
   * Top of the bench (floor of the top heading), metres above the invert. Default: the axis height
   * (a Roundbook default; give the heading's real bench line when it is known).
   */
  benchLine?: number;
  /** Top of the invert stage, metres above the invert. Needed for the 'invert' stage; default 0. */
  invertLine?: number;
}

export interface StagePart {
  stage: ExcavationStage;
  /** The part of the outline, a closed ring as in ProfileOutline. */
  points: ProfilePoint[];
  area: number;
  /** Lowest and highest points of the part, metres above the invert. */
  bottom: number;
  top: number;
  /**
   * Heights relative to the axis, for the look-ahead: the part's crown `crownHeight` above the axis and
   * its floor `invertDepth` below it. Signed: a bench wholly below the axis has a negative crownHeight.
   */
  crownHeight: number;
  invertDepth: number;
  /** Largest half-width of the part, metres (its walls for the look-ahead). */
  halfWidth: number;
}

/** The band [bottom, top] of each stage, metres above the invert. */
function stageBand(
  input: StageGeometryInput,
  outline: ProfileOutline,
  stage: ExcavationStage,
): [number, number] {
  const h = outline.height;
  const benchLine = input.benchLine ?? input.axisHeight;
  const invertLine = input.invertLine ?? 0;
  if (!Number.isFinite(benchLine) || benchLine <= 0 || benchLine >= h) {
    throw new RatingError(
      `bench line ${String(benchLine)} m is not valid: expected a height above the invert between 0 and ${h} m`,
    );
  }
  if (!Number.isFinite(invertLine) || invertLine < 0 || invertLine >= benchLine) {
    throw new RatingError(
      `invert line ${String(invertLine)} m is not valid: expected 0 m or more and below the bench line (${benchLine} m)`,
    );
  }
  switch (stage) {
    case 'full-face':
      return [0, h];
    case 'top-heading':
      return [benchLine, h];
    case 'bench':
      return [invertLine, benchLine];
    case 'invert':
      if (invertLine <= 0) {
        throw new RatingError(
          'the invert stage needs its top line: give invertLine, metres above the invert, more than 0',
        );
      }
      return [0, invertLine];
    default:
      throw new RatingError(
        `stage "${String(stage)}" is not known: expected ${EXCAVATION_STAGES.join(', ')}`,
      );
  }
}

/**
 * The part of the profile a stage excavates: full face = all of it; top heading = above the bench line;
 * bench = between the invert line and the bench line; invert = below the invert line. Heights relative to
 * the axis come with it (crownHeight, invertDepth, halfWidth), for the crown-reach rule and the sketch.
 */
export function stagePart(
  input: StageGeometryInput,
  stage: ExcavationStage,
  options?: { segments?: number },
): StagePart {
  const outline = profileOutline(input, options);
  if (!Number.isFinite(input.axisHeight) || input.axisHeight < 0 || input.axisHeight > outline.height) {
    throw new RatingError(
      `axis height ${String(input.axisHeight)} m is not valid: expected 0 to ${outline.height} m above the invert`,
    );
  }
  const [bottom, top] = stageBand(input, outline, stage);
  const points = clipBetween(outline.points, bottom, top);
  const halfWidth = points.reduce((m, p) => Math.max(m, Math.abs(p[0])), 0);
  return {
    stage,
    points,
    area: polygonArea(points),
    bottom,
    top,
    crownHeight: top - input.axisHeight,
    invertDepth: input.axisHeight - bottom,
    halfWidth,
  };
}

/** The parts of several stages of one heading (e.g. its `stages` field), in the order given. */
export function stageParts(
  input: StageGeometryInput,
  stages: readonly ExcavationStage[],
  options?: { segments?: number },
): StagePart[] {
  return stages.map((stage) => stagePart(input, stage, options));
}
