// Daylight envelopes of the excavation's free surfaces, as regions of poles on the net. Each surface is a
// plane with an outward normal (from the rock into the opening), taken from the drive at the face:
//   left and right wall: vertical planes parallel to the axis, looking into the tunnel;
//   crown: the roof, parallel to the axis and to the horizontal across it, looking down;
//   face: perpendicular to the axis, looking back along the tunnel.
// A plane daylights on a surface when its dip vector points out of the rock through that surface:
// dipVector · n_out > 0. For a surface that does not overhang this is the usual rule — the plane dips
// within ±90° of the surface's outward dip direction and less steeply than the surface's apparent dip in
// that direction (geomath apparentDip) — and for an overhanging surface (the crown, the face of an uphill
// drive) it is the same test read the other way: the plane must dip more steeply than the surface there.
// Common practice for the test; the vector form is ours (computed here).
import { apparentDip, dipVector, dot, planeOfPole, tunnelFrame, vectorToLine } from '@roundbook/geomath';
import type { Drive, Line, Plane, Vector3 } from '@roundbook/geomath';

export type FreeSurface = 'left wall' | 'right wall' | 'crown' | 'face';
export const FREE_SURFACES: readonly FreeSurface[] = ['left wall', 'right wall', 'crown', 'face'];

export interface SurfaceOfDrive {
  surface: FreeSurface;
  /** Unit normal from the rock into the opening, north-east-down. */
  outward: Vector3;
  /** Azimuth of the outward normal's horizontal part (where the surface looks), or null for a level roof. */
  facing: number | null;
  /** The surface as a plane (dip direction / dip), for apparent dips. */
  plane: Plane;
}

const DEG = Math.PI / 180;

/** The four free surfaces at the face of a drive (trend, plunge positive down in the drive direction). */
export function surfacesOf(drive: Drive): SurfaceOfDrive[] {
  const { forward, up, right } = tunnelFrame(drive);
  const neg = (v: Vector3): Vector3 => [-v[0], -v[1], -v[2]];
  const outward: Record<FreeSurface, Vector3> = {
    'left wall': right,
    'right wall': neg(right),
    crown: neg(up),
    face: neg(forward),
  };
  return FREE_SURFACES.map((surface) => ({
    surface,
    outward: outward[surface],
    facing:
      Math.hypot(outward[surface][0], outward[surface][1]) < 1e-9
        ? null
        : (((Math.atan2(outward[surface][1], outward[surface][0]) / DEG) % 360) + 360) % 360,
    plane: planeOfPole(vectorToLine(outward[surface])),
  }));
}

/** Whether a plane daylights on a surface (dip vector out through it; a horizontal plane never does). */
export function daylightsOn(plane: Plane, surface: SurfaceOfDrive): boolean {
  if (plane.dip <= 1e-9) return false;
  return dot(dipVector(plane), surface.outward) > 1e-9;
}

/**
 * Range of dips [low, high] that daylight for planes of one dip direction, or null when none does. With
 * n_out's horizontal part h along the dip direction and its down part v: dipVector·n = h cos δ + v sin δ.
 */
export function daylightDips(surface: SurfaceOfDrive, dipDirection: number): [number, number] | null {
  const n = surface.outward;
  const h = n[0] * Math.cos(dipDirection * DEG) + n[1] * Math.sin(dipDirection * DEG);
  const v = n[2];
  const eps = 1e-9;
  if (h > eps && v > eps) return [0, 90];
  if (h > eps) return [0, apparentDip(surface.plane, dipDirection)];
  if (v > eps) return [apparentDip(surface.plane, dipDirection), 90];
  return null;
}

/**
 * The envelope as two rings of poles, sampled by pole trend: `outer` (steepest daylighting dip) and `inner`
 * (gentlest); the region is between them. Where no plane of a dip direction daylights both rings sit at the
 * centre. The trends where the range opens or closes are sampled on both sides, so the edges are exact.
 */
export function daylightEnvelope(
  surface: SurfaceOfDrive,
  stepDeg = 2,
): { outer: Line[]; inner: Line[]; widest: { trend: number; low: number; high: number } } {
  const n = surface.outward;
  // h = 0 where the dip direction is at ±90° of the azimuth of n's horizontal part.
  const az = Math.atan2(n[1], n[0]) / DEG;
  const trends = new Set<number>();
  for (let t = 0; t < 360; t += stepDeg) trends.add(t);
  if (Math.hypot(n[0], n[1]) > 1e-9) {
    for (const b of [az + 90, az - 90]) {
      const poleTrend = (((b + 180) % 360) + 360) % 360;
      trends.add(Math.max(0, poleTrend - 1e-6));
      trends.add(Math.min(359.999999, poleTrend + 1e-6));
    }
  }
  const sorted = [...trends].sort((a, b) => a - b);
  sorted.push(sorted[0] + 360);
  const outer: Line[] = [];
  const inner: Line[] = [];
  const ranges: Array<{ trend: number; low: number; high: number }> = [];
  for (const poleTrend of sorted) {
    const range = daylightDips(surface, poleTrend + 180);
    const [low, high] = range ?? [0, 0];
    outer.push({ trend: poleTrend, plunge: 90 - high });
    inner.push({ trend: poleTrend, plunge: 90 - low });
    ranges.push({ trend: poleTrend % 360, low, high });
  }
  // Where the region is widest: the middle (circular mean) of the trends of greatest width, so a half-net
  // region is named at its middle; when every trend is as wide (a whole-net crown) the first is used.
  const most = Math.max(...ranges.map((r) => r.high - r.low));
  const best = ranges.filter((r) => r.high - r.low >= most - 1e-6);
  const sx = best.reduce((sum, r) => sum + Math.sin(r.trend * DEG), 0);
  const cx = best.reduce((sum, r) => sum + Math.cos(r.trend * DEG), 0);
  let widest = best[0];
  if (Math.hypot(sx, cx) > 0.2 * best.length) {
    const mean = (((Math.atan2(sx, cx) / DEG) % 360) + 360) % 360;
    widest = best.reduce((a, r) =>
      Math.abs(((r.trend - mean + 540) % 360) - 180) < Math.abs(((a.trend - mean + 540) % 360) - 180) ? r : a,
    );
  }
  return { outer, inner, widest };
}
