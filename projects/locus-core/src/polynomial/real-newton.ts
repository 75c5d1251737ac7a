import type { Polynomial } from './polynomial';

/**
 * Newton's method for a real root of a real polynomial from a real start, stopping when the step is at
 * rounding level; `null` when the slope vanishes or the iterate leaves the finite numbers. The caller
 * decides whether the result is close enough to be the root it was looking for.
 * Example: realNewton([1, 0, −2], 1) ≈ 1.4142135623730951.
 */
export function realNewton(p: Polynomial, start: number): number | null {
  let x = start;
  for (let i = 0; i < 40; i++) {
    let value = 0;
    let slope = 0;
    for (const c of p) {
      slope = slope * x + value;
      value = value * x + c;
    }
    if (slope === 0) return null;
    const step = value / slope;
    x -= step;
    if (!Number.isFinite(x)) return null;
    if (Math.abs(step) <= 2 * Number.EPSILON * Math.max(1, Math.abs(x))) break;
  }
  return x;
}
