// Eigenvectors of a symmetric 3 × 3 matrix by cyclic Jacobi rotations (orientation tensor T = Σ x xᵀ).
import type { Vector3 } from './types.js';

/** Symmetric matrix as [a00, a01, a02, a11, a12, a22]. */
export type Symmetric3 = [number, number, number, number, number, number];

/** Eigenvalues (descending) and unit eigenvectors of a symmetric 3 × 3 matrix. */
export function symmetricEigen(m: Symmetric3): { values: Vector3; vectors: [Vector3, Vector3, Vector3] } {
  const a = [
    [m[0], m[1], m[2]],
    [m[1], m[3], m[4]],
    [m[2], m[4], m[5]],
  ];
  const v = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  for (let sweep = 0; sweep < 50; sweep++) {
    const off = Math.abs(a[0][1]) + Math.abs(a[0][2]) + Math.abs(a[1][2]);
    if (off < 1e-15 * (Math.abs(a[0][0]) + Math.abs(a[1][1]) + Math.abs(a[2][2]) + 1e-300)) break;
    for (const [p, q] of [
      [0, 1],
      [0, 2],
      [1, 2],
    ] as const) {
      const apq = a[p][q];
      if (apq === 0) continue;
      const theta = (a[q][q] - a[p][p]) / (2 * apq);
      const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
      const c = 1 / Math.sqrt(t * t + 1);
      const s = t * c;
      for (let k = 0; k < 3; k++) {
        const akp = a[k][p];
        const akq = a[k][q];
        a[k][p] = c * akp - s * akq;
        a[k][q] = s * akp + c * akq;
      }
      for (let k = 0; k < 3; k++) {
        const apk = a[p][k];
        const aqk = a[q][k];
        a[p][k] = c * apk - s * aqk;
        a[q][k] = s * apk + c * aqk;
      }
      for (let k = 0; k < 3; k++) {
        const vkp = v[k][p];
        const vkq = v[k][q];
        v[k][p] = c * vkp - s * vkq;
        v[k][q] = s * vkp + c * vkq;
      }
    }
  }
  const order = [0, 1, 2].sort((i, j) => a[j][j] - a[i][i]);
  const col = (i: number): Vector3 => [v[0][i], v[1][i], v[2][i]];
  const [i0, i1, i2] = order as [number, number, number];
  return { values: [a[i0][i0], a[i1][i1], a[i2][i2]], vectors: [col(i0), col(i1), col(i2)] };
}
