import { scaledResidual as residual } from '../polynomial/evaluate';
import { realNewton } from '../polynomial/real-newton';
import type { Complex } from './complex';

/**
 * Whether every non-real value in the list has its conjugate in the list with the same multiplicity.
 * `tolerance` is relative to the larger modulus of the pair (plus an absolute floor of the same size).
 */
export function hasCompleteConjugatePairs(values: readonly Complex[], tolerance = 1e-9): boolean {
  return firstUnpaired(values, tolerance) < 0;
}

/**
 * Index of the first non-real value whose conjugate is missing from the list (each value pairs once), or −1;
 * same tolerance as `hasCompleteConjugatePairs`.
 * Example: firstUnpaired([{ re: -1, im: 1 }, { re: -1, im: -1 }, { re: 0, im: 2 }]) = 2.
 */
export function firstUnpaired(values: readonly Complex[], tolerance = 1e-9): number {
  const used = new Array<boolean>(values.length).fill(false);
  for (let i = 0; i < values.length; i++) {
    if (used[i]) continue;
    const v = values[i];
    const scale = Math.max(1, Math.hypot(v.re, v.im));
    used[i] = true;
    if (Math.abs(v.im) <= tolerance * scale) continue;
    let match = -1;
    for (let j = i + 1; j < values.length; j++) {
      if (used[j]) continue;
      const w = values[j];
      if (Math.abs(w.re - v.re) <= tolerance * scale && Math.abs(w.im + v.im) <= tolerance * scale) {
        match = j;
        break;
      }
    }
    if (match < 0) return i;
    used[match] = true;
  }
  return -1;
}

/**
 * Makes a list of roots of a real polynomial exactly conjugate-symmetric. Values whose imaginary part
 * is within `realTolerance` of their modulus become real; the others are split into upper and lower
 * half-plane values and matched globally, nearest conjugate first. In each matched pair one member is
 * kept and the other replaced by its exact conjugate — the member with the smaller scaled residual
 * when the polynomial is given (for a real p, |p(x̄)| = |p(x)|, so the pair keeps that backward error),
 * otherwise both are averaged. A value left without a partner keeps its place (it cannot be mirrored
 * without losing a root).
 */
export function symmetrize(values: readonly Complex[], realTolerance = 1e-10, polynomial?: readonly number[]): Complex[] {
  const out: Complex[] = values.map((v) => ({ re: v.re, im: v.im }));
  const upper: number[] = [];
  const lower: number[] = [];
  out.forEach((v, i) => {
    const scale = Math.max(1e-300, Math.hypot(v.re, v.im));
    if (Math.abs(v.im) <= realTolerance * scale) out[i] = { re: v.re, im: 0 };
    else (v.im > 0 ? upper : lower).push(i);
  });
  const pairs: { u: number; l: number; d: number }[] = [];
  for (const u of upper) for (const l of lower) pairs.push({ u, l, d: Math.hypot(out[u].re - out[l].re, out[u].im + out[l].im) });
  pairs.sort((a, b) => a.d - b.d);
  const used = new Set<number>();
  for (const { u, l, d } of pairs) {
    if (used.has(u) || used.has(l)) continue;
    // conjugates lie closer to each other's mirror image than to the real axis; two near-real
    // roots with rounding noise of opposite sign do not
    if (d >= Math.max(out[u].im, -out[l].im)) continue;
    used.add(u);
    used.add(l);
    const a = out[u];
    const b = out[l];
    let keep: Complex;
    if (polynomial) keep = residual(polynomial, a) <= residual(polynomial, b) ? a : { re: b.re, im: -b.im };
    else keep = { re: (a.re + b.re) / 2, im: (a.im - b.im) / 2 };
    out[u] = { re: keep.re, im: keep.im };
    out[l] = { re: keep.re, im: -keep.im };
  }
  // a value left without a partner is a real root blurred by rounding or by the polynomial's
  // conditioning: with the polynomial, Newton's method along the real axis settles it (kept only if
  // its residual is no worse); without, only rounding-level noise is dropped
  const settled: number[] = out.filter((v, i) => v.im === 0 && !upper.includes(i) && !lower.includes(i)).map((v) => v.re);
  for (const i of [...upper, ...lower]) {
    if (used.has(i)) continue;
    const v = out[i];
    const size = Math.hypot(v.re, v.im);
    if (polynomial) {
      const real = realNewton(polynomial, v.re);
      // near: within the blur of this root, and not onto a real root another value already settled on
      const isNear = real !== null && Math.abs(real - v.re) <= 4 * Math.abs(v.im) + 1e-2 * size;
      const isTaken = real !== null && settled.some((x) => Math.abs(x - real) <= 1e-9 * Math.max(1, Math.abs(real)));
      if (isNear && !isTaken && residual(polynomial, { re: real, im: 0 }) <= Math.max(residual(polynomial, v) * 4, 64 * Number.EPSILON)) {
        out[i] = { re: real, im: 0 };
        settled.push(real);
      }
    } else if (Math.abs(v.im) <= 1e-6 * size) out[i] = { re: v.re, im: 0 };
  }
  return out;
}
