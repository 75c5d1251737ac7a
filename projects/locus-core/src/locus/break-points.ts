import type { Complex } from '../complex/complex';
import { evaluateAbs, evaluateComplex, evaluateWithDerivative } from '../polynomial/evaluate';
import { add, derivative, multiply, scale, type Polynomial } from '../polynomial/polynomial';
import { realNewton } from '../polynomial/real-newton';
import { roots } from '../polynomial/roots';

/** A point where branches meet and part, with the gain at which they do. */
export interface BreakPoint {
  readonly point: Complex;
  readonly gain: number;
}

/**
 * Break-away and break-in points, real and complex: the roots of D′N − DN′ = 0 (where dK/dx = 0 for
 * K(x) = −D(x)/N(x)) at which K is real, each with its gain. Every one is a multiple root of D + K·N.
 * Roots shared by N and D (cancellations) are skipped. Polished by Newton's method on D′N − DN′.
 * `zeros` are the roots of N when the caller already has them.
 * Example: D = s(s + 2), N = 1 has its break-away point at −1 with K = 1.
 */
export function breakPoints(numerator: Polynomial, denominator: Polynomial, zeros: readonly Complex[] = roots(numerator)): BreakPoint[] {
  const condition = add(multiply(derivative(denominator), numerator), scale(multiply(denominator, derivative(numerator)), -1));
  let start = 0;
  const size = Math.max(0, ...condition.map(Math.abs));
  while (start < condition.length && Math.abs(condition[start]) <= 1e-14 * size) start++;
  const trimmed = condition.slice(start);
  if (trimmed.length < 2) return [];
  const found: BreakPoint[] = [];
  for (const found0 of roots(trimmed)) {
    // work in the upper half-plane; a mirror image already handled is caught as a duplicate below
    const r = found0.im < 0 ? { re: found0.re, im: -found0.im } : found0;
    const x = nearReal(trimmed, r) ?? polishRoot(trimmed, r);
    // at a zero of N the gain is infinite, unless the zero cancels a pole; either way no break point
    if (zeros.some((z) => Math.hypot(z.re - x.re, z.im - x.im) <= 1e-5 * Math.max(1, Math.hypot(x.re, x.im)))) continue;
    const nv = evaluateComplex(numerator, x);
    const dv = evaluateComplex(denominator, x);
    const modulus = Math.hypot(x.re, x.im);
    const nm = nv.re * nv.re + nv.im * nv.im;
    if (Math.sqrt(nm) <= 1e-10 * evaluateAbs(numerator, modulus)) continue;
    const gain = -(dv.re * nv.re + dv.im * nv.im) / nm;
    const gainIm = -(dv.im * nv.re - dv.re * nv.im) / nm;
    if (Math.abs(gainIm) > 1e-7 * Math.max(Math.abs(gain), 1e-300)) continue;
    const point = Math.abs(x.im) <= 1e-12 * Math.max(1, modulus) ? { re: x.re, im: 0 } : x;
    // a point where q branches meet is a (q − 1)-fold root of the condition, found as a small cluster
    if (found.some((f) => Math.hypot(f.point.re - point.re, f.point.im - point.im) <= 1e-5 * Math.max(1, modulus) && Math.abs(f.gain - gain) <= 1e-5 * Math.max(1e-300, Math.abs(gain)))) continue;
    found.push({ point, gain });
    if (point.im !== 0) found.push({ point: { re: point.re, im: -point.im }, gain });
  }
  return found.sort((a, b) => a.gain - b.gain || a.point.re - b.point.re || a.point.im - b.point.im);
}

function polishRoot(p: Polynomial, start: Complex): Complex {
  let x = start;
  for (let i = 0; i < 8; i++) {
    const { value, slope } = evaluateWithDerivative(p, x);
    const d = slope.re * slope.re + slope.im * slope.im;
    if (d === 0) break;
    const stepRe = (value.re * slope.re + value.im * slope.im) / d;
    const stepIm = (value.im * slope.re - value.re * slope.im) / d;
    const next = { re: x.re - stepRe, im: x.im - stepIm };
    if (!Number.isFinite(next.re) || !Number.isFinite(next.im)) break;
    const before = Math.hypot(value.re, value.im);
    const after = evaluateComplex(p, next);
    if (Math.hypot(after.re, after.im) >= before) break;
    x = next;
  }
  return x;
}

/**
 * A root of a real polynomial found with a small imaginary part may be a real root blurred by the
 * conditioning of the polynomial: Newton's method along the real axis from its real part settles it.
 * Returns the real root when that converges close by, else `null`.
 */
function nearReal(p: Polynomial, start: Complex): Complex | null {
  const size = Math.max(1, Math.hypot(start.re, start.im));
  if (Math.abs(start.im) > 1e-4 * size) return null;
  const x = realNewton(p, start.re);
  if (x === null) return null;
  const residual = Math.abs(evaluateComplex(p, { re: x, im: 0 }).re);
  if (Math.abs(x - start.re) > 1e-3 * size || residual > 1e-10 * evaluateAbs(p, Math.abs(x))) return null;
  return { re: x, im: 0 };
}
