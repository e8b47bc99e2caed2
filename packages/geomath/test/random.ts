import type { Line, Plane } from '../src/index.js';

/** Small seeded generator (mulberry32) so that cross-checks are repeatable. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Lines uniformly distributed over the lower hemisphere. */
export function randomLines(count: number, seed: number): Line[] {
  const rnd = seededRandom(seed);
  return Array.from({ length: count }, () => ({
    trend: rnd() * 360,
    plunge: (Math.asin(rnd()) * 180) / Math.PI,
  }));
}

export function randomPlanes(count: number, seed: number): Plane[] {
  return randomLines(count, seed).map((l) => ({ dipDirection: (l.trend + 180) % 360, dip: 90 - l.plunge }));
}
