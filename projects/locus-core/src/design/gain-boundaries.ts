import type { Complex } from '../complex/complex';
import { characteristic } from '../locus/stable-ranges';
import type { Polynomial } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';

/**
 * Refines a gain at which a function of the closed-loop poles changes value, given two gains that
 * bracket the change, by bisection with a fresh root solve at each midpoint until the bracket is at
 * the resolution of double precision. Returns the midpoint of the final bracket.
 */
export function refineChange(
  numerator: Polynomial,
  denominator: Polynomial,
  low: number,
  high: number,
  judge: (poles: Complex[]) => number | boolean,
): number {
  let a = low;
  let b = high;
  const atA = judge(roots(characteristic(numerator, denominator, a)));
  for (let i = 0; i < 200 && b - a > 4 * Number.EPSILON * Math.max(Math.abs(a), Math.abs(b)); i++) {
    const mid = (a + b) / 2;
    if (mid <= a || mid >= b) break;
    if (judge(roots(characteristic(numerator, denominator, mid))) === atA) a = mid;
    else b = mid;
  }
  return (a + b) / 2;
}

/**
 * Gains where `judge` changes value between neighbouring samples of a traced locus, each refined by
 * `refineChange`. `gains` ascend; `polesAt(k)` gives the closed-loop poles at sample k.
 */
export function sampledChanges(
  numerator: Polynomial,
  denominator: Polynomial,
  gains: readonly number[],
  polesAt: (k: number) => Complex[],
  judge: (poles: Complex[]) => number | boolean,
): number[] {
  const out: number[] = [];
  let previous = judge(polesAt(0));
  for (let k = 1; k < gains.length; k++) {
    const current = judge(polesAt(k));
    if (current !== previous) out.push(refineChange(numerator, denominator, gains[k - 1], gains[k], judge));
    previous = current;
  }
  return out;
}
