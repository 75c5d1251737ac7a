import type { C } from './assignment';
import { polyEvalComplex } from './poly';

/**
 * First-order condition number of the root r of p, relative to max(1, |r|): how far r moves, per unit
 * of relative perturbation of the coefficients, i.e. Σ|a_k||r|^k / (|p′(r)|·max(1, |r|)).
 * A root found with backward error ε is off by about κ·ε; near a multiple root κ blows up.
 */
export function rootCondition(p: readonly number[], r: C): number {
  const n = p.length - 1;
  const dp = p.slice(0, n).map((c, i) => c * (n - i));
  const d = polyEvalComplex(dp, r.re, r.im);
  const modulus = Math.hypot(r.re, r.im);
  const bound = p.reduce((acc, c) => acc * modulus + Math.abs(c), 0);
  return bound / (Math.hypot(d.re, d.im) * Math.max(1, modulus));
}
