import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import type { Complex } from '../complex/complex';
import { fromRoots } from '../polynomial/from-roots';
import { normalizePlant } from '../plant/normalize';
import { breakPoints } from './break-points';
import { locus } from './locus';

/*
 * A break point is where branches meet and part: a multiple root of D + K·N, i.e. a point x where
 * K(x) = −D(x)/N(x) is stationary (dK/dx = 0 ⇔ D′N − DN′ = 0) with K real (the standard condition,
 * recalled from memory). The tests evaluate that condition themselves with the helpers below.
 */

/** p(x) for complex x by Horner's rule (independent of the core's evaluator). */
function at(p: readonly number[], x: Complex): Complex {
  let re = 0;
  let im = 0;
  for (const a of p) [re, im] = [re * x.re - im * x.im + a, re * x.im + im * x.re];
  return { re, im };
}

function derivativeOf(p: readonly number[]): number[] {
  const n = p.length - 1;
  return p.slice(0, n).map((a, i) => a * (n - i));
}

/** K(x) = −D(x)/N(x) as a complex number. */
function gainAt(numerator: readonly number[], denominator: readonly number[], x: Complex): Complex {
  const d = at(denominator, x);
  const n = at(numerator, x);
  const m = n.re * n.re + n.im * n.im;
  return { re: -(d.re * n.re + d.im * n.im) / m, im: -(d.im * n.re - d.re * n.im) / m };
}

/** |D′N − DN′| at x relative to |D′N| + |DN′| (0 at an exact break point). */
function relativeCondition(numerator: readonly number[], denominator: readonly number[], x: Complex): number {
  const dp = at(derivativeOf(denominator), x);
  const n = at(numerator, x);
  const d = at(denominator, x);
  const np = numerator.length > 1 ? at(derivativeOf(numerator), x) : { re: 0, im: 0 };
  const a = { re: dp.re * n.re - dp.im * n.im, im: dp.re * n.im + dp.im * n.re };
  const b = { re: d.re * np.re - d.im * np.im, im: d.re * np.im + d.im * np.re };
  const size = Math.hypot(a.re, a.im) + Math.hypot(b.re, b.im);
  return size === 0 ? 0 : Math.hypot(a.re - b.re, a.im - b.im) / size;
}

describe('breakPoints — low order', () => {
  it('puts the break-away point of 1/(s(s + 2)) midway at −1 with K = 1', () => {
    // s² + 2s + K has the double root −1 exactly when K = 1
    const found = breakPoints([1], [1, 2, 0]);
    expect(found).toHaveLength(1);
    expectClose(found[0].point.re, -1, 1e-14);
    expect(found[0].point.im).toBe(0);
    expectClose(found[0].gain, 1, 1e-14);
  });

  it('finds the break-away and the break-in point of (s + 3)/(s(s + 1)) at −3 ± √6', () => {
    // D′N − DN′ = (2s + 1)(s + 3) − (s² + s) = s² + 6s + 3 → s = −3 ± √6; K = −s(s + 1)/(s + 3) there
    const found = breakPoints([1, 3], [1, 1, 0]);
    const expected = [-3 + Math.sqrt(6), -3 - Math.sqrt(6)].map((x) => ({ x, k: -(x * (x + 1)) / (x + 3) }));
    expect(found).toHaveLength(2);
    for (const { x, k } of expected) {
      const match = found.find((b) => Math.abs(b.point.re - x) < 1e-6);
      expect(match, `break point near ${x}`).toBeDefined();
      expectClose(match!.point.re, x, 1e-12);
      expectClose(match!.gain, k, 1e-12);
      expect(match!.gain).toBeGreaterThan(0);
    }
  });

  it('gives both roots of D′ = 0 for 1/(s(s + 1)(s + 2)), one with K > 0 and one with K < 0', () => {
    // D′ = 3s² + 6s + 2 → s = −1 ± 1/√3; K = −D(s) is +2/(3√3) at −1 + 1/√3 and −2/(3√3) at −1 − 1/√3
    const found = breakPoints([1], [1, 3, 2, 0]);
    expect(found).toHaveLength(2);
    const positive = found.find((b) => b.gain > 0)!;
    const negative = found.find((b) => b.gain < 0)!;
    expectClose(positive.point.re, -1 + 1 / Math.sqrt(3), 1e-12);
    expectClose(positive.gain, 2 / (3 * Math.sqrt(3)), 1e-12);
    expectClose(negative.point.re, -1 - 1 / Math.sqrt(3), 1e-12);
    expectClose(negative.gain, -2 / (3 * Math.sqrt(3)), 1e-12);
  });

  it('shows only the break points with real positive K on a locus of positive gains, and the other one once negative gains are traced', () => {
    const positiveOnly = locus({ plant: { expression: '1/(s*(s+1)*(s+2))' } });
    expect(positiveOnly.breakPoints).toHaveLength(1);
    expect(positiveOnly.breakPoints[0].gain).toBeGreaterThan(0);
    expectClose(positiveOnly.breakPoints[0].point.re, -1 + 1 / Math.sqrt(3), 1e-12);
    const both = locus({ plant: { expression: '1/(s*(s+1)*(s+2))' }, includeNegativeGains: true });
    expect(both.breakPoints.map((b) => Math.sign(b.gain)).sort()).toEqual([-1, 1]);
  });

  it('finds the complex break points of the symmetric plant K/(s(s + 4)(s² + 4s + 20)) and they satisfy dK/ds = 0 with K real', () => {
    // With u = s² + 4s: D = u(u + 20), D′ = (2u + 20)(2s + 4). So D′ = 0 at s = −2 (u = −4, K = −D = 64)
    // and at u = −10, i.e. s = −2 ± j√6, where K = −(−10)(10) = 100.
    const denominator = fromRoots([{ re: 0, im: 0 }, { re: -4, im: 0 }, { re: -2, im: 4 }, { re: -2, im: -4 }]);
    const found = breakPoints([1], denominator);
    expect(found).toHaveLength(3);
    const real = found.filter((b) => b.point.im === 0);
    const complex = found.filter((b) => b.point.im !== 0);
    expect(real).toHaveLength(1);
    expectClose(real[0].point.re, -2, 1e-12);
    expectClose(real[0].gain, 64, 1e-12);
    expect(complex).toHaveLength(2);
    for (const b of complex) {
      expectClose(b.point.re, -2, 1e-12);
      expectClose(Math.abs(b.point.im), Math.sqrt(6), 1e-12);
      expectClose(b.gain, 100, 1e-12);
      // the derivative condition and a real positive K, evaluated here
      expect(relativeCondition([1], denominator, b.point)).toBeLessThanOrEqual(1e-12);
      const k = gainAt([1], denominator, b.point);
      expectClose(k.re, 100, 1e-12);
      expect(Math.abs(k.im)).toBeLessThanOrEqual(1e-10);
    }
    expect(complex[0].point.im).toBe(-complex[1].point.im);
  });
});

