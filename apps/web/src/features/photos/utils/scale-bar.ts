// The scale bar of the photo viewer: from the two points the geologist marked and their known distance,
// the photo's width in metres, then a round bar length (1, 2 or 5 times a power of ten, the usual steps of
// a drawn scale: common practice) that spans 10–30 % of the photo's width.

/** A point on the photo as fractions of its upright width (x) and height (y). */
export interface PhotoPoint {
  x: number;
  y: number;
}

export interface PhotoScale {
  a: PhotoPoint;
  b: PhotoPoint;
  distanceM: number;
}

export interface ScaleBar {
  /** The bar's length on the ground (m). */
  lengthM: number;
  /** The bar's length as a fraction of the photo's width. */
  fraction: number;
  label: string;
}

/** The bar spans this share of the photo's width: at least, at most, and preferably. */
export const BAR_MIN = 0.1;
export const BAR_MAX = 0.3;
const BAR_AIM = 0.2;

/**
 * The photo's width in metres from its scale; `aspect` is the upright width over height (the fractions of
 * y are of the height, so a vertical mark is shortened by it). Null when the points coincide.
 */
export function photoWidthM(scale: PhotoScale, aspect: number): number | null {
  const dx = scale.b.x - scale.a.x;
  const dy = (scale.b.y - scale.a.y) / aspect;
  const across = Math.hypot(dx, dy);
  if (!(across > 0) || !(scale.distanceM > 0) || !(aspect > 0)) return null;
  return scale.distanceM / across;
}

/** A length as the bar's label: centimetres below 0.1 m, metres otherwise. */
export function formatLength(m: number): string {
  if (m < 0.1) return `${Number((m * 100).toPrecision(3))} cm`;
  return `${Number(m.toPrecision(3))} m`;
}

/** The round bar length for a photo `widthM` metres wide: the 1-2-5 step nearest to a fifth of it. */
export function chooseScaleBar(widthM: number): ScaleBar | null {
  if (!Number.isFinite(widthM) || widthM <= 0) return null;
  const decade = Math.floor(Math.log10(widthM * BAR_AIM));
  let best: ScaleBar | null = null;
  for (let k = decade - 1; k <= decade + 1; k++) {
    for (const step of [1, 2, 5]) {
      // toPrecision keeps 0.1 × 5 from becoming 0.5000000000000001
      const lengthM = Number((step * 10 ** k).toPrecision(1));
      const fraction = lengthM / widthM;
      if (fraction < BAR_MIN || fraction > BAR_MAX) continue;
      if (
        best === null ||
        Math.abs(Math.log(fraction / BAR_AIM)) < Math.abs(Math.log(best.fraction / BAR_AIM))
      )
        best = { lengthM, fraction, label: formatLength(lengthM) };
    }
  }
  return best;
}

/** The bar of a photo with a scale, or null when it has none (or it cannot be read). */
export function scaleBarOf(scale: PhotoScale | null | undefined, aspect: number): ScaleBar | null {
  if (!scale) return null;
  const width = photoWidthM(scale, aspect);
  return width === null ? null : chooseScaleBar(width);
}
