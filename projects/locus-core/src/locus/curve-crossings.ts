import type { Complex } from '../complex/complex';
import { composeMobius, multiplyConjugate } from '../polynomial/complex-polynomial';
import { evaluateAbs, evaluateWithDerivative } from '../polynomial/evaluate';
import type { Polynomial } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';
import { pointAt, pointAtInfinity, slopeAt, type Curve } from './curve';

/** A gain at which a closed-loop pole lies on a curve, with the point and the curve parameter. */
export interface CurveCrossing {
  readonly gain: number;
  readonly point: Complex;
  readonly t: number;
}

/**
 * Every real gain K at which D(x) + K·N(x) has a root on the curve. On the curve x(t), D + K·N = 0
 * with K real holds exactly when Im(D̃(t)·conj Ñ(t)) = 0 (D̃, Ñ: D and N composed with the curve's map),
 * a real polynomial in t whose real roots are found and then polished, together with K, by Newton's
 * method on D(x(t)) + K·N(x(t)) = 0 so that each gain is accurate to working precision.
 * Pairs with N(x) = D(x) = 0 (a cancelled pole on the curve) are skipped: no gain moves them.
 */
export function curveCrossings(numerator: Polynomial, denominator: Polynomial, curve: Curve): CurveCrossing[] {
  const n = denominator.length - 1;
  const dT = composeMobius(denominator, n, curve.alpha, curve.beta, curve.gamma, curve.delta);
  const nT = composeMobius(numerator, n, curve.alpha, curve.beta, curve.gamma, curve.delta);
  const product = multiplyConjugate(dT, nT);
  const found: CurveCrossing[] = [];
  const imaginary = product.im;
  let lead = 0;
  while (lead < imaginary.length && Math.abs(imaginary[lead]) <= 1e-14 * Math.max(...imaginary.map(Math.abs))) lead++;
  const condition = imaginary.slice(lead);
  const candidates: number[] = [];
  if (condition.length === 0) {
    // the whole curve maps to real K (e.g. a real-axis line); not a case the engine asks for
    return [];
  }
  for (const r of roots(condition)) {
    // generous: the condition polynomial is worse conditioned than D + K·N; Newton on D + K·N decides
    if (Math.abs(r.im) <= 1e-3 * Math.max(1, Math.abs(r.re))) candidates.push(r.re);
  }
  for (const t0 of candidates) {
    if (curve.isRay && t0 < -1e-9) continue;
    const polished = polishCrossing(numerator, denominator, curve, t0);
    if (polished === null) continue;
    if (curve.isRay && polished.t < 0) continue;
    if (found.some((f) => Math.abs(f.t - polished.t) <= 1e-9 * Math.max(1, Math.abs(f.t)) && Math.abs(f.gain - polished.gain) <= 1e-9 * Math.max(1, Math.abs(f.gain)))) continue;
    found.push(polished);
  }
  const far = pointAtInfinity(curve);
  if (far) {
    const d = evaluateWithDerivative(denominator, far).value;
    const nv = evaluateWithDerivative(numerator, far).value;
    const nm = nv.re * nv.re + nv.im * nv.im;
    if (nm > 0) {
      const gain = -(d.re * nv.re + d.im * nv.im) / nm;
      const imag = (d.re * nv.im - d.im * nv.re) / nm;
      if (Math.abs(imag) <= 1e-9 * Math.max(1, Math.abs(gain))) found.push({ gain, point: far, t: Infinity });
    }
  }
  return found.sort((a, b) => a.gain - b.gain || a.t - b.t);
}

/**
 * Newton's method on D(x(t)) + K·N(x(t)) = 0 in the two real unknowns t and K, from the parameter t0:
 * the crossing it converges to (residual at the backward-error level), or `null`.
 */
export function polishCrossing(numerator: Polynomial, denominator: Polynomial, curve: Curve, t0: number): CurveCrossing | null {
  let t = t0;
  let x = pointAt(curve, t);
  let dv = evaluateWithDerivative(denominator, x);
  let nv = evaluateWithDerivative(numerator, x);
  let nm = nv.value.re ** 2 + nv.value.im ** 2;
  if (nm === 0 || nm < 1e-24 * evaluateAbs(numerator, Math.hypot(x.re, x.im)) ** 2) return null;
  let gain = -(dv.value.re * nv.value.re + dv.value.im * nv.value.im) / nm;
  for (let iteration = 0; iteration < 40; iteration++) {
    const gr = dv.value.re + gain * nv.value.re;
    const gi = dv.value.im + gain * nv.value.im;
    const slope = slopeAt(curve, t);
    const pr = dv.slope.re + gain * nv.slope.re;
    const pi = dv.slope.im + gain * nv.slope.im;
    // ∂G/∂t = (D′ + K·N′)·x′(t), ∂G/∂K = N(x)
    const jtr = pr * slope.re - pi * slope.im;
    const jti = pr * slope.im + pi * slope.re;
    const det = jtr * nv.value.im - jti * nv.value.re;
    if (det === 0 || !Number.isFinite(det)) break;
    const dt = (-gr * nv.value.im + gi * nv.value.re) / det;
    const dk = (-jtr * gi + jti * gr) / det;
    if (!Number.isFinite(dt) || !Number.isFinite(dk)) break;
    t += dt;
    gain += dk;
    x = pointAt(curve, t);
    dv = evaluateWithDerivative(denominator, x);
    nv = evaluateWithDerivative(numerator, x);
    nm = nv.value.re ** 2 + nv.value.im ** 2;
    if (Math.abs(dt) <= 4 * Number.EPSILON * Math.max(1, Math.abs(t)) && Math.abs(dk) <= 4 * Number.EPSILON * Math.abs(gain)) break;
  }
  const modulus = Math.hypot(x.re, x.im);
  const residual = Math.hypot(dv.value.re + gain * nv.value.re, dv.value.im + gain * nv.value.im);
  const bound = evaluateAbs(denominator, modulus) + Math.abs(gain) * evaluateAbs(numerator, modulus);
  if (!(residual <= 1e-9 * bound) || !Number.isFinite(gain)) return null;
  return { gain, point: x, t };
}
