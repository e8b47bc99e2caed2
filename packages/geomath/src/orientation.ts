// Pole ⇄ plane and strike conversions (methods.md §0, §1.1). Pure arithmetic on azimuths, so horizontal
// and vertical planes are exact.
import { normalizeAzimuth } from './math.js';
import { OrientationError } from './types.js';
import type { Line, Plane } from './types.js';

function checkPlane(plane: Plane): void {
  if (
    !Number.isFinite(plane.dipDirection) ||
    !Number.isFinite(plane.dip) ||
    plane.dip < 0 ||
    plane.dip > 90
  ) {
    throw new OrientationError(
      `The plane ${String(plane.dipDirection)}/${String(plane.dip)} is not valid: dip direction must be 0–360° and dip 0–90°.`,
    );
  }
}

function checkLine(line: Line): void {
  if (!Number.isFinite(line.trend) || !Number.isFinite(line.plunge) || line.plunge < 0 || line.plunge > 90) {
    throw new OrientationError(
      `The line ${String(line.trend)}/${String(line.plunge)} is not valid: trend must be 0–360° and plunge 0–90° (lower hemisphere).`,
    );
  }
}

/**
 * Lower-hemisphere pole (normal) of a plane: trend = dip direction + 180, plunge = 90 − dip.
 * Vertical plane (dip 90): of the two antipodal horizontal normals the one on the side opposite the stated
 * dip direction is returned (trend = dip direction + 180, plunge 0) — the same rule as for every other
 * plane. Horizontal plane (dip 0): plunge exactly 90.
 */
export function poleOf(plane: Plane): Line {
  checkPlane(plane);
  return { trend: normalizeAzimuth(plane.dipDirection + 180), plunge: 90 - plane.dip };
}

/**
 * Plane whose pole is the given line: dip direction = trend + 180, dip = 90 − plunge. A horizontal pole
 * gives a vertical plane dipping away from the pole's trend; a vertical pole gives a horizontal plane
 * (dip direction = trend + 180, 000 for a pole written 000/90).
 */
export function planeOfPole(pole: Line): Plane {
  checkLine(pole);
  return { dipDirection: normalizeAzimuth(pole.trend + 180), dip: 90 - pole.plunge };
}

/** Strike by the right-hand rule (dip to the right looking along strike): dip direction − 90. */
export function rightHandStrike(plane: Plane): number {
  checkPlane(plane);
  return normalizeAzimuth(plane.dipDirection - 90);
}
