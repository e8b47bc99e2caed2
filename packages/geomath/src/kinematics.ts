import { DEG, azimuthDifference, normalizeAzimuth, toDegrees } from './math.js';
import { tunnelFrame } from './tunnel-frame.js';
import type { Drive, Line, Plane, Vector3 } from './types.js';
import { OrientationError, RatingError } from './types.js';
import { cross, dipVector, dot, norm, normalize, planeNormal, scale, vectorToLine } from './vector.js';

/**
 * Kinematic screens around a tunnel (methods.md §5): planar sliding out of a wall or the face (Markland-type
 * test with ±20°, after Hoek & Bray 1981 and Hudson & Harrison 1997 Fig. 18.2), wedges sliding out of a wall
 * or the face along an intersection line, and tetrahedral roof wedges (Hoek & Brown 1980 ch. 7; Goodman &
 * Shi 1985) by the vector form of methods.md §5. Screens only: see the 'kinematic-screen' caution.
 *
 * Boundary conventions: a dip direction exactly 20° from the facing direction is inside the ±20° window;
 * a dip or plunge equal to the friction angle does not slide (it must be steeper); a dip equal to the
 * surface inclination does not daylight (it must be shallower).
 */
export type ExcavationSurface = 'right wall' | 'left wall' | 'face';

/** Default half-width of the window around a surface's facing direction, degrees. */
export const LATERAL_LIMIT = 20;

export interface SurfaceGeometry {
  /** Azimuth the surface looks toward (its outward normal into the opening), degrees. */
  facing: number;
  /** Inclination of the surface from horizontal, degrees (90 for a vertical wall or face). */
  inclination: number;
}

/**
 * Facing direction of a surface of the excavation: the right wall looks toward drive − 90°, the left wall
 * toward drive + 90°, the face back along the tunnel (drive + 180°).
 */
export function surfaceFacing(drive: Drive, surface: ExcavationSurface): number {
  switch (surface) {
    case 'right wall':
      return normalizeAzimuth(drive.trend - 90);
    case 'left wall':
      return normalizeAzimuth(drive.trend + 90);
    case 'face':
      return normalizeAzimuth(drive.trend + 180);
  }
}

function checkAngle(name: string, value: number, min: number, max: number): void {
  if (!Number.isFinite(value) || value < min || value > max) {
    throw new RatingError(`${name} ${String(value)}° is not valid: expected ${min}° to ${max}°`);
  }
}

/** Apparent inclination of a surface in the vertical section of azimuth `trend`: tan = tan ψ·cos β. */
function apparentInclination(surface: SurfaceGeometry, trend: number): number {
  const beta = azimuthDifference(trend, surface.facing);
  if (beta >= 90) return 0;
  if (surface.inclination >= 90 - 1e-9) return 90;
  return toDegrees(Math.atan(Math.tan(surface.inclination * DEG) * Math.cos(beta * DEG)));
}

export interface SlidingCheck {
  flagged: boolean;
  /** Direction the block would move (the dip vector or the intersection line). */
  direction: Line;
  /** Our own words: which conditions hold and which fail. */
  reason: string;
}

/** Planar sliding of one plane out of a surface: direction within ±limit, daylights, steeper than φ. */
export function planarSlidingOut(
  plane: Plane,
  surface: SurfaceGeometry,
  frictionAngle: number,
  lateralLimit = LATERAL_LIMIT,
): SlidingCheck {
  checkAngle('friction angle', frictionAngle, 0, 90);
  checkAngle('dip', plane.dip, 0, 90);
  checkAngle('surface inclination', surface.inclination, 0, 90);
  const off = azimuthDifference(plane.dipDirection, surface.facing);
  const inWindow = off <= lateralLimit;
  const daylights = plane.dip < surface.inclination;
  const steep = plane.dip > frictionAngle;
  const parts = [
    inWindow
      ? `dips ${off.toFixed(0)}° from the surface's facing direction (within ±${lateralLimit}°)`
      : `dips ${off.toFixed(0)}° away from the surface's facing direction (more than ±${lateralLimit}°)`,
    daylights
      ? `its dip ${plane.dip}° is shallower than the surface (${surface.inclination}°), so it daylights`
      : `its dip ${plane.dip}° is not shallower than the surface (${surface.inclination}°)`,
    steep
      ? `its dip is steeper than the friction angle ${frictionAngle}°`
      : `its dip is not steeper than the friction angle ${frictionAngle}°`,
  ];
  return {
    flagged: inWindow && daylights && steep,
    direction: { trend: normalizeAzimuth(plane.dipDirection), plunge: plane.dip },
    reason: parts.join('; '),
  };
}

