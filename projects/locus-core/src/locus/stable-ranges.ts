import { padTo, type Polynomial } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';
import { stabilityOf } from '../stability/is-stable';
import type { Domain, Warning } from '../types/plant';
import type { GainRange } from '../types/results';
import { IMAGINARY_AXIS, circle } from './curve';
import { curveCrossings, type CurveCrossing } from './curve-crossings';

/** Characteristic polynomial D + K·N (N padded to the length of D). */
export function characteristic(numerator: Polynomial, denominator: Polynomial, gain: number): number[] {
  const padded = padTo(numerator, denominator.length);
  return denominator.map((d, i) => d + gain * padded[i]);
}

/**
 * Gains at which a closed-loop pole sits on the stability boundary: the imaginary axis (s) or the unit
 * circle (z), each with its point, computed to working precision (see `curveCrossings`).
 */
export function boundaryCrossings(numerator: Polynomial, denominator: Polynomial, domain: Domain): CurveCrossing[] {
  return curveCrossings(numerator, denominator, domain === 's' ? IMAGINARY_AXIS : circle(0, 1));
}

/**
 * Gain at which the loop is not well posed (d₀ + K·n₀ = 0 for a biproper plant): a closed-loop pole
 * passes through infinity there. `null` for a strictly proper plant.
 */
export function illPosedGain(numerator: Polynomial, denominator: Polynomial): number | null {
  if (numerator.length !== denominator.length) return null;
  return -denominator[0] / numerator[0];
}

/**
 * The exact set of gains of one sign for which D + K·N is stable, as open intervals. Boundaries are
 * the boundary-crossing gains (and the ill-posed gain); each interval between them is certified at an
 * interior gain by the exact Routh–Hurwitz test (s) or the exact bilinear map and Routh–Hurwitz (z), and the verdict is checked against the
 * computed roots there (a disagreement is reported as a warning, never hidden).
 * For `sign = −1` the ranges are negative gains, `from` < `to` ≤ 0, with `from: −Infinity` written as `null`.
 */
export function stableRanges(
  numerator: Polynomial,
  denominator: Polynomial,
  domain: Domain,
  crossings: readonly CurveCrossing[],
  sign: 1 | -1,
  warnings: Warning[],
): { from: number | null; to: number | null; checkedAt: number; certifiedBy: 'routh-hurwitz' | 'bilinear-routh-hurwitz' }[] {
  const edges: number[] = [];
  for (const c of crossings) if (c.gain * sign > 0) edges.push(Math.abs(c.gain));
  const singular = illPosedGain(numerator, denominator);
  if (singular !== null && singular * sign > 0) edges.push(Math.abs(singular));
  edges.sort((a, b) => a - b);
  const unique = edges.filter((e, i) => i === 0 || e - edges[i - 1] > 4 * Number.EPSILON * e);
  const bounds = [0, ...unique, Infinity];
  const out: { from: number | null; to: number | null; checkedAt: number; certifiedBy: 'routh-hurwitz' | 'bilinear-routh-hurwitz' }[] = [];
  for (let i = 0; i + 1 < bounds.length; i++) {
    const a = bounds[i];
    const b = bounds[i + 1];
    const probe = b === Infinity ? (a === 0 ? 1 : 2 * a) : a === 0 ? b / 2 : Math.sqrt(a * b);
    const gain = sign * probe;
    const poly = characteristic(numerator, denominator, gain);
    const verdict = stabilityOf(poly, domain);
    const rootsSay = rootsStable(poly, domain);
    if (verdict.isStable !== rootsSay) {
      warnings.push({
        code: 'stability-test-disagreement',
        message:
          `At K = ${gain.toPrecision(6)} the ${verdict.test} test and the computed poles disagree about stability ` +
          `(the polynomial is badly conditioned there); the interval is reported as ${verdict.isStable ? 'stable' : 'unstable'} by the exact test. Treat it with extra care.`,
      });
    }
    if (!verdict.isStable) continue;
    if (sign > 0) out.push({ from: a, to: b === Infinity ? null : b, checkedAt: gain, certifiedBy: verdict.test });
    else out.push({ from: b === Infinity ? null : -b, to: -a, checkedAt: gain, certifiedBy: verdict.test });
  }
  return sign > 0 ? out : out.reverse();
}

/** Positive-gain stable ranges in the contract's `GainRange` shape. */
export function positiveStableRanges(numerator: Polynomial, denominator: Polynomial, domain: Domain, crossings: readonly CurveCrossing[], warnings: Warning[]): GainRange[] {
  return stableRanges(numerator, denominator, domain, crossings, 1, warnings).map((r) => ({ from: r.from as number, to: r.to, checkedAt: r.checkedAt, certifiedBy: r.certifiedBy }));
}

function rootsStable(poly: Polynomial, domain: Domain): boolean {
  return roots(poly).every((r) => (domain === 's' ? r.re < 0 : Math.hypot(r.re, r.im) < 1));
}
