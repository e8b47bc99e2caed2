// What the full-screen viewer does with fingers, a stylus or the mouse, as pure functions (the component
// keeps the pointers and applies the view as a CSS transform: translate, then scale about the centre).

/** The photo's zoom and its shift from the centre (CSS pixels). */
export interface View {
  zoom: number;
  x: number;
  y: number;
}

export const FIT: View = { zoom: 1, x: 0, y: 0 };
export const MAX_ZOOM = 5;
/** A double tap zooms to this, or back to fit when already zoomed. */
export const DOUBLE_TAP_ZOOM = 2.5;
/** A horizontal move longer than this, at fit, turns to the next or previous photo. */
export const SWIPE_PX = 50;
/** A press that moves less than this is a tap. */
export const TAP_PX = 10;
/** Two taps within this time and distance are a double tap. */
export const DOUBLE_TAP_MS = 300;
export const DOUBLE_TAP_PX = 30;

export interface Pt {
  x: number;
  y: number;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/**
 * The step a finished single-pointer move asks for: +1 next photo (moved left), -1 previous (moved
 * right), 0 none. Only at fit (a zoomed photo is panned instead) and only when mostly horizontal.
 */
export function swipeStep(dx: number, dy: number, zoom: number): -1 | 0 | 1 {
  if (zoom > 1.01) return 0;
  if (Math.abs(dx) < SWIPE_PX || Math.abs(dx) < 1.5 * Math.abs(dy)) return 0;
  return dx < 0 ? 1 : -1;
}

/** Keeps the zoomed photo covering the stage: it may not be pushed further than its own overhang. */
export function clampView(view: View, stage: { width: number; height: number }): View {
  const zoom = clamp(view.zoom, 1, MAX_ZOOM);
  const maxX = ((zoom - 1) * stage.width) / 2;
  const maxY = ((zoom - 1) * stage.height) / 2;
  return { zoom, x: clamp(view.x, -maxX, maxX), y: clamp(view.y, -maxY, maxY) };
}

/**
 * The view zoomed to `zoom` about the point `at` (relative to the stage's centre): the spot of the photo
 * under `at` stays under it.
 */
export function zoomAbout(view: View, zoom: number, at: Pt): View {
  const z = clamp(zoom, 1, MAX_ZOOM);
  const k = z / view.zoom;
  return { zoom: z, x: at.x - k * (at.x - view.x), y: at.y - k * (at.y - view.y) };
}

/** Two pointers moved from `from` to `to`: the pinch zooms by the change of their spread and pans with their middle. */
export function pinch(start: View, from: [Pt, Pt], to: [Pt, Pt]): View {
  const spread = (p: [Pt, Pt]) => Math.hypot(p[0].x - p[1].x, p[0].y - p[1].y);
  const mid = (p: [Pt, Pt]): Pt => ({ x: (p[0].x + p[1].x) / 2, y: (p[0].y + p[1].y) / 2 });
  const s0 = spread(from);
  const factor = s0 > 0 ? spread(to) / s0 : 1;
  const m0 = mid(from);
  const m1 = mid(to);
  const zoomed = zoomAbout(start, start.zoom * factor, m0);
  return { ...zoomed, x: zoomed.x + m1.x - m0.x, y: zoomed.y + m1.y - m0.y };
}

/** A double tap at `at` (relative to the centre): zoom in there, or back to fit. */
export function doubleTap(view: View, at: Pt): View {
  return view.zoom > 1.01 ? FIT : zoomAbout(view, DOUBLE_TAP_ZOOM, at);
}

/** Whether a tap at `now` and `at` completes a double tap with the previous one. */
export function isDoubleTap(prev: { t: number; at: Pt } | null, now: number, at: Pt): boolean {
  return (
    prev !== null &&
    now - prev.t <= DOUBLE_TAP_MS &&
    Math.hypot(at.x - prev.at.x, at.y - prev.at.y) <= DOUBLE_TAP_PX
  );
}
