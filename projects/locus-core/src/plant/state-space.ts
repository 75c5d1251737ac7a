import type { Polynomial } from '../polynomial/polynomial';

/** A single-input single-output state-space model ẋ = Ax + Bu, y = Cx + Du (matrices as arrays of rows). */
export interface StateSpace {
  readonly a: number[][];
  readonly b: number[];
  readonly c: number[];
  readonly d: number;
}

/**
 * Controllable canonical realisation of the proper transfer function N/D, frequency-scaled by ω0 so
 * that the companion coefficients are of comparable size (A = ω0·Â for Â realising N(ω0σ)/D(ω0σ)).
 * Example: realize([1], [1, 1]) gives A = [[−1]], B = [1], C = [1], D = 0.
 */
export function realize(numerator: Polynomial, denominator: Polynomial): StateSpace {
  const n = denominator.length - 1;
  const lead = denominator[0];
  if (n === 0) return { a: [], b: [], c: [], d: numerator[numerator.length - 1] / lead };
  const w0 = frequencyScale(denominator);
  // coefficient of power k is multiplied by w0^k; then made monic
  const a = denominator.map((v, i) => (v * w0 ** (n - i)) / (lead * w0 ** n));
  const padded = [...new Array<number>(n + 1 - numerator.length).fill(0), ...numerator];
  const b = padded.map((v, i) => (v * w0 ** (n - i)) / (lead * w0 ** n));
  const d = b[0];
  const matrixA: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(n).fill(0);
    if (i === 0) for (let j = 0; j < n; j++) row[j] = -a[j + 1] * w0;
    else row[i - 1] = w0;
    matrixA.push(row);
  }
  const vectorB = new Array<number>(n).fill(0);
  vectorB[0] = w0;
  const vectorC = new Array<number>(n).fill(0);
  for (let j = 0; j < n; j++) vectorC[j] = b[j + 1] - d * a[j + 1];
  return { a: matrixA, b: vectorB, c: vectorC, d };
}

/**
 * A characteristic frequency of D: |a_n/a_0|^(1/n) over its lowest non-zero coefficient, i.e. the
 * geometric mean of the moduli of its non-zero roots.
 */
export function frequencyScale(denominator: Polynomial): number {
  const n = denominator.length - 1;
  let k = n;
  while (k > 0 && denominator[k] === 0) k--;
  if (k === 0) return 1;
  const w = Math.abs(denominator[k] / denominator[0]) ** (1 / k);
  return Number.isFinite(w) && w > 0 ? w : 1;
}
