import { exactIntegers } from '../numeric/exact-integers';
import type { Polynomial } from '../polynomial/polynomial';

/** Verdict of an exact stability test. */
export interface StabilityVerdict {
  /** Whether every root lies strictly inside the stable region. */
  readonly isStable: boolean;
  /**
   * Roots outside the stable region as counted by the test, or `null` when the table met a zero
   * pivot (a root on the boundary or a symmetric root pattern) and the count is not defined.
   */
  readonly unstableCount: number | null;
}

/**
 * Routh–Hurwitz test: whether every root of p (highest power first) has a negative real part, from
 * the sign changes in the first column of the Routh array (E. J. Routh, "A Treatise on the Stability
 * of a Given State of Motion", 1877).
 *
 * The array is computed **exactly**: the coefficients (doubles) are turned into integers without
 * rounding and the array is built fraction-free, row k holding the Routh row times the Hurwitz
 * determinant Δ_{k−1}, so that the first column holds Δ_k themselves and every division is exact
 * (a Bareiss-type elimination; R_{k+1}[j] = (R_k[0]·R_{k−1}[j+1] − R_{k−1}[0]·R_k[j+1]) / Δ_{k−2}).
 * The verdict is therefore exact for the given coefficients at any degree, where a floating-point
 * array loses every digit past degree 20 or so. A zero first-column entry means the polynomial is
 * not strictly Hurwitz; the count is then reported as `null`.
 * Example: routh([1, 2, 3, 4]) is stable (2·3 > 4); routh([1, 1, 2, 8]) has 2 roots in the right half-plane.
 */
export function routh(p: Polynomial): StabilityVerdict {
  let start = 0;
  while (start < p.length && p[start] === 0) start++;
  return routhExact(exactIntegers(p.slice(start)));
}

/** The exact Routh–Hurwitz test on integer coefficients, highest power first, leading one non-zero. */
export function routhExact(a: readonly bigint[]): StabilityVerdict {
  const n = a.length - 1;
  if (n < 0) return { isStable: false, unstableCount: null };
  if (n === 0) return { isStable: true, unstableCount: 0 };
  let upper: bigint[] = [];
  let lower: bigint[] = [];
  for (let i = 0; i <= n; i += 2) upper.push(a[i]);
  for (let i = 1; i <= n; i += 2) lower.push(a[i]);
  // first column of the true Routh array: a0, Δ1/Δ0, Δ2/Δ1, …; only signs are needed
  const signs: number[] = [sign(a[0])];
  const deltas: bigint[] = [1n]; // Δ0 = 1
  for (let row = 1; row <= n; row++) {
    const pivot = lower[0] ?? 0n; // Δ_row
    if (pivot === 0n) return { isStable: false, unstableCount: null };
    signs.push(sign(pivot) * sign(deltas[row - 1]));
    deltas.push(pivot);
    // divisor for row + 1: Δ_{row−2} for row ≥ 3, else 1 (Δ0 = Δ−1 = 1 in this arrangement)
    const divisor = row >= 3 ? deltas[row - 2] : 1n;
    const next: bigint[] = [];
    for (let j = 0; j < upper.length - 1; j++) {
      next.push((pivot * (upper[j + 1] ?? 0n) - upper[0] * (lower[j + 1] ?? 0n)) / divisor);
    }
    upper = lower;
    lower = next;
  }
  let changes = 0;
  for (let i = 1; i < signs.length; i++) if (signs[i] !== signs[i - 1]) changes++;
  return { isStable: changes === 0, unstableCount: changes };
}

function sign(x: bigint): number {
  return x > 0n ? 1 : x < 0n ? -1 : 0;
}
