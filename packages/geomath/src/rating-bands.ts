import { RatingError } from './types.js';

/**
 * Banded rating tables (RMR89 and the like) as data, with the side each boundary value falls on written
 * into every row: a row covers min..max and says whether each end belongs to it.
 *
 * Roundbook's rule for the measured RMR89 inputs: a value exactly on a boundary between two bands takes the
 * less favourable (lower) rating, because the published bands share their end values and the lower rating
 * does not over-rate the ground. The rows below spell that out end by end, so the UI can show "> 75 to ≤ 90".
 */
export interface RatingBand {
  /** Lower end of the band (may be -Infinity). */
  readonly min: number;
  /** Upper end of the band (may be Infinity). */
  readonly max: number;
  readonly minInclusive: boolean;
  readonly maxInclusive: boolean;
  readonly rating: number;
  /** Our own short wording of the row. */
  readonly description: string;
}

/** True when `value` lies in the band, honouring which ends are included. */
export function inBand(value: number, band: RatingBand): boolean {
  const aboveMin = band.minInclusive ? value >= band.min : value > band.min;
  const belowMax = band.maxInclusive ? value <= band.max : value < band.max;
  return aboveMin && belowMax;
}

/** The band holding `value`; RatingError naming the parameter and the accepted range otherwise. */
export function bandOf(
  parameter: string,
  value: number,
  bands: readonly RatingBand[],
  unit: string,
): RatingBand {
  requireFinite(parameter, value);
  const found = bands.find((band) => inBand(value, band));
  if (found === undefined) {
    const lo = Math.min(...bands.map((b) => b.min));
    const hi = Math.max(...bands.map((b) => b.max));
    throw new RatingError(
      `${parameter} ${value}${unit ? ` ${unit}` : ''} is outside its table: expected a value from ${lo} to ${hi}${
        unit ? ` ${unit}` : ''
      }`,
    );
  }
  return found;
}

/** RatingError unless `value` is a finite number. */
export function requireFinite(parameter: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RatingError(`${parameter} must be a finite number, received ${String(value)}`);
  }
}

/** RatingError unless min <= value <= max. */
export function requireInRange(parameter: string, value: number, min: number, max: number, why = ''): void {
  requireFinite(parameter, value);
  if (value < min || value > max) {
    throw new RatingError(
      `${parameter} ${value} is outside its table: expected ${min} to ${max}${why ? ` (${why})` : ''}`,
    );
  }
}

/** RatingError unless value > 0. */
export function requirePositive(parameter: string, value: number, unit = ''): void {
  requireFinite(parameter, value);
  if (value <= 0) {
    throw new RatingError(`${parameter} must be greater than 0${unit ? ` ${unit}` : ''}, received ${value}`);
  }
}

/** One band row, written compactly. */
export function band(
  min: number,
  minInclusive: boolean,
  max: number,
  maxInclusive: boolean,
  rating: number,
  description: string,
): RatingBand {
  return { min, max, minInclusive, maxInclusive, rating, description };
}