/** Downward unit intersection line of two planes; null when they are (nearly) parallel. */
function downwardEdge(a: Plane, b: Plane): Vector3 | null {
  const v = cross(planeNormal(a), planeNormal(b));
  if (norm(v) < Math.sin(0.5 * DEG)) return null;
  const u = normalize(v);
  return u[2] < 0 ? scale(u, -1) : u;
}

/** Wedge sliding out of a surface along the intersection of two planes. */
export function wedgeSlidingOut(
  a: Plane,
  b: Plane,
  surface: SurfaceGeometry,
  frictionAngle: number,
): SlidingCheck | null {
  checkAngle('friction angle', frictionAngle, 0, 90);
  checkAngle('surface inclination', surface.inclination, 0, 90);
  const edge = downwardEdge(a, b);
  if (edge === null) return null;
  const line = vectorToLine(edge);
  const off = azimuthDifference(line.trend, surface.facing);
  const outward = off < 90 && line.plunge > 1e-9;
  const limit = apparentInclination(surface, line.trend);
  const daylights = outward && line.plunge < limit;
  const steep = line.plunge > frictionAngle;
  const where = `the intersection line ${formatLine(line)}`;
  const parts = [
    outward
      ? `${where} points out of the surface (${off.toFixed(0)}° from its facing direction)`
      : `${where} does not point out of the surface`,
    daylights
      ? `it plunges less than the surface in that direction (${limit.toFixed(0)}°), so it daylights`
      : `it does not daylight`,
    steep
      ? `it plunges more steeply than the friction angle ${frictionAngle}°`
      : `it is not steeper than the friction angle ${frictionAngle}°`,
  ];
  return { flagged: outward && daylights && steep, direction: line, reason: parts.join('; ') };
}

export interface RoofWedgeResult {
  mode: 'falls' | 'slides' | 'stable';
  /** Given when mode is 'slides'. */
  direction?: Line;
  /** The three downward intersection lines: planes 1–2, 2–3, 1–3. */
  edges: [Line, Line, Line];
  /** Gravity written as c1·I12 + c2·I23 + c3·I13. All positive: free fall. */
  coefficients: [number, number, number];
  /** The steepest admissible sliding direction (also when it is not steeper than φ). */
  steepest: Line;
}

function det3(a: Vector3, b: Vector3, c: Vector3): number {
  return dot(a, cross(b, c));
}

/** Coefficients x, y with v = x·p + y·q for v in the plane of p and q. */
function inPlaneCoefficients(v: Vector3, p: Vector3, q: Vector3): [number, number] {
  const pq = cross(p, q);
  const d = dot(pq, pq);
  return [dot(cross(v, q), pq) / d, dot(cross(p, v), pq) / d];
}

/**
 * A tetrahedral roof wedge bounded by three planes under a horizontal roof. It falls when gravity lies inside
 * the cone of the three downward intersection lines (all coefficients > 0). Otherwise the candidates are the
 * three intersection lines and the dip vector of each plane that lies between that plane's two edges; the
 * steepest slides when its plunge is greater than φ; otherwise the wedge is kinematically stable.
 * OrientationError when two planes are parallel, an intersection line is horizontal (within 0.5°) or the three
 * meet in one line: then there is no tetrahedral wedge.
 */
