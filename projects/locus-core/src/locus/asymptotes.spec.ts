import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import { fromRoots } from '../polynomial/from-roots';
import { asymptotes, normalizeDegrees } from './asymptotes';
import { locus } from './locus';

/*
 * Rules used (standard root-locus construction, recalled from memory): n − m branches go to infinity
 * along rays from the centroid σ = (Σ poles − Σ zeros)/(n − m) at angles (2l + 1)·180°/(n − m) for K > 0
 * (when the plant's leading-coefficient ratio is positive) and l·360°/(n − m) for K < 0.
 */

const real = (values: number[]) => values.map((re) => ({ re, im: 0 }));

describe('asymptotes — low order', () => {
  it('gives centroid −1 and angles −60°, 60°, 180° for 1/(s(s + 1)(s + 2))', () => {
    const a = asymptotes([1], [1, 3, 2, 0]);
    expect(a).not.toBeNull();
    expectClose(a!.centroid, -1, 1e-15);
    expect(a!.anglesDeg).toEqual([-60, 60, 180]);
  });

  it('points the single asymptote of a relative-degree-one plant along the negative real axis', () => {
    const a = asymptotes([1, 5, 6], [1, 5, 4, 0]); // (s + 2)(s + 3)/(s(s + 1)(s + 4))
    expect(a!.anglesDeg).toEqual([180]);
  });

  it('gives ±90° for relative degree two and ±45°, ±135° for relative degree four', () => {
    expect(asymptotes([1], [1, 2, 0])!.anglesDeg).toEqual([-90, 90]);
    expect(asymptotes([1], fromRoots(real([0, -1, -2, -3])))!.anglesDeg).toEqual([-135, -45, 45, 135]);
  });

  it('subtracts the zeros from the poles in the centroid: (s + 6)/(s(s + 2)(s + 4)(s + 10)) has σ = (−16 + 6)/3', () => {
    const a = asymptotes(fromRoots(real([-6])), fromRoots(real([0, -2, -4, -10])));
    expectClose(a!.centroid, -10 / 3, 1e-14);
    expect(a!.anglesDeg).toEqual([-60, 60, 180]);
  });

  it('ignores complex poles’ imaginary parts in the centroid (they cancel in conjugate pairs)', () => {
    const a = asymptotes([1], fromRoots([{ re: 0, im: 0 }, { re: -4, im: 0 }, { re: -2, im: 4 }, { re: -2, im: -4 }]));
    expectClose(a!.centroid, -2, 1e-15);
  });

  it('returns null when there are as many zeros as poles', () => {
    expect(asymptotes([1, 1], [1, 2])).toBeNull();
  });
});

describe('asymptotes — sign of the loop and of the gain', () => {
  it('turns the rays by 180°/(n − m) when the leading coefficients have opposite signs', () => {
    // −1/(s(s + 2)) with K > 0 behaves as 1/(s(s + 2)) with K < 0: rays at 0° and 180°
    expect(asymptotes([-1], [1, 2, 0])!.anglesDeg).toEqual([0, 180]);
    expect(asymptotes([-1], [1, 3, 2, 0])!.anglesDeg).toEqual([-120, 0, 120]);
  });

  it('uses l·360°/(n − m) for negative gains', () => {
    expect(asymptotes([1], [1, 3, 2, 0], true)!.anglesDeg).toEqual([-120, 0, 120]);
    expect(asymptotes([1], [1, 2, 0], true)!.anglesDeg).toEqual([0, 180]);
  });
});

describe('asymptotes — repeated roots and high order', () => {
  it('centres the four rays of 1/(s + 1)⁴ on the quadruple pole', () => {
    const a = asymptotes([1], [1, 4, 6, 4, 1]);
    expectClose(a!.centroid, -1, 1e-15);
    expect(a!.anglesDeg).toEqual([-135, -45, 45, 135]);
  });

  it('spreads 60 rays 6° apart, starting at ±3°, for a relative degree of 60', () => {
    const denominator = fromRoots(Array.from({ length: 60 }, (_, k) => ({ re: -1 - k / 60, im: 0 })));
    const a = asymptotes([1], denominator)!;
    expect(a.anglesDeg).toHaveLength(60);
    const expected = Array.from({ length: 60 }, (_, l) => normalizeDegrees(((2 * l + 1) * 180) / 60)).sort((x, y) => x - y);
    a.anglesDeg.forEach((angle, i) => expectClose(angle, expected[i], 1e-12));
    expectClose(a.anglesDeg[0], -177, 1e-12);
    // Σ poles / 60 = mean of −1 − k/60 for k = 0…59 = −1 − 59/120
    expectClose(a.centroid, -1 - 59 / 120, 1e-13);
  });

  it('agrees with the far end of a traced locus: each far branch heads along one of the rays', () => {
    const plant = { expression: '(s+2)/(s*(s+1)*(s+3)*(s+5))' };
    const result = locus({ plant });
    const a = result.asymptotes!;
    const last = result.branches[0].points.length - 1;
    const far = result.branches.map((b) => b.points[last]).filter((p) => Math.hypot(p.re + 2, p.im) > 1);
    expect(far).toHaveLength(3);
    for (const p of far) {
      const direction = (Math.atan2(p.im, p.re - a.centroid) * 180) / Math.PI;
      const gap = Math.min(...a.anglesDeg.map((t) => Math.abs(normalizeDegrees(direction - t))));
      expect(gap).toBeLessThanOrEqual(5);
    }
    // the branch that stays finite ends at the zero −2
    const near = result.branches.map((b) => b.points[last]).filter((p) => Math.hypot(p.re + 2, p.im) <= 1);
    expect(near).toHaveLength(1);
    expect(Math.hypot(near[0].re + 2, near[0].im)).toBeLessThanOrEqual(0.05);
  });
});

describe('normalizeDegrees', () => {
  it('brings angles into (−180°, 180°], with −180° written as 180°', () => {
    expect(normalizeDegrees(-180)).toBe(180);
    expect(normalizeDegrees(540)).toBe(180);
    expect(normalizeDegrees(190)).toBe(-170);
    expect(normalizeDegrees(-190)).toBe(170);
    expect(normalizeDegrees(720 + 45)).toBe(45);
  });

  it('tidies angles that differ from a whole value only by rounding', () => {
    expect(normalizeDegrees(59.99999999999999)).toBe(60);
  });
});
