import { companionEigenvalues } from './eigen';
import { polyEval, polyPad, polyTrim, polyDeterminant, type Poly } from './poly';

/**
 * Symbolic-in-K Hurwitz analysis of D(s) + K·N(s), done by the tests themselves.
 *
 * The characteristic coefficients are linear in K: a_i(K) = d_i + K·n_i. The Hurwitz matrix has entry
 * (i, j) = a_{2j−i} (1-based, a_k = 0 outside 0…n) and its leading minors Δ_1 … Δ_n are polynomials
 * in K. With a_0 > 0 the closed loop is stable exactly when every Δ_k(K) > 0 (Hurwitz 1895; e.g.
 * F. R. Gantmacher, "The Theory of Matrices", vol. 2, ch. XV — recalled from memory). A boundary of the
 * stable set is a gain where a root reaches the imaginary axis: a_n(K) = 0 (a root at s = 0) or
 * Δ_{n−1}(K) = 0 (a pair ±jω, by Orlando's formula Δ_{n−1} = ±a_0^{n−1}·Π_{i<j}(s_i + s_j)).
 */
export function hurwitzDeterminants(numerator: readonly number[], denominator: readonly number[]): Poly[] {
  const n = denominator.length - 1;
  const paddedN = polyPad(numerator, n + 1);
  // a_k as a polynomial in K, highest power of K first: [n_k, d_k]
  const a = (k: number): Poly => (k < 0 || k > n ? [0] : polyTrim([paddedN[k], denominator[k]]));
  const deltas: Poly[] = [];
  for (let size = 1; size <= n; size++) {
    const m: Poly[][] = [];
    for (let i = 1; i <= size; i++) {
      const row: Poly[] = [];
      for (let j = 1; j <= size; j++) row.push(a(2 * j - i));
      m.push(row);
    }
    deltas.push(polyDeterminant(m));
  }
  return deltas;
}

/** Real positive roots of a polynomial in K: companion eigenvalues (ml-matrix), polished by Newton. */
export function positiveRealRoots(p: Poly): number[] {
  const q = polyTrim(p);
  if (q.length < 2) return [];
  const dq = q.slice(0, -1).map((c, i) => c * (q.length - 1 - i));
  const out: number[] = [];
  for (const r of companionEigenvalues(q)) {
    if (Math.abs(r.im) > 1e-7 * Math.max(1, Math.abs(r.re)) || r.re <= 0) continue;
    let x = r.re;
    for (let i = 0; i < 50; i++) {
      const step = polyEval(q, x) / polyEval(dq, x);
      if (!Number.isFinite(step)) break;
      x -= step;
      if (Math.abs(step) <= 1e-16 * Math.abs(x)) break;
    }
    if (x > 0) out.push(x);
  }
  return out.sort((u, v) => u - v);
}

/** Whether D + K·N is Hurwitz at this K by the determinant criterion (a_0(K) made positive first). */
export function hurwitzStableAt(deltas: readonly Poly[], leading: number, gain: number): boolean {
  // multiplying the polynomial by −1 multiplies Δ_k by (−1)^k
  const sign = leading > 0 ? 1 : -1;
  return deltas.every((d, k) => (sign ** (k + 1)) * polyEval(d, gain) > 0);
}

export interface DerivedRange {
  readonly from: number;
  readonly to: number | null;
}

/**
 * The stable set of K > 0 (or K < 0 with `sign` −1, as magnitudes) from the Hurwitz determinants:
 * candidate edges are the roots of every Δ_k, each interval between them is judged at an interior
 * point, and adjacent stable intervals are merged.
 */
export function derivedStableRanges(numerator: readonly number[], denominator: readonly number[], sign: 1 | -1 = 1): DerivedRange[] {
  const deltas = hurwitzDeterminants(numerator, denominator);
  const flip = (p: Poly): Poly => p.map((c, i) => (sign < 0 && (p.length - 1 - i) % 2 === 1 ? -c : c));
  const edges = [...new Set(deltas.flatMap((d) => positiveRealRoots(flip(d))))].sort((u, v) => u - v);
  const bounds = [0, ...edges, Infinity];
  const out: { from: number; to: number | null }[] = [];
  const leadingAt = (k: number): number => denominator[0] + k * polyPad(numerator, denominator.length)[0];
  for (let i = 0; i + 1 < bounds.length; i++) {
    const lo = bounds[i];
    const hi = bounds[i + 1];
    const mid = hi === Infinity ? (lo === 0 ? 1 : 2 * lo) : (lo + hi) / 2;
    const gain = sign * mid;
    if (!hurwitzStableAt(deltas, leadingAt(gain), gain)) continue;
    const last = out[out.length - 1];
    if (last && last.to === lo) out[out.length - 1] = { from: last.from, to: hi === Infinity ? null : hi };
    else out.push({ from: lo, to: hi === Infinity ? null : hi });
  }
  return out;
}

/**
 * The Routh array of a real polynomial in floating point (no special cases: a zero pivot gives
 * non-finite entries), rows from s^n down to s^0.
 */
export function routhArray(p: readonly number[]): number[][] {
  const n = p.length - 1;
  const rows: number[][] = [];
  const width = Math.floor(n / 2) + 1;
  rows.push(Array.from({ length: width }, (_, j) => p[2 * j] ?? 0));
  rows.push(Array.from({ length: width }, (_, j) => p[2 * j + 1] ?? 0));
  for (let r = 2; r <= n; r++) {
    const up = rows[r - 2];
    const mid = rows[r - 1];
    rows.push(Array.from({ length: width }, (_, j) => (mid[0] * (up[j + 1] ?? 0) - up[0] * (mid[j + 1] ?? 0)) / mid[0]));
  }
  return rows;
}

/**
 * Frequency ω of the imaginary-axis pair at a Routh boundary gain, from the auxiliary equation
 * A·s² + B = 0 formed by the s² row of the Routh array (whose s¹ row vanishes there): ω = √(B/A).
 */
export function auxiliaryFrequency(characteristic: readonly number[]): number {
  const rows = routhArray(characteristic);
  const n = characteristic.length - 1;
  const s2 = rows[n - 2];
  return Math.sqrt(s2[1] / s2[0]);
}
