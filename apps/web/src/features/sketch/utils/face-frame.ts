// The view transform between face-frame metres (x right of the centre line, y up from the invert) and
// canvas pixels. The face frame itself (the heading's profile for the stage) is packages/domain's.
import type { FaceFrame, SketchPoint } from '@roundbook/domain';
import type { ProfilePoint } from '@roundbook/geomath';

export { faceFrameOf, type FaceFrame, type SketchProfileInput } from '@roundbook/domain';

/** Pixels per metre and where the frame's origin (centre line, invert) is on the canvas. */
export interface ViewTransform {
  scale: number;
  ox: number;
  oy: number;
}

/** The view that fits the profile (with a 1 m margin and room for the labels) into the canvas. */
export function fitView(frame: FaceFrame, widthPx: number, heightPx: number): ViewTransform {
  const spanX = frame.width + 3;
  const spanY = frame.height + 2.5;
  const scale = Math.max(4, Math.min(widthPx / spanX, heightPx / spanY));
  return { scale, ox: widthPx / 2, oy: heightPx / 2 + (frame.height / 2) * scale };
}

export const toPx = (v: ViewTransform, p: SketchPoint | ProfilePoint): [number, number] => [
  v.ox + p[0] * v.scale,
  v.oy - p[1] * v.scale,
];

export const toMetres = (v: ViewTransform, px: { x: number; y: number }): SketchPoint => [
  (px.x - v.ox) / v.scale,
  (v.oy - px.y) / v.scale,
];

/**
 * How far a drag of `offset` pixels moves an element, metres in the face frame (y up, so a drag down is a
 * negative dy), to the millimetre the document keeps.
 */
export const dragDelta = (
  v: ViewTransform,
  offset: { x: number; y: number },
): { dx: number; dy: number } => ({
  dx: Math.round((offset.x / v.scale) * 1000) / 1000,
  dy: Math.round((-offset.y / v.scale) * 1000) / 1000,
});

/** Flat pixel list for a Konva Line. */
export const flatPx = (v: ViewTransform, points: readonly (SketchPoint | ProfilePoint)[]): number[] =>
  points.flatMap((p) => toPx(v, p));

/** Zoom by `factor` about the pixel point `at` (wheel or pinch), within 4 to 400 px per metre. */
export function zoomAbout(v: ViewTransform, factor: number, at: { x: number; y: number }): ViewTransform {
  const scale = Math.min(400, Math.max(4, v.scale * factor));
  const k = scale / v.scale;
  return { scale, ox: at.x - (at.x - v.ox) * k, oy: at.y - (at.y - v.oy) * k };
}

/** Whole metres from `from` to `to` (the grid lines). */
export function gridLines(from: number, to: number): number[] {
  const out: number[] = [];
  for (let m = Math.ceil(from); m <= Math.floor(to); m++) out.push(m);
  return out;
}

/** Centre of a ring (mean of its points): where an area figure is written. */
export const centreOf = (points: readonly SketchPoint[]): SketchPoint => [
  points.reduce((s, p) => s + p[0], 0) / points.length,
  points.reduce((s, p) => s + p[1], 0) / points.length,
];
