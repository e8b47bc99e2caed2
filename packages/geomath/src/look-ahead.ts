import type { ChainageSense } from './heading-alignment.js';
import { chainageSign } from './heading-alignment.js';
import { DEG } from './math.js';
import { tunnelFrame } from './tunnel-frame.js';
import type { Drive, Plane, Vector3 } from './types.js';
import { OrientationError, RatingError } from './types.js';
import { add, dot, planeNormal, scale } from './vector.js';

/**
 * Where a plane mapped on the face crosses lines parallel to the tunnel axis (methods.md §6):
 * t = n·(P − Q0)/(n·a), chainage = face chainage + t (slope distance along the axis).
 */
export interface PlaneCrossingsInput {
  plane: Plane;
  /** Face chainage, metres. */
  chainage: number;
  /** The mapped point on the face relative to the axis, metres (right of and above the axis). */
  offset: { right: number; up: number };
  drive: Drive;
  /** Crown height above the axis, invert depth below it, half-width to each wall; metres, >= 0. */
  crownHeight: number;
  invertDepth: number;
  halfWidth: number;
  /**
   * How chainage runs in the drive direction (default 'increasing'). With 'decreasing' (a heading driven
   * against the chainage) a crossing ahead of the face has a smaller chainage than the face.
   */
  chainageSense?: ChainageSense;
}

export interface PlaneCrossings {
  axis: number | null;
  crown: number | null;
  invert: number | null;
  rightWall: number | null;
  leftWall: number | null;
}

/** |n·a| below sin 0.5°: the plane runs along the tunnel (contract). */
export const ALONG_TUNNEL_LIMIT = Math.sin(0.5 * DEG);

function requireLength(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0) {
    throw new RatingError(`${name} ${String(value)} m is not valid: expected a finite length of 0 m or more`);
  }
}

function checkPlane(plane: Plane): void {
  if (
    !Number.isFinite(plane.dipDirection) ||
    !Number.isFinite(plane.dip) ||
    plane.dip < 0 ||
    plane.dip > 90
  ) {
    throw new OrientationError(
      `plane ${String(plane.dipDirection)}/${String(plane.dip)} is not valid: expected a dip direction and a dip from 0 to 90`,
    );
  }
}

/**
 * Chainages where the plane crosses the axis, crown, invert and walls; null where it runs along them.
 * The distance t along the axis in the drive direction becomes chainage face + t, or face − t when the
 * chainage decreases in the drive direction (`chainageSense: 'decreasing'`).
 */
export function planeCrossings(input: PlaneCrossingsInput): PlaneCrossings {
  checkCommon(input);
  requireLength('crown height', input.crownHeight);
  requireLength('invert depth', input.invertDepth);
  requireLength('half-width', input.halfWidth);
  return crossingsAt(input, input);
}

/**
 * Like planeCrossings for one stage's part of the profile (see `stagePart`): `crown` is the top of the
 * part and `invert` its floor, with signed heights relative to the axis (a bench below the axis has a
 * negative crownHeight); the walls at the part's largest half-width.
 */
export function stageCrossings(
  input: Omit<PlaneCrossingsInput, 'crownHeight' | 'invertDepth' | 'halfWidth'>,
  part: { crownHeight: number; invertDepth: number; halfWidth: number },
): PlaneCrossings {
  checkCommon(input);
  if (!Number.isFinite(part.crownHeight) || !Number.isFinite(part.invertDepth)) {
    throw new RatingError("the part's crown height and invert depth must be finite numbers of metres");
  }
  if (part.crownHeight + part.invertDepth < 0) {
    throw new RatingError(
      "the part's crown lies below its floor: expected crownHeight + invertDepth of 0 m or more",
    );
  }
  requireLength('half-width', part.halfWidth);
  return crossingsAt(input, part);
}

function checkCommon(input: Omit<PlaneCrossingsInput, 'crownHeight' | 'invertDepth' | 'halfWidth'>): void {
  checkPlane(input.plane);
  if (!Number.isFinite(input.chainage))
    throw new RatingError('face chainage must be a finite number of metres');
  if (!Number.isFinite(input.offset.right) || !Number.isFinite(input.offset.up)) {
    throw new RatingError('the mapped point offsets must be finite numbers of metres');
  }
}

