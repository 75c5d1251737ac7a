import { add, multiply, power, scale, type Polynomial } from '../polynomial/polynomial';

/**
 * Maps p(z) of degree ≤ n through z = (1 + w)/(1 − w): returns (1 − w)^n·p((1 + w)/(1 − w)), whose
 * roots in the open left half-plane are exactly the images of the roots of p strictly inside the unit
 * circle (a root at z = −1 goes to infinity and lowers the degree).
 * Example: bilinear([1, −0.5], 1) = [−1.5, 0.5], whose root w = 1/3 is the image of z = 0.5.
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
