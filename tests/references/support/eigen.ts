import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { C } from './assignment';

/**
 * Roots of a real polynomial (highest power first, non-zero leading coefficient) as the eigenvalues
 * of its companion matrix, computed by ml-matrix (a port of the JAMA Hessenberg–QR eigensolver).
 * The matrix is balanced first by the Parlett–Reinsch diagonal scaling with powers of two (an exact
 * similarity, so the eigenvalues are unchanged; it only keeps the QR iteration accurate when the
 * coefficients span many orders of magnitude).
 */
export function companionEigenvalues(p: readonly number[]): C[] {
  let start = 0;
  while (start < p.length && p[start] === 0) start++;
  const a = p.slice(start);
  const n = a.length - 1;
  if (n < 1) return [];
  const m: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(n).fill(0);
    if (i === 0) for (let j = 0; j < n; j++) row[j] = -a[j + 1] / a[0];
    else row[i - 1] = 1;
    m.push(row);
  }
  balance(m);
  const evd = new EigenvalueDecomposition(new Matrix(m), { assumeSymmetric: false });
  return evd.realEigenvalues.map((re, i) => ({ re, im: evd.imaginaryEigenvalues[i] }));
}

/** Parlett–Reinsch balancing in place (radix 2, 1-norm of off-diagonal row and column parts). */
function balance(m: number[][]): void {
  const n = m.length;
  const radix = 2;
  let converged = false;
  while (!converged) {
    converged = true;
    for (let i = 0; i < n; i++) {
      let c = 0;
      let r = 0;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        c += Math.abs(m[j][i]);
        r += Math.abs(m[i][j]);
      }
      if (c === 0 || r === 0) continue;
      let g = r / radix;
      let f = 1;
      const s = c + r;
      while (c < g) {
        f *= radix;
        c *= radix * radix;
      }
      g = r * radix;
      while (c > g) {
        f /= radix;
        c /= radix * radix;
      }
      if ((c + r) / f < 0.95 * s) {
        converged = false;
        for (let j = 0; j < n; j++) m[i][j] /= f;
        for (let j = 0; j < n; j++) m[j][i] *= f;
      }
    }
  }
}