function crossingsAt(
  input: Omit<PlaneCrossingsInput, 'crownHeight' | 'invertDepth' | 'halfWidth'>,
  levels: { crownHeight: number; invertDepth: number; halfWidth: number },
): PlaneCrossings {
  const sign = chainageSign(input.chainageSense);
  const frame = tunnelFrame(input.drive);
  const n = planeNormal(input.plane);
  const na = dot(n, frame.forward);
  const point = add(scale(frame.right, input.offset.right), scale(frame.up, input.offset.up));
  const along = (origin: Vector3): number | null => {
    if (Math.abs(na) < ALONG_TUNNEL_LIMIT) return null;
    return input.chainage + (sign * (dot(n, point) - dot(n, origin))) / na;
  };
  return {
    axis: along([0, 0, 0]),
    crown: along(scale(frame.up, levels.crownHeight)),
    invert: along(scale(frame.up, -levels.invertDepth)),
    rightWall: along(scale(frame.right, levels.halfWidth)),
    leftWall: along(scale(frame.right, -levels.halfWidth)),
  };
}

export type MappedPlaneKind =
  'fault' | 'shear' | 'set' | 'joint' | 'bedding' | 'foliation' | 'vein' | 'contact';

export interface MappedPlane {
  label: string;
  kind: MappedPlaneKind;
  plane: Plane;
  /** Where the plane was mapped on the face; default the axis. */
  offset?: { right: number; up: number };
}

export interface RoundArrivalInput {
  planes: readonly MappedPlane[];
  faceChainage: number;
  /** Planned round length, metres (> 0). */
  roundLength: number;
  drive: Drive;
  crownHeight: number;
  invertDepth: number;
  halfWidth: number;
  /** Default 'increasing'; see PlaneCrossingsInput. */
  chainageSense?: ChainageSense;
}

/**
 * Where one line of the tunnel meets the plane relative to the coming rounds. Round k (1 = the next round)
 * covers distances ahead of the face over (k − 1)·L up to and including k·L: a crossing exactly at the end
 * of a round is exposed by that round. A crossing at or behind the face is 'behind'. Distances ahead are
 * measured in the drive direction, so they are positive ahead whatever the chainage sense.
 */
export type Arrival =
  | { status: 'ahead'; chainage: number; distanceAhead: number; round: number }
  | { status: 'behind'; chainage: number; distanceAhead: number }
  | { status: 'runs along the tunnel' };

export interface RoundArrival {
  label: string;
  kind: MappedPlaneKind;
  crown: Arrival;
  invert: Arrival;
  /** Our own sentence for the handover and the long section. */
  summary: string;
}

function arrival(chainage: number | null, face: number, roundLength: number, sign: 1 | -1): Arrival {
  if (chainage === null) return { status: 'runs along the tunnel' };
  const distanceAhead = sign * (chainage - face);
  if (distanceAhead <= 0) return { status: 'behind', chainage, distanceAhead };
  // A tiny tolerance so that a crossing computed as k·L + 1e-12 still belongs to round k.
  const round = Math.max(1, Math.ceil(distanceAhead / roundLength - 1e-9));
  return { status: 'ahead', chainage, distanceAhead, round };
}

function describe(where: 'crown' | 'invert', a: Arrival): string {
  switch (a.status) {
    case 'ahead':
      return `reaches the ${where} in round ${a.round} from now, at chainage ${a.chainage.toFixed(1)} (${a.distanceAhead.toFixed(1)} m ahead)`;
    case 'behind':
      return `crossed the ${where} at chainage ${a.chainage.toFixed(1)}, ${(-a.distanceAhead).toFixed(1)} m behind the face`;
    case 'runs along the tunnel':
      return `runs along the ${where}`;
  }
}

/** For each mapped plane, the upcoming round in which it reaches the crown and the invert. */
export function roundsToCrownAndInvert(input: RoundArrivalInput): RoundArrival[] {
  if (!Number.isFinite(input.roundLength) || input.roundLength <= 0) {
    throw new RatingError(`round length ${String(input.roundLength)} m is not valid: expected more than 0 m`);
  }
  const sign = chainageSign(input.chainageSense);
  return input.planes.map((mapped) => {
    const crossings = planeCrossings({
      chainageSense: input.chainageSense,
      plane: mapped.plane,
      chainage: input.faceChainage,
      offset: mapped.offset ?? { right: 0, up: 0 },
      drive: input.drive,
      crownHeight: input.crownHeight,
      invertDepth: input.invertDepth,
      halfWidth: input.halfWidth,
    });
    const crown = arrival(crossings.crown, input.faceChainage, input.roundLength, sign);
    const invert = arrival(crossings.invert, input.faceChainage, input.roundLength, sign);
    return {
      label: mapped.label,
      kind: mapped.kind,
      crown,
      invert,
      summary: `${mapped.label} (${mapped.kind}) ${describe('crown', crown)}; ${describe('invert', invert)}.`,
    };
  });
}
