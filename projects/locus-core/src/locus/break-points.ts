import type { Complex } from '../complex/complex';
import { evaluateAbs, evaluateComplex, evaluateWithDerivative } from '../polynomial/evaluate';
import { add, derivative, multiply, scale, type Polynomial } from '../polynomial/polynomial';
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
 * Example: D = s(s + 2), N = 1 has its break-away point at −1 with K = 1.
 */
export function breakPoints(numerator: Polynomial, denominator: Polynomial): BreakPoint[] {
  const condition = add(multiply(derivative(denominator), numerator), scale(multiply(denominator, derivative(numerator)), -1));
  let start = 0;
  const size = Math.max(0, ...condition.map(Math.abs));
  while (start < condition.length && Math.abs(condition[start]) <= 1e-14 * size) start++;
  const trimmed = condition.slice(start);
  if (trimmed.length < 2) return [];
  const found: BreakPoint[] = [];
  for (const r of roots(trimmed)) {
    if (r.im < 0) continue; // one of each conjugate pair; its mirror is added below
    const x = polishRoot(trimmed, r);
    const nv = evaluateComplex(numerator, x);
    const dv = evaluateComplex(denominator, x);
    const modulus = Math.hypot(x.re, x.im);
    const nm = nv.re * nv.re + nv.im * nv.im;
    if (Math.sqrt(nm) <= 1e-10 * evaluateAbs(numerator, modulus)) continue;
    const gain = -(dv.re * nv.re + dv.im * nv.im) / nm;
    const gainIm = -(dv.im * nv.re - dv.re * nv.im) / nm;
    if (Math.abs(gainIm) > 1e-7 * Math.max(Math.abs(gain), 1e-300)) continue;
    const point = Math.abs(x.im) <= 1e-12 * Math.max(1, modulus) ? { re: x.re, im: 0 } : x;
    if (found.some((f) => Math.hypot(f.point.re - point.re, f.point.im - point.im) <= 1e-9 * Math.max(1, modulus))) continue;
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
