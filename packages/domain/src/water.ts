/** Inflow per 10 m of tunnel from the inflow and the length it comes from (l/min per 10 m). */
export function inflowPer10m(inflowLpm: number | null, lengthM: number | null): number | null {
  if (inflowLpm === null || lengthM === null || lengthM <= 0) return null;
  return (inflowLpm * 10) / lengthM;
}
