import { OrientationError, type Drive } from './types.js';

/**
 * Alignment helpers for headings: gradient in per cent ⇄ degrees, the drive of a heading, and chainage
 * written as kilometres + metres. Gradient is positive when the tunnel rises in the direction of advance;
 * the contract's Drive has plunge > 0 descending, so plunge = −atan(gradient/100) [common practice].
 */
export const gradientPercentToDegrees = (percent: number): number =>
  (Math.atan(percent / 100) * 180) / Math.PI;

export const gradientDegreesToPercent = (degrees: number): number => {
  if (!(Math.abs(degrees) < 90))
    throw new OrientationError(`A gradient of ${degrees}° is not possible: it must be between −90° and 90°.`);
  return Math.tan((degrees * Math.PI) / 180) * 100;
};

export function driveOf(heading: { driveTrend: number; gradientPercent: number }): Drive {
  const plunge = -gradientPercentToDegrees(heading.gradientPercent);
  return { trend: heading.driveTrend, plunge: plunge === 0 ? 0 : plunge };
}

export type ChainageStyle = 'km+m' | 'metres';

/** 1250.04 → "1+250.0" (km+m, 1 decimal) or "1250.0" (metres). Negative chainages keep their sign: "-0+012.5". */
export function formatChainage(
  metres: number,
  options: { style?: ChainageStyle; decimals?: number } = {},
): string {
  const { style = 'km+m', decimals = 1 } = options;
  if (!Number.isFinite(metres)) throw new RangeError('A chainage must be a finite number of metres.');
  const fixed = Math.abs(metres).toFixed(decimals);
  const sign = metres < 0 && Number(fixed) !== 0 ? '-' : '';
  if (style === 'metres') return sign + fixed;
  const [whole, frac] = fixed.split('.');
  const w = Number(whole);
  const km = Math.floor(w / 1000);
  const m = String(w % 1000).padStart(3, '0');
  return `${sign}${km}+${m}${frac !== undefined ? `.${frac}` : ''}`;
}

/** Reads "1+250.0", "1+250", "1250.0" or "1 250,5" as metres; throws OrientationError with the expected forms. */
export function parseChainage(text: string): number {
  const t = text.trim().replace(/\s+/g, '').replace(',', '.');
  const kmPlus = /^(-?)(\d+)\+(\d{1,3})(?:\.(\d+))?$/.exec(t);
  if (kmPlus) {
    const [, sign, km, m, frac] = kmPlus;
    if (m.length !== 3)
      throw new OrientationError(`"${text}": after the + come three digits of metres, e.g. 1+050.0.`);
    const value = Number(km) * 1000 + Number(`${m}.${frac ?? '0'}`);
    return sign ? -value : value;
  }
  if (/^-?\d+(\.\d+)?$/.test(t)) return Number(t);
  throw new OrientationError(
    `"${text}" is not a chainage. Write it as km+metres (1+250.0) or in metres (1250.0).`,
  );
}
