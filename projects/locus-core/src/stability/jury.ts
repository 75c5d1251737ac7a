import type { Polynomial } from '../polynomial/polynomial';
import type { StabilityVerdict } from './routh';

/**
 * Jury stability test in its Schur–Cohn reflection-coefficient form: whether every root of p (highest
 * power first) lies strictly inside the unit circle. Each step forms k = a_n/a_0 and the polynomial
 * (p(z) − k·z^n·p(1/z))/z of one degree less; p is Schur-stable exactly when every |k| < 1
 * (E. I. Jury, "Theory and Application of the z-Transform Method", 1964; the recursion as in
 * K. J. Åström, B. Wittenmark, "Computer-Controlled Systems", 3rd ed., §3.2 — recalled from memory).
 * The number of unstable roots is not counted (`unstableCount` is 0 when stable, `null` otherwise).
 * Example: jury([1, −1, 0.5]) is stable (roots 0.5 ± 0.5j); jury([1, −2.5, 1]) is not (roots 2 and 0.5).
 */
export function jury(p: Polynomial): StabilityVerdict {
  let start = 0;
  while (start < p.length && p[start] === 0) start++;
  let a = p.slice(start);
  if (a.length === 0) return { isStable: false, unstableCount: null };
  while (a.length > 1) {
    const n = a.length - 1;
    const k = a[n] / a[0];
    if (!(Math.abs(k) < 1 - 8 * Number.EPSILON)) return { isStable: false, unstableCount: null };
    const next: number[] = [];
    for (let i = 0; i < n; i++) next.push(a[i] - k * a[n - i]);
    a = next;
  }
  return { isStable: true, unstableCount: 0 };
}