describe('breakPoints — repeated roots', () => {
  it('reports a double open-loop pole as a break point at gain 0', () => {
    const found = locus({ plant: { expression: '1/(s+1)^2' } }).breakPoints;
    expect(found).toHaveLength(1);
    expectClose(found[0].point.re, -1, 1e-6);
    expect(found[0].gain).toBe(0);
  });

  it('lists the point where three branches meet once: 1/(s(s² + 3s + 3)) has D + K = (s + 1)³ at K = 1', () => {
    // s³ + 3s² + 3s + 1 = (s + 1)³, so at K = 1 the three closed-loop poles coincide at −1; D′ = 3(s + 1)²
    // has a double root there. One physical point, one entry; its position is only determined to about √ε.
    const found = breakPoints([1], [1, 3, 3, 0]);
    expect(found.map((b) => `${b.point.re.toFixed(6)}${b.point.im >= 0 ? '+' : ''}${b.point.im.toFixed(6)}j @ K=${b.gain}`)).toHaveLength(1);
    expect(Math.abs(found[0].point.re + 1)).toBeLessThanOrEqual(1e-6);
    expectClose(found[0].gain, 1, 1e-9);
  });

  it('skips a pole cancelled by a zero: (s + 3)/(s(s + 1)(s + 3)) has only the break point −0.5 (K = 0.25) of 1/(s(s + 1))', () => {
    // D′N − DN′ = (s + 3)²(2s + 1): its double root −3 is the cancelled pair, where N = 0 as well. The
    // closed-loop factor (s + 3) never moves, so no branches meet and part there (for any K, K(s) = −s(s + 1)
    // is not stationary at −3); the documented contract is that cancellations are skipped.
    const found = breakPoints([1, 3], fromRoots([{ re: 0, im: 0 }, { re: -1, im: 0 }, { re: -3, im: 0 }]));
    expect(found.map((b) => [b.point.re, b.gain])).toHaveLength(1);
    expectClose(found[0].point.re, -0.5, 1e-12);
    expectClose(found[0].gain, 0.25, 1e-12);
  });
});

describe('breakPoints — ill-conditioned', () => {
  it('resolves the break-away point between two poles only 1e-3 apart, with its tiny gain', () => {
    // (s + 1)(s + 1.001) + K: double root at −1.0005 when K = (0.0005)² = 2.5e-7
    const found = breakPoints([1], fromRoots([{ re: -1, im: 0 }, { re: -1.001, im: 0 }]));
    expect(found).toHaveLength(1);
    expectClose(found[0].point.re, -1.0005, 1e-12);
    expectClose(found[0].gain, 2.5e-7, 1e-6);
  });

  it('finds break points of a plant whose gains span many decades', () => {
    // poles at −0.01 and −100: break-away at their midpoint −50.005 with K = 49.995² ≈ 2499.5
    const found = breakPoints([1], fromRoots([{ re: -0.01, im: 0 }, { re: -100, im: 0 }]));
    expectClose(found[0].point.re, -50.005, 1e-13);
    expectClose(found[0].gain, 49.995 ** 2, 1e-12);
  });
});

