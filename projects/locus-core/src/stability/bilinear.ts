import { exactIntegers } from '../numeric/exact-integers';
import { add, multiply, power, scale, type Polynomial } from '../polynomial/polynomial';
import { routhExact, type StabilityVerdict } from './routh';

/**
 * Maps p(z) of degree ≤ n through z = (1 + w)/(1 − w): returns (1 − w)^n·p((1 + w)/(1 − w)), whose
 * roots in the open left half-plane are exactly the images of the roots of p strictly inside the unit
 * circle (a root at z = −1 goes to infinity and lowers the degree). Floating point; see
 * `bilinearStability` for the exact test.
 * Example: bilinear([1, −0.5], 1) = [1.5, 0.5], whose root w = −1/3 is the image of z = 0.5.
 */
export function bilinear(p: Polynomial, n = p.length - 1): number[] {
  let out: number[] = [0];
  const onePlus = [1, 1]; // 1 + w
  const oneMinus = [-1, 1]; // 1 − w
  for (let i = 0; i < p.length; i++) {
    const k = p.length - 1 - i; // power of z
    if (p[i] === 0) continue;
    out = add(out, scale(multiply(power(onePlus, k), power(oneMinus, n - k)), p[i]));
  }
  return out;
}

/**
 * Exact Schur stability (every root strictly inside the unit circle) by the bilinear map and the
 * Routh–Hurwitz test, both in exact integer arithmetic on the given coefficients: binomial expansion
 * of (1 + w)^k (1 − w)^{n−k} over integers, then the fraction-free Routh array. A root at z = −1 shows
 * as a drop in degree and makes the verdict "not stable".
 * Example: bilinearStability([1, −1, 0.5]) is stable (roots 0.5 ± 0.5j).
 */
export function bilinearStability(p: Polynomial): StabilityVerdict {
  let start = 0;
  while (start < p.length && p[start] === 0) start++;
  const a = exactIntegers(p.slice(start));
  const n = a.length - 1;
  if (n < 0) return { isStable: false, unstableCount: null };
  const out = new Array<bigint>(n + 1).fill(0n);
  for (let i = 0; i <= n; i++) {
    if (a[i] === 0n) continue;
    const k = n - i; // power of z
    const term = multiplyExact(binomialPower(1n, k), binomialPower(-1n, n - k));
    for (let j = 0; j <= n; j++) out[j] += a[i] * term[j];
  }
  // (1 + w)^k has coefficients highest first [1, …]; the product has degree n exactly unless p(−1) = 0
  if (out[0] === 0n) return { isStable: false, unstableCount: null };
  return routhExact(out);
}

/** Coefficients of (s·w + 1)^k, highest power first, for s = ±1. */
function binomialPower(s: bigint, k: number): bigint[] {
  const out: bigint[] = [1n];
  let c = 1n;
  for (let i = 1; i <= k; i++) {
    c = (c * BigInt(k - i + 1)) / BigInt(i);
    out.push(c);
  }
  // out[i] = C(k, i) is the coefficient of w^{k−i}; give it the sign s^{k−i}
  return out.map((v, i) => ((k - i) % 2 === 1 && s < 0n ? -v : v));
}

function multiplyExact(p: readonly bigint[], q: readonly bigint[]): bigint[] {
  const out = new Array<bigint>(p.length + q.length - 1).fill(0n);
  for (let i = 0; i < p.length; i++) for (let j = 0; j < q.length; j++) out[i + j] += p[i] * q[j];
  return out;
}
