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
 * of a Given State of Motion", 1877). A first-column entry that is zero to working precision means the
 * polynomial is not strictly Hurwitz; the count is then reported as `null`.
 * Example: routh([1, 2, 3, 4]) is stable (2·3 > 4); routh([1, 1, 2, 8]) has 2 roots in the right half-plane.
 */
export function routh(p: Polynomial): StabilityVerdict {
  let start = 0;
  while (start < p.length && p[start] === 0) start++;
  const a = p.slice(start);
  const n = a.length - 1;
  if (n < 0) return { isStable: false, unstableCount: null };
  if (n === 0) return { isStable: true, unstableCount: 0 };
  let upper: number[] = [];
  let lower: number[] = [];
  for (let i = 0; i <= n; i += 2) upper.push(a[i]);
  for (let i = 1; i <= n; i += 2) lower.push(a[i]);
  const firstColumn: number[] = [upper[0]];
  const size = Math.max(...a.map(Math.abs));
  for (let row = 1; row <= n; row++) {
    const pivot = lower[0] ?? 0;
    const rowScale = Math.max(...lower.map(Math.abs), ...upper.map(Math.abs), size * 1e-300);
    if (Math.abs(pivot) <= 64 * Number.EPSILON * rowScale) return { isStable: false, unstableCount: null };
    firstColumn.push(pivot);
    const next: number[] = [];
    for (let j = 0; j < upper.length - 1; j++) next.push((pivot * (upper[j + 1] ?? 0) - upper[0] * (lower[j + 1] ?? 0)) / pivot);
    upper = lower;
    lower = next;
  }
  let changes = 0;
  for (let i = 1; i < firstColumn.length; i++) if (Math.sign(firstColumn[i]) !== Math.sign(firstColumn[i - 1])) changes++;
  return { isStable: changes === 0, unstableCount: changes };
}
