import type { Complex } from '../complex/complex';
import { evaluateAbs, evaluateWithDerivative } from '../polynomial/evaluate';
import type { Polynomial } from '../polynomial/polynomial';
import type { Warning } from '../types/plant';

/**
 * Warns when the roots of a loop polynomial (the denominator's poles, or the numerator's zeros) are so sensitive to its coefficients that working
 * precision cannot place them to one part in 10⁶ of the plot: the first-order forward error of a simple
 * root r is about n·ε·Σ|d_k||r|^k / |D′(r)| (Wilkinson's condition number of a polynomial root).
 * Roots in clusters (multiple poles) are left out: their sensitivity is expected and harmless to a plot.
 * Example: the poles of a well-separated 4th-order plant raise no warning; forty spread poles can.
 */
export function conditioningWarnings(denominator: Polynomial, poles: readonly Complex[], scale: number, what: 'pole' | 'zero' = 'pole'): Warning[] {
  const n = denominator.length - 1;
  let worst = 0;
  poles.forEach((r, i) => {
    const isolated = poles.every((q, j) => j === i || Math.hypot(q.re - r.re, q.im - r.im) > 1e-4 * scale);
    if (!isolated) return;
    const slope = evaluateWithDerivative(denominator, r).slope;
    const error = (n * Number.EPSILON * evaluateAbs(denominator, Math.hypot(r.re, r.im))) / Math.hypot(slope.re, slope.im);
    worst = Math.max(worst, error);
  });
  if (!(worst > 1e-6 * scale)) return [];
  return [
    {
      code: 'ill-conditioned-polynomial',
      message:
        `The loop's ${what === 'pole' ? 'denominator' : 'numerator'} polynomial is badly conditioned: rounding alone can move an open-loop ${what} by about ` +
        `${Number(worst.toPrecision(2))} (${Number(((100 * worst) / scale).toPrecision(2))} % of the plotted region). Every point still satisfies ` +
        `D + K·N ≈ 0 to working precision, but the ${what} positions may differ visibly from the factors you entered. ` +
        `A reduced-order model, or fewer cascaded factors, gives a more trustworthy locus.`,
    },
  ];
}
