/**
 * Solves the complex linear system (Ar + j·Ai)·x = (br + j·bi) by Gaussian elimination with partial
 * pivoting. Matrices are row-major arrays of rows; inputs are not modified. Returns `null` when the
 * matrix is singular to working precision.
 */
export function solveComplex(
  ar: readonly (readonly number[])[],
  ai: readonly (readonly number[])[],
  br: readonly number[],
  bi: readonly number[],
): { re: number[]; im: number[] } | null {
  const n = br.length;
  const mr = ar.map((row, i) => [...row, br[i]]);
  const mi = ai.map((row, i) => [...row, bi[i]]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    let best = Math.hypot(mr[col][col], mi[col][col]);
    for (let r = col + 1; r < n; r++) {
      const m = Math.hypot(mr[r][col], mi[r][col]);
      if (m > best) {
        best = m;
        pivot = r;
      }
    }
    if (best === 0) return null;
    [mr[col], mr[pivot]] = [mr[pivot], mr[col]];
    [mi[col], mi[pivot]] = [mi[pivot], mi[col]];
    const pr = mr[col][col];
    const pi = mi[col][col];
    const pd = pr * pr + pi * pi;
    for (let r = col + 1; r < n; r++) {
      // factor = m[r][col] / pivot
      const fr = (mr[r][col] * pr + mi[r][col] * pi) / pd;
      const fi = (mi[r][col] * pr - mr[r][col] * pi) / pd;
      if (fr === 0 && fi === 0) continue;
      for (let c = col; c <= n; c++) {
        mr[r][c] -= fr * mr[col][c] - fi * mi[col][c];
        mi[r][c] -= fr * mi[col][c] + fi * mr[col][c];
      }
    }
  }
  const xr = new Array<number>(n).fill(0);
  const xi = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let sr = mr[r][n];
    let si = mi[r][n];
    for (let c = r + 1; c < n; c++) {
      sr -= mr[r][c] * xr[c] - mi[r][c] * xi[c];
      si -= mr[r][c] * xi[c] + mi[r][c] * xr[c];
    }
    const pr = mr[r][r];
    const pi = mi[r][r];
    const pd = pr * pr + pi * pi;
    xr[r] = (sr * pr + si * pi) / pd;
    xi[r] = (si * pr - sr * pi) / pd;
  }
  return { re: xr, im: xi };
}