export function roofWedge(planes: [Plane, Plane, Plane], frictionAngle: number): RoofWedgeResult {
  checkAngle('friction angle', frictionAngle, 0, 90);
  planes.forEach((p, i) => checkAngle(`dip of plane ${i + 1}`, p.dip, 0, 90));
  const i12 = downwardEdge(planes[0], planes[1]);
  const i23 = downwardEdge(planes[1], planes[2]);
  const i13 = downwardEdge(planes[0], planes[2]);
  if (i12 === null || i23 === null || i13 === null) {
    throw new OrientationError('two of the three planes are parallel: they form no tetrahedral roof wedge');
  }
  if ([i12, i23, i13].some((e) => e[2] < Math.sin(0.5 * DEG))) {
    throw new OrientationError(
      'an intersection line of the three planes is horizontal: they bound a prism along the roof, not a tetrahedral wedge',
    );
  }
  const det = det3(i12, i23, i13);
  if (Math.abs(det) < 1e-9) {
    throw new OrientationError('the three planes meet in one line: they form no tetrahedral roof wedge');
  }
  const g: Vector3 = [0, 0, 1];
  const coefficients: [number, number, number] = [
    det3(g, i23, i13) / det,
    det3(i12, g, i13) / det,
    det3(i12, i23, g) / det,
  ];
  const edges: [Line, Line, Line] = [vectorToLine(i12), vectorToLine(i23), vectorToLine(i13)];
  const candidates: Vector3[] = [i12, i23, i13];
  // Each plane with its two edges: plane 1 holds I12 and I13, plane 2 holds I12 and I23, plane 3 I23 and I13.
  const faces: [Plane, Vector3, Vector3][] = [
    [planes[0], i12, i13],
    [planes[1], i12, i23],
    [planes[2], i23, i13],
  ];
  for (const [plane, p, q] of faces) {
    if (plane.dip <= 1e-9) continue;
    const d = dipVector(plane);
    const [x, y] = inPlaneCoefficients(d, p, q);
    if (x >= -1e-12 && y >= -1e-12) candidates.push(d);
  }
  const steepestVector = candidates.reduce((best, v) => (v[2] > best[2] ? v : best));
  const steepest = vectorToLine(steepestVector);
  if (coefficients.every((c) => c > 1e-12)) return { mode: 'falls', edges, coefficients, steepest };
  if (steepest.plunge > frictionAngle)
    return { mode: 'slides', direction: steepest, edges, coefficients, steepest };
  return { mode: 'stable', edges, coefficients, steepest };
}

function formatLine(line: Line): string {
  const t = Math.round(line.trend) % 360;
  return `${String(t).padStart(3, '0')}/${String(Math.round(line.plunge)).padStart(2, '0')}`;
}

function formatPlaneShort(plane: Plane): string {
  const d = Math.round(normalizeAzimuth(plane.dipDirection)) % 360;
  return `${String(d).padStart(3, '0')}/${String(Math.round(plane.dip)).padStart(2, '0')}`;
}

export interface ScreenedPlane {
  label: string;
  /** A set mean, or a significant single feature (fault, shear, persistent joint). */
  kind: 'set' | 'feature';
  plane: Plane;
}

export interface KinematicScreenInput {
  planes: readonly ScreenedPlane[];
  drive: Drive;
  frictionAngle: number;
  /** Wall and face inclinations from horizontal (default 90, vertical). */
  profile?: { wallInclination?: number; faceInclination?: number };
  /** Window around a facing direction for planar sliding, default 20°. */
  lateralLimit?: number;
}

export type KinematicMechanism =
  'planar sliding' | 'wedge sliding' | 'roof wedge falls' | 'roof wedge slides';

