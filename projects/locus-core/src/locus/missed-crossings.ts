import type { Complex } from '../complex/complex';
import type { Polynomial } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';
import type { Domain } from '../types/plant';
import { IMAGINARY_AXIS, circle, parameterOf } from './curve';
import { polishCrossing, type CurveCrossing } from './curve-crossings';
import { refineChange, sampledBrackets } from './gain-boundaries';
import { characteristic } from './stable-ranges';
import type { Trace } from './track';

/**
 * Safety net for the algebraic crossing search: gains at which the traced poles change from all
 * stable to not (or back) that no known crossing explains, each refined by bisection and then
 * polished by Newton's method on D + K·N = 0 from the pole nearest the boundary. The algebraic search
 * squares the degree of the problem and can lose crossings of very high-order loops; the traced path
 * cannot jump over a change of stability, so together they give a consistent stable set.
 */
export function missedCrossings(
  numerator: Polynomial,
  denominator: Polynomial,
  domain: Domain,
  path: Trace,
  known: readonly CurveCrossing[],
): CurveCrossing[] {
  const isStable = (poles: Complex[]): boolean => poles.every((p) => (domain === 's' ? p.re < 0 : p.re * p.re + p.im * p.im < 1));
  const gains = path.gains.map((g) => Math.abs(g));
  const sign = path.gains[path.gains.length - 1] < 0 ? -1 : 1;
  // the scan judges the traced arrays directly (no objects per sample); fresh solves use `isStable`
  const stableAt = (k: number): boolean => {
    const re = path.re[k];
    const im = path.im[k];
    for (let i = 0; i < re.length; i++) if (domain === 's' ? !(re[i] < 0) : !(re[i] * re[i] + im[i] * im[i] < 1)) return false;
    return true;
  };
  const signedNumerator = sign > 0 ? numerator : numerator.map((c) => -c);
  const curve = domain === 's' ? IMAGINARY_AXIS : circle(0, 1);
  const found: CurveCrossing[] = [];
  for (const [low, high] of sampledBrackets(gains, stableAt)) {
    // a known crossing inside the bracket (ends included, with rounding room) explains the change
    const explained = known.some((c) => {
      const g = Math.abs(c.gain) * Math.sign(c.gain) * sign;
      return g >= low * (1 - 1e-9) && g <= high * (1 + 1e-9);
    });
    if (explained) continue;
    const refined = refineChange(signedNumerator, denominator, low, high, isStable);
    if (refined === null) continue;
    const gain = sign * refined;
    const poles = roots(characteristic(numerator, denominator, gain));
    const nearest = poles.reduce((best, p) => (boundaryDistance(p, domain) < boundaryDistance(best, domain) ? p : best), poles[0]);
    const polished = polishCrossing(numerator, denominator, curve, parameterOf(curve, nearest));
    if (polished && Math.abs(polished.gain - gain) <= 1e-6 * Math.abs(gain)) found.push(polished, mirror(polished, curve));
    else found.push({ gain, point: nearest, t: parameterOf(curve, nearest) });
  }
  return found;
}

function boundaryDistance(p: Complex, domain: Domain): number {
  return domain === 's' ? Math.abs(p.re) : Math.abs(Math.hypot(p.re, p.im) - 1);
}

function mirror(c: CurveCrossing, curve: typeof IMAGINARY_AXIS): CurveCrossing {
  const point = { re: c.point.re, im: -c.point.im };
  return { gain: c.gain, point, t: parameterOf(curve, point) };
}