describe('breakPoints — higher order', () => {
  it('puts one positive-gain break-away point in each real-axis segment (−1, −2), (−3, −4), … of 1/((s + 1)(s + 2)…(s + 10))', () => {
    // Segments of the positive-gain locus on the real axis lie left of an odd number of poles; between
    // two poles on such a segment the branches must meet and leave the axis. D′ has 9 real roots (Rolle),
    // one between each pair of neighbouring poles; K = −D is positive on exactly the 5 segments above.
    const poles = Array.from({ length: 10 }, (_, k) => ({ re: -1 - k, im: 0 }));
    const denominator = fromRoots(poles);
    const found = breakPoints([1], denominator);
    expect(found).toHaveLength(9);
    const positive = found.filter((b) => b.gain > 0).map((b) => b.point.re).sort((a, b) => b - a);
    expect(positive).toHaveLength(5);
    positive.forEach((x, i) => {
      expect(x).toBeLessThan(-(2 * i + 1));
      expect(x).toBeGreaterThan(-(2 * i + 2));
    });
    for (const b of found) {
      expect(b.point.im).toBe(0);
      // K = −Π(x + k), computed here in product form. The engine evaluates −D(x) from the expanded
      // coefficients, where Σ|d_k||x|^k exceeds |D(x)| by up to ~10⁸ near x = −7.5, so agreement to
      // ~1e-8 relative is what double precision allows for this polynomial
      const k = -poles.reduce((acc, p) => acc * (b.point.re - p.re), 1);
      expectClose(b.gain, k, 1e-7);
      // stationary: Σ 1/(x + k) = D′/D = 0, relative to Σ 1/|x + k| (1e-8 places the point far more
      // finely than any plot needs; the gain, stationary there, is accurate to the square of that)
      const sum = poles.reduce((acc, p) => acc + 1 / (b.point.re - p.re), 0);
      const size = poles.reduce((acc, p) => acc + 1 / Math.abs(b.point.re - p.re), 0);
      expect(Math.abs(sum) / size).toBeLessThanOrEqual(1e-8);
    }
    // the pole pattern is symmetric about −5.5, so the middle break point sits exactly there
    expectClose(positive[2], -5.5, 1e-10);
  });

  it('finds every real break point of a 12-pole, 3-zero plant that an independent eigenvalue solution of D′N − DN′ finds', () => {
    // reference: real eigenvalues of the companion matrix of D′N − DN′ (ml-matrix), kept where K = −D/N
    // is finite; each must appear in the engine's list with the same gain
    const plant = {
      poles: [
        { re: -0.3, im: 0.15 }, { re: -0.3, im: -0.15 }, { re: -9.9, im: 0.35 }, { re: -9.9, im: -0.35 }, { re: -0.15, im: 0 }, { re: -0.3, im: 0 },
        { re: -0.25, im: 0 }, { re: -7.85, im: 0 }, { re: -7.55, im: 0 }, { re: -8.25, im: 0 }, { re: 4.7, im: 0 }, { re: -4.15, im: 0 },
      ],
      zeros: [{ re: -2.6, im: 4 }, { re: -2.6, im: -4 }, { re: -7.15, im: 0 }],
      gain: 0.1,
    };
    const { numerator, denominator } = normalizePlant(plant);
    const multiply = (a: readonly number[], b: readonly number[]) => {
      const out = new Array<number>(a.length + b.length - 1).fill(0);
      a.forEach((x, i) => b.forEach((y, j) => (out[i + j] += x * y)));
      return out;
    };
    const left = multiply(derivativeOf(denominator), numerator);
    const right = multiply(denominator, derivativeOf(numerator));
    const condition = left.map((c, i) => c - (right[i - (left.length - right.length)] ?? 0));
    const n = condition.length - 1;
    const companion = Matrix.zeros(n, n);
    for (let j = 0; j < n; j++) companion.set(0, j, -condition[j + 1] / condition[0]);
    for (let i = 1; i < n; i++) companion.set(i, i - 1, 1);
    const eig = new EigenvalueDecomposition(companion);
    const reference = eig.realEigenvalues.filter((_, i) => Math.abs(eig.imaginaryEigenvalues[i]) <= 1e-8);
    expect(reference.length).toBeGreaterThanOrEqual(8);
    const found = breakPoints(numerator, denominator);
    for (const x of reference) {
      const k = gainAt(numerator, denominator, { re: x, im: 0 }).re;
      const match = found.find((b) => Math.abs(b.point.re - x) <= 1e-6 * Math.max(1, Math.abs(x)) && Math.abs(b.point.im) <= 1e-6);
      expect(match, `break point ${x} (K = ${k})`).toBeDefined();
      expectClose(match!.gain, k, 1e-8);
    }
  });
});