export interface KinematicFlag {
  mechanism: KinematicMechanism;
  surface: ExcavationSurface | 'roof';
  labels: string[];
  direction: Line;
  reason: string;
}

function pairs<T>(items: readonly T[]): [T, T][] {
  const out: [T, T][] = [];
  for (let i = 0; i < items.length; i++)
    for (let j = i + 1; j < items.length; j++) out.push([items[i], items[j]]);
  return out;
}

function triples<T>(items: readonly T[]): [T, T, T][] {
  const out: [T, T, T][] = [];
  for (let i = 0; i < items.length; i++)
    for (let j = i + 1; j < items.length; j++)
      for (let k = j + 1; k < items.length; k++) out.push([items[i], items[j], items[k]]);
  return out;
}

function named(p: ScreenedPlane): string {
  return `${p.kind === 'set' ? 'set' : 'feature'} ${p.label} (${formatPlaneShort(p.plane)})`;
}

/**
 * Every flagged combination for one round: planar sliding out of each wall and the face, wedges sliding out
 * of each wall and the face, and roof wedges that fall or slide. Each flag carries its reason in words.
 */
export function screenRound(input: KinematicScreenInput): KinematicFlag[] {
  tunnelFrame(input.drive); // validates the drive
  checkAngle('friction angle', input.frictionAngle, 0, 90);
  const wall = input.profile?.wallInclination ?? 90;
  const face = input.profile?.faceInclination ?? 90;
  const surfaces: ExcavationSurface[] = ['right wall', 'left wall', 'face'];
  const geometry = (s: ExcavationSurface): SurfaceGeometry => ({
    facing: surfaceFacing(input.drive, s),
    inclination: s === 'face' ? face : wall,
  });
  const flags: KinematicFlag[] = [];
  for (const surface of surfaces) {
    const g = geometry(surface);
    for (const p of input.planes) {
      const check = planarSlidingOut(p.plane, g, input.frictionAngle, input.lateralLimit ?? LATERAL_LIMIT);
      if (check.flagged) {
        flags.push({
          mechanism: 'planar sliding',
          surface,
          labels: [p.label],
          direction: check.direction,
          reason: `${named(p)} can slide out of the ${surface}: it ${check.reason}.`,
        });
      }
    }
    for (const [a, b] of pairs(input.planes)) {
      const check = wedgeSlidingOut(a.plane, b.plane, g, input.frictionAngle);
      if (check?.flagged === true) {
        flags.push({
          mechanism: 'wedge sliding',
          surface,
          labels: [a.label, b.label],
          direction: check.direction,
          reason: `A wedge between ${named(a)} and ${named(b)} can slide out of the ${surface}: ${check.reason}.`,
        });
      }
    }
  }
  for (const [a, b, c] of triples(input.planes)) {
    let result: RoofWedgeResult;
    try {
      result = roofWedge([a.plane, b.plane, c.plane], input.frictionAngle);
    } catch (error) {
      if (error instanceof OrientationError) continue; // parallel planes: no tetrahedral wedge
      throw error;
    }
    const who = `${named(a)}, ${named(b)} and ${named(c)}`;
    const edges = result.edges.map(formatLine).join(', ');
    if (result.mode === 'falls') {
      flags.push({
        mechanism: 'roof wedge falls',
        surface: 'roof',
        labels: [a.label, b.label, c.label],
        direction: { trend: 0, plunge: 90 },
        reason: `${who} close off a roof wedge that can drop straight down: the vertical lies inside its three edges (${edges}).`,
      });
    } else if (result.mode === 'slides' && result.direction !== undefined) {
      flags.push({
        mechanism: 'roof wedge slides',
        surface: 'roof',
        labels: [a.label, b.label, c.label],
        direction: result.direction,
        reason: `${who} close off a roof wedge that cannot drop freely but can slide along ${formatLine(result.direction)}, which is steeper than the friction angle ${input.frictionAngle}° (edges ${edges}).`,
      });
    }
  }
  return flags;
}
