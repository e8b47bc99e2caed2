import type { Line } from '../src/index.js';
import { seededRandom } from './random.js';

/**
 * Invented poles scattered about given means: each pole is the mean tilted by an angle up to `spread`
 * (uniform over the cap) in a random direction; upward results are written as their lower-hemisphere line.
 */
export function scatteredSet(mean: Line, count: number, spread: number, seed: number): Line[] {
  const rnd = seededRandom(seed);
  const d = Math.PI / 180;
  const t = mean.trend * d;
  const p = mean.plunge * d;
  const a: [number, number, number] = [Math.cos(p) * Math.cos(t), Math.cos(p) * Math.sin(t), Math.sin(p)];
  // two unit vectors perpendicular to a
  const u: [number, number, number] = [-Math.sin(t), Math.cos(t), 0];
  const v: [number, number, number] = [
    a[1] * u[2] - a[2] * u[1],
    a[2] * u[0] - a[0] * u[2],
    a[0] * u[1] - a[1] * u[0],
  ];
  return Array.from({ length: count }, () => {
    const cosr = 1 - rnd() * (1 - Math.cos(spread * d));
    const sinr = Math.sqrt(1 - cosr * cosr);
    const phi = rnd() * 2 * Math.PI;
    let x = cosr * a[0] + sinr * (Math.cos(phi) * u[0] + Math.sin(phi) * v[0]);
    let y = cosr * a[1] + sinr * (Math.cos(phi) * u[1] + Math.sin(phi) * v[1]);
    let z = cosr * a[2] + sinr * (Math.cos(phi) * u[2] + Math.sin(phi) * v[2]);
    if (z < 0) {
      x = -x;
      y = -y;
      z = -z;
    }
    return { trend: (Math.atan2(y, x) / d + 360) % 360, plunge: Math.asin(Math.min(1, z)) / d };
  });
}
