import type { Drive, Vector3 } from './types.js';
import { OrientationError } from './types.js';
import { cross, dot, lineToVector, norm, scale, sub } from './vector.js';

/**
 * The tunnel's own frame in north-east-down (methods.md §6): `forward` along the axis in the direction of
 * advance, `up` perpendicular to it in the vertical plane that contains it, `right` = forward × up.
 */
export interface TunnelFrame {
  forward: Vector3;
  up: Vector3;
  right: Vector3;
}

/** Frame of a drive; OrientationError for a vertical or non-finite drive (no up direction). */
export function tunnelFrame(drive: Drive): TunnelFrame {
  if (!Number.isFinite(drive.trend) || !Number.isFinite(drive.plunge) || Math.abs(drive.plunge) > 90) {
    throw new OrientationError(
      `drive ${String(drive.trend)}/${String(drive.plunge)} is not valid: expected a trend and a plunge between −90 and 90`,
    );
  }
  const forward = lineToVector(drive);
  const down: Vector3 = [0, 0, 1];
  const horizontalPart = sub(down, scale(forward, dot(down, forward)));
  const length = norm(horizontalPart);
  if (length < 1e-6) {
    throw new OrientationError(
      'a vertical drive has no up direction in its cross-section: expected |plunge| < 90',
    );
  }
  const up = scale(horizontalPart, -1 / length);
  return { forward, up, right: cross(forward, up) };
}
