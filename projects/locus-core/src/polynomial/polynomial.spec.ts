import { describe, expect, it } from 'vitest';
import { fromRoots } from './from-roots';
import { multiply } from './polynomial';

describe('multiply', () => {
  it('multiplies two linear factors into their quadratic', () => {
    // (s + 1)(s + 2) = s² + 3s + 2, expanded by hand
    expect(multiply([1, 1], [1, 2])).toEqual([1, 3, 2]);
  });

  it('keeps the highest-power-first order for factors of different degree', () => {
    // (2s² + 0s − 1)(3s + 4) = 6s³ + 8s² − 3s − 4, expanded by hand
    expect(multiply([2, 0, -1], [3, 4])).toEqual([6, 8, -3, -4]);
  });

  it('treats a constant as a scaling and the empty list as the zero polynomial', () => {
    expect(multiply([5], [1, -2, 3])).toEqual([5, -10, 15]);
    expect(multiply([], [1, 2])).toEqual([]);
    expect(multiply([1, 2], [])).toEqual([]);
  });

  it('agrees with building the polynomial from the union of both root sets', () => {
    const a = [{ re: -1, im: 2 }, { re: -1, im: -2 }];
    const b = [{ re: -3, im: 0 }, { re: 0.5, im: 0 }];
    const product = multiply(fromRoots(a), fromRoots(b));
    const direct = fromRoots([...a, ...b]);
    expect(product).toHaveLength(direct.length);
    product.forEach((c, i) => expect(Math.abs(c - direct[i])).toBeLessThan(1e-12 * Math.max(1, Math.abs(direct[i]))));
  });
});
