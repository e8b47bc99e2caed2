import { azimuthDifference } from './math.js';
import { requireInRange } from './rating-bands.js';
import type { Drive, Plane } from './types.js';
import { RatingError } from './types.js';

/**
 * RMR89 orientation adjustment for tunnels (Bieniawski 1989, Table 4.1 B and F; Brady & Brown 2004 p.98,
 * Table 3.6). Bieniawski gives no angular tolerance for "strike perpendicular/parallel to the axis", so
 * Roundbook states its own rule (RMR_ORIENTATION_RULE) wherever the result is shown.
 */
export type RmrOrientationAssessment =
  'very favourable' | 'favourable' | 'fair' | 'unfavourable' | 'very unfavourable';

export type RmrOrientationAdjustment = 0 | -2 | -5 | -10 | -12;

/** Table B, tunnels and mines. */
export const RMR_TUNNEL_ADJUSTMENT: Readonly<Record<RmrOrientationAssessment, RmrOrientationAdjustment>> = {
  'very favourable': 0,
  favourable: -2,
  fair: -5,
  unfavourable: -10,
  'very unfavourable': -12,
};

/** Strike within this many degrees of the axis (inclusive) is treated as parallel. */
export const PARALLEL_LIMIT = 30;
/** Strike at this many degrees or more from the axis is treated as perpendicular. */
export const PERPENDICULAR_LIMIT = 60;

export const RMR_ORIENTATION_RULE =
  'Bieniawski (1989) gives no angular tolerance. Roundbook treats a set whose strike is within 30° of the ' +
  'tunnel axis (30° included) as parallel, at 60° or more as perpendicular, and between 30° and 60° takes the ' +
  'worse of the two ratings. Dip bands: 0–20° (20 excluded), 20–45° (45 excluded), 45–90°. The drive goes ' +
  "with the dip when the set's dip direction is less than 90° from the drive's trend. Only the drive's " +
  'trend is used, not its gradient.';

/** Table F, rows as data (our wording). */
export const RMR_TUNNEL_ORIENTATION_CASES: readonly {
  readonly strike: 'perpendicular' | 'parallel' | 'any';
  readonly drive: 'with dip' | 'against dip' | 'either';
  readonly dip: '45–90' | '20–45' | '0–20';
  readonly assessment: RmrOrientationAssessment;
}[] = [
  { strike: 'perpendicular', drive: 'with dip', dip: '45–90', assessment: 'very favourable' },
  { strike: 'perpendicular', drive: 'with dip', dip: '20–45', assessment: 'favourable' },
  { strike: 'perpendicular', drive: 'against dip', dip: '45–90', assessment: 'fair' },
  { strike: 'perpendicular', drive: 'against dip', dip: '20–45', assessment: 'unfavourable' },
  { strike: 'parallel', drive: 'either', dip: '45–90', assessment: 'very unfavourable' },
  { strike: 'parallel', drive: 'either', dip: '20–45', assessment: 'fair' },
  { strike: 'any', drive: 'either', dip: '0–20', assessment: 'fair' },
];

export interface RmrOrientationResult {
  adjustment: RmrOrientationAdjustment;
  assessment: RmrOrientationAssessment;
  /** Acute horizontal angle between the set's strike and the drive's trend, 0–90°. */
  strikeToAxis: number;
  relation: 'parallel' | 'perpendicular' | 'oblique';
  driveSense: 'with dip' | 'against dip';
  /** Which rows were compared, in words. */
  reason: string;
}

function perpendicularCase(dip: number, withDip: boolean): RmrOrientationAssessment {
  if (withDip) return dip >= 45 ? 'very favourable' : 'favourable';
  return dip >= 45 ? 'fair' : 'unfavourable';
}

function parallelCase(dip: number): RmrOrientationAssessment {
  return dip >= 45 ? 'very unfavourable' : 'fair';
}

function worse(a: RmrOrientationAssessment, b: RmrOrientationAssessment): RmrOrientationAssessment {
  return RMR_TUNNEL_ADJUSTMENT[a] <= RMR_TUNNEL_ADJUSTMENT[b] ? a : b;
}

/**
 * The RMR89 tunnel orientation assessment of one set against the drive, with the 30°/60° rule of
 * RMR_ORIENTATION_RULE. Dip 0–20° is fair whatever the strike.
 */
export function rmrOrientationInTunnel(plane: Plane, drive: Drive): RmrOrientationResult {
  requireInRange('dip', plane.dip, 0, 90, 'degrees');
  if (!Number.isFinite(plane.dipDirection) || !Number.isFinite(drive.trend)) {
    throw new RatingError('dip direction and drive trend must be finite azimuths in degrees');
  }
  const fromDrive = azimuthDifference(plane.dipDirection, drive.trend); // 0..180
  const strikeToAxis = Math.abs(90 - fromDrive); // strike is 90° from the dip direction
  const withDip = fromDrive < 90;
  const driveSense = withDip ? 'with dip' : 'against dip';
  const relation =
    strikeToAxis <= PARALLEL_LIMIT
      ? 'parallel'
      : strikeToAxis >= PERPENDICULAR_LIMIT
        ? 'perpendicular'
        : 'oblique';
  const dip = plane.dip;
  let assessment: RmrOrientationAssessment;
  let reason: string;
  const angle = `${strikeToAxis.toFixed(0)}°`;
  if (dip < 20) {
    assessment = 'fair';
    reason = `dip ${dip}° is under 20°: fair whatever the strike`;
  } else if (relation === 'parallel') {
    assessment = parallelCase(dip);
    reason = `strike ${angle} from the axis counts as parallel; dip ${dip}°`;
  } else if (relation === 'perpendicular') {
    assessment = perpendicularCase(dip, withDip);
    reason = `strike ${angle} from the axis counts as perpendicular; drive ${driveSense}, dip ${dip}°`;
  } else {
    const par = parallelCase(dip);
    const perp = perpendicularCase(dip, withDip);
    assessment = worse(par, perp);
    reason = `strike ${angle} from the axis lies between parallel and perpendicular; worse of ${par} (parallel) and ${perp} (perpendicular, drive ${driveSense}), dip ${dip}°`;
  }
  return {
    adjustment: RMR_TUNNEL_ADJUSTMENT[assessment],
    assessment,
    strikeToAxis,
    relation,
    driveSense,
    reason,
  };
}
