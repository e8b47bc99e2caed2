// Spatial binning of axial unit vectors for kernel sums with a cut-off (used by density grids and set
// finding). Each datum is stored twice (x and −x) in a uniform 3-D grid whose cell is at least the chord
// of the cut-off cap, so every datum within the cap of a query lies in the 27 cells around it.

// Module-level aliases: cheaper than global look-ups in hot loops (notably in sandboxed test runs).
const { exp, max, min, floor, sqrt } = Math;

/** Poles, as unit vectors in flat arrays, with optional weights. */
export interface UnitVectors {
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  w: Float64Array;
  count: number;
}

export class AxialIndex {
  readonly cosCut: number;
  private readonly m: number;
  private readonly h: number;
  private readonly start: Int32Array;
  private readonly px: Float64Array;
  private readonly py: Float64Array;
  private readonly pz: Float64Array;
  private readonly pw: Float64Array;

  /** cosCut must be above 0 (cap narrower than 90°), so that x and −x never both fall in one cap. */
  constructor(data: UnitVectors, cosCut: number) {
    if (!(cosCut > 0)) throw new RangeError('AxialIndex needs a cap narrower than 90°.');
    this.cosCut = cosCut;
    const chord = sqrt(2 * (1 - cosCut));
    const m = max(1, min(64, floor(2 / chord)));
    this.m = m;
    this.h = 2 / m;
    const n2 = data.count * 2;
    const cellOf = new Int32Array(n2);
    const counts = new Int32Array(m * m * m + 1);
    for (let i = 0; i < data.count; i++) {
      const a = this.cell(data.x[i], data.y[i], data.z[i]);
      const b = this.cell(-data.x[i], -data.y[i], -data.z[i]);
      cellOf[2 * i] = a;
      cellOf[2 * i + 1] = b;
      counts[a + 1]++;
      counts[b + 1]++;
    }
    for (let c = 0; c < m * m * m; c++) counts[c + 1] += counts[c];
    this.start = counts.slice();
    const fill = counts.slice(0, m * m * m);
    this.px = new Float64Array(n2);
    this.py = new Float64Array(n2);
    this.pz = new Float64Array(n2);
    this.pw = new Float64Array(n2);
    for (let j = 0; j < n2; j++) {
      const i = j >> 1;
      const s = j & 1 ? -1 : 1;
      const at = fill[cellOf[j]]++;
      this.px[at] = s * data.x[i];
      this.py[at] = s * data.y[i];
      this.pz[at] = s * data.z[i];
      this.pw[at] = data.w[i];
    }
  }

  /** Bytes held by the index arrays. */
  get bytes(): number {
    return this.start.byteLength + 4 * this.px.byteLength;
  }

  private coord(v: number): number {
    const c = floor((v + 1) / this.h);
    return c < 0 ? 0 : c >= this.m ? this.m - 1 : c;
  }

  private cell(x: number, y: number, z: number): number {
    return (this.coord(x) * this.m + this.coord(y)) * this.m + this.coord(z);
  }

  /** Σ w·exp(k(x·g − 1)) over data with x·g ≥ cosCut (either sign of each datum). */
  sumExp(gx: number, gy: number, gz: number, k: number): number {
    const m = this.m;
    const cx = this.coord(gx);
    const cy = this.coord(gy);
    const cz = this.coord(gz);
    const cut = this.cosCut;
    const { px, py, pz, pw, start } = this;
    let sum = 0;
    for (let i = max(0, cx - 1); i <= min(m - 1, cx + 1); i++) {
      for (let j = max(0, cy - 1); j <= min(m - 1, cy + 1); j++) {
        const base = (i * m + j) * m;
        const c0 = base + max(0, cz - 1);
        const c1 = base + min(m - 1, cz + 1);
        const end = start[c1 + 1];
        for (let p = start[c0]; p < end; p++) {
          const c = px[p] * gx + py[p] * gy + pz[p] * gz;
          if (c >= cut) sum += pw[p] * exp(k * (c - 1));
        }
      }
    }
    return sum;
  }

  /** Σ w over data with x·g ≥ cosCut (either sign of each datum). */
  sumWithin(gx: number, gy: number, gz: number): number {
    const m = this.m;
    const cx = this.coord(gx);
    const cy = this.coord(gy);
    const cz = this.coord(gz);
    const cut = this.cosCut;
    const { px, py, pz, pw, start } = this;
    let sum = 0;
    for (let i = max(0, cx - 1); i <= min(m - 1, cx + 1); i++) {
      for (let j = max(0, cy - 1); j <= min(m - 1, cy + 1); j++) {
        const base = (i * m + j) * m;
        const end = start[base + min(m - 1, cz + 1) + 1];
        for (let p = start[base + max(0, cz - 1)]; p < end; p++) {
          if (px[p] * gx + py[p] * gy + pz[p] * gz >= cut) sum += pw[p];
        }
      }
    }
    return sum;
  }
}
