import type { Complex } from '../complex/complex';
import { characteristic } from './stable-ranges';
import type { Polynomial } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';

/**
 * Refines a gain at which a function of the closed-loop poles changes value, given two gains that
 * bracket the change, by bisection with a fresh root solve at each midpoint until the bracket is at
 * the resolution of double precision. Returns the midpoint of the final bracket, or `null` when fresh
 * solves at the two ends do not confirm a change (the ends sit on the boundary itself).
 */
export function refineChange(
  numerator: Polynomial,
  denominator: Polynomial,
  low: number,
  high: number,
  judge: (poles: Complex[]) => number | boolean,
): number | null {
  let a = low;
  let b = high;
  const atA = judge(roots(characteristic(numerator, denominator, a)));
  if (judge(roots(characteristic(numerator, denominator, b))) === atA) return null;
  for (let i = 0; i < 200 && b - a > 4 * Number.EPSILON * Math.max(Math.abs(a), Math.abs(b)); i++) {
    const mid = (a + b) / 2;
    if (mid <= a || mid >= b) break;
    if (judge(roots(characteristic(numerator, denominator, mid))) === atA) a = mid;
    else b = mid;
  }
  return (a + b) / 2;
}

/**
 * Neighbouring samples of a traced locus between which `judgeAt(k)` changes value, as [low, high]
 * gain brackets. `gains` ascend. K = 0 itself is left
 * out (open-loop poles may sit on a boundary; it is no boundary of a set of K > 0).
 */
export function sampledBrackets(gains: readonly number[], judgeAt: (k: number) => number | boolean): [number, number][] {
  const out: [number, number][] = [];
  const first = gains[0] === 0 ? 1 : 0;
  if (first >= gains.length) return out;
  let previous = judgeAt(first);
  for (let k = first + 1; k < gains.length; k++) {
    const current = judgeAt(k);
    if (current !== previous) out.push([gains[k - 1], gains[k]]);
    previous = current;
  }
  return out;
}

/** Gains where `judge` changes value along a traced locus, each refined by `refineChange`. */
export function sampledChanges(
  numerator: Polynomial,
  denominator: Polynomial,
  gains: readonly number[],
  polesAt: (k: number) => Complex[],
  judge: (poles: Complex[]) => number | boolean,
): number[] {
  const out: number[] = [];
  for (const [low, high] of sampledBrackets(gains, (k) => judge(polesAt(k)))) {
    const gain = refineChange(numerator, denominator, low, high, judge);
    if (gain !== null) out.push(gain);
  }
  return out;
}

/**
 * Gains where a quantity of one branch changes sign: `measure(point)` is evaluated along each traced
 * branch (`null` where it does not apply), and each sign change between neighbouring samples is refined
 * by bisection, following the branch at each midpoint by the fresh root nearest to where the branch is
 * bracketed. `branches[i][k]` is branch i at `gains[k]`.
 */
export function branchSignChanges(
  numerator: Polynomial,
  denominator: Polynomial,
  gains: readonly number[],
  branches: readonly (readonly Complex[])[],
  measure: (point: Complex) => number | null,
): number[] {
  const out: number[] = [];
  for (const branch of branches) {
    for (let k = 1; k < gains.length; k++) {
      const a = measure(branch[k - 1]);
      const b = measure(branch[k]);
      if (a === null || b === null || a === 0 || Math.sign(a) === Math.sign(b)) continue;
      let lowGain = gains[k - 1];
      let highGain = gains[k];
      let lowPoint = branch[k - 1];
      let highPoint = branch[k];
      for (let i = 0; i < 200 && highGain - lowGain > 4 * Number.EPSILON * Math.max(Math.abs(lowGain), Math.abs(highGain)); i++) {
        const mid = (lowGain + highGain) / 2;
        if (mid <= lowGain || mid >= highGain) break;
        const guess = { re: (lowPoint.re + highPoint.re) / 2, im: (lowPoint.im + highPoint.im) / 2 };
        const point = nearest(roots(characteristic(numerator, denominator, mid)), guess);
        const value = measure(point);
        if (value === null) break;
        if (Math.sign(value) === Math.sign(a)) {
          lowGain = mid;
          lowPoint = point;
        } else {
          highGain = mid;
          highPoint = point;
        }
      }
      out.push((lowGain + highGain) / 2);
    }
  }
  return out.sort((x, y) => x - y);
}

function nearest(points: readonly Complex[], to: Complex): Complex {
  let best = points[0];
  let bestDistance = Infinity;
  for (const p of points) {
    const d = (p.re - to.re) ** 2 + (p.im - to.im) ** 2;
    if (d < bestDistance) {
      bestDistance = d;
      best = p;
    }
  }
  return best;
}
