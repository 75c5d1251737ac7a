import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import type { Complex } from '../complex/complex';
import { scaledResidual } from './evaluate';
import { fromRoots } from './from-roots';
import { refineRoots, roots } from './roots';

/** Sorts by real part, then imaginary part, so that lists of roots can be compared element by element. */
function sorted(values: readonly Complex[]): Complex[] {
  return [...values].sort((a, b) => a.re - b.re || a.im - b.im);
}

/** Greedy nearest matching of computed roots to expected ones; returns the largest distance. */
function worstDistance(actual: readonly Complex[], expected: readonly Complex[]): number {
  const free = [...actual];
  let worst = 0;
  for (const e of expected) {
    let best = -1;
    let bestDistance = Infinity;
    free.forEach((a, j) => {
      const d = Math.hypot(a.re - e.re, a.im - e.im);
      if (d < bestDistance) {
        bestDistance = d;
        best = j;
      }
    });
    free.splice(best, 1);
    worst = Math.max(worst, bestDistance);
  }
  return worst;
}

/** Every non-real root has its exact mirror image in the list. */
function expectExactConjugates(values: readonly Complex[]): void {
  for (const v of values) {
    if (v.im === 0) continue;
    expect(values.some((w) => w.re === v.re && w.im === -v.im), `mirror of ${v.re}${v.im >= 0 ? '+' : ''}${v.im}j`).toBe(true);
  }
}

describe('roots — low order', () => {
  it('finds the two real roots of s² + 3s + 2 = (s + 1)(s + 2)', () => {
    const r = sorted(roots([1, 3, 2]));
    expect(r).toHaveLength(2);
    expectClose(r[0].re, -2, 1e-15);
    expectClose(r[1].re, -1, 1e-15);
    expect(r.every((x) => x.im === 0)).toBe(true);
  });

  it('finds the complex pair −1 ± 2j of s² + 2s + 5 as exact mirror images', () => {
    // (s + 1)² + 4 = 0 → s = −1 ± 2j
    const r = sorted(roots([1, 2, 5]));
    expectClose(r[0].re, -1, 1e-15);
    expectClose(r[0].im, -2, 1e-15);
    expectExactConjugates(r);
  });

  it('returns the roots of a cubic built from known roots, including a complex pair', () => {
    const expected = [
      { re: -3, im: 0 },
      { re: 0.5, im: 1.5 },
      { re: 0.5, im: -1.5 },
    ];
    expect(worstDistance(roots(fromRoots(expected)), expected)).toBeLessThanOrEqual(1e-14);
  });

  it('solves a first-degree polynomial directly and returns nothing for a constant', () => {
    expect(roots([2, -3])).toEqual([{ re: 1.5, im: 0 }]);
    expect(roots([7])).toEqual([]);
  });

  it('ignores leading zero coefficients and splits off roots at the origin exactly', () => {
    // 0·s⁶ + 0·s⁵ + s⁴ + 3s³ + 2s² = s²(s + 1)(s + 2)
    const r = roots([0, 0, 1, 3, 2, 0, 0]);
    expect(r).toHaveLength(4);
    expect(r.filter((x) => x.re === 0 && x.im === 0)).toHaveLength(2);
    expect(worstDistance(r, [{ re: 0, im: 0 }, { re: 0, im: 0 }, { re: -1, im: 0 }, { re: -2, im: 0 }])).toBeLessThanOrEqual(1e-14);
  });
});

describe('roots — repeated roots', () => {
  it('places each root of (s + 1)⁴ within about ε^(1/4) of −1, as a quadruple root allows', () => {
    // A root of multiplicity q moves by about (δ)^(1/q) when the coefficients are perturbed by a relative
    // δ (first-order perturbation theory, recalled from memory). Rounding gives δ ≈ ε = 2.2e-16, so
    // ε^(1/4) ≈ 1.2e-4; a solver that stops at a backward error of a few ·10 ε (here up to 16ε on a
    // coefficient sum of 16) may land at (256ε)^(1/4) ≈ 4.9e-4. Closer agreement cannot be asked of any
    // double-precision method; 1e-3 leaves room only for that.
    const p = [1, 4, 6, 4, 1];
    const r = roots(p);
    expect(r).toHaveLength(4);
    for (const x of r) {
      expect(Math.hypot(x.re + 1, x.im)).toBeLessThanOrEqual(1e-3);
      expect(scaledResidual(p, x)).toBeLessThanOrEqual(1e-13);
    }
    expectExactConjugates(r);
  });

  it('keeps a double root and a simple root apart: the simple one to full precision', () => {
    // (s + 2)²(s + 5): the simple root −5 is well conditioned, the double one only to about √ε
    const p = fromRoots([{ re: -2, im: 0 }, { re: -2, im: 0 }, { re: -5, im: 0 }]);
    const r = sorted(roots(p));
    expectClose(r[0].re, -5, 1e-13);
    expect(Math.hypot(r[1].re + 2, r[1].im)).toBeLessThanOrEqual(1e-6);
    expect(Math.hypot(r[2].re + 2, r[2].im)).toBeLessThanOrEqual(1e-6);
  });

  it('handles a repeated complex pair (s² + 2s + 2)² with every root near −1 ± j', () => {
    const p = fromRoots([{ re: -1, im: 1 }, { re: -1, im: -1 }, { re: -1, im: 1 }, { re: -1, im: -1 }]);
    const r = roots(p);
    expect(r).toHaveLength(4);
    // double roots: √ε ≈ 1.5e-8 times a modest condition factor
    expect(worstDistance(r, [{ re: -1, im: 1 }, { re: -1, im: -1 }, { re: -1, im: 1 }, { re: -1, im: -1 }])).toBeLessThanOrEqual(1e-6);
    expectExactConjugates(r);
  });
});

describe('roots — ill-conditioned', () => {
  it('meets the backward-error promise on the degree-20 polynomial with roots 1…20, and gets its small roots right', () => {
    // J. H. Wilkinson's example ("Rounding Errors in Algebraic Processes", 1963 — recalled from memory):
    // its coefficients reach 20! ≈ 2.4e18 and cannot all be stored exactly, and the stored polynomial's
    // larger roots are genuinely far from the integers (some become complex). What any solver can promise
    // is a tiny backward error; the small roots are well conditioned and must be accurate.
    let p = [1];
    for (let k = 1; k <= 20; k++) p = [...p, 0].map((c, i) => c - (i > 0 ? k * p[i - 1] : 0));
    const r = roots(p);
    expect(r).toHaveLength(20);
    for (const x of r) expect(scaledResidual(p, x)).toBeLessThanOrEqual(1e-12);
    const small = sorted(r).slice(0, 3);
    small.forEach((x, i) => {
      expectClose(x.re, i + 1, 1e-9);
      expect(x.im).toBe(0);
    });
    expectExactConjugates(r);
  });

  it('resolves roots twelve orders of magnitude apart, each to a small relative error', () => {
    // (s + 1e-6)(s + 1)(s + 1e6): a Newton-polygon start sizes each root separately
    const expected = [-1e6, -1, -1e-6];
    const r = sorted(roots(fromRoots(expected.map((re) => ({ re, im: 0 })))));
    r.forEach((x, i) => {
      expectClose(x.re, expected[i], 1e-9);
      expect(x.im).toBe(0);
    });
  });

  it.each([1e100, 1e200, 1e300])('finds the huge complex pair −1 ± j√(c − 1) of s² + 2s + c for c = %s', (c) => {
    // |roots| = √c, far above 1: the reversed-polynomial evaluation exists for such roots. Every root
    // must keep a tiny backward error and the pair must stay complex (the discriminant 4 − 4c < 0).
    const p = [1, 2, c];
    const r = roots(p);
    expect(r).toHaveLength(2);
    for (const x of r) {
      expect(scaledResidual(p, x)).toBeLessThanOrEqual(1e-12);
      expectClose(Math.abs(x.im), Math.sqrt(c), 1e-12);
    }
  });

  it('separates two roots 1e-6 apart to about the accuracy their closeness allows', () => {
    // nearly double: the pair is determined to about ε/1e-6 ≈ 2e-10 (first-order estimate)
    const expected = [{ re: -1, im: 0 }, { re: -1 - 1e-6, im: 0 }, { re: -3, im: 0 }];
    expect(worstDistance(roots(fromRoots(expected)), expected)).toBeLessThanOrEqual(1e-8);
  });
});

describe('roots — high order', () => {
  it.each([40, 50, 60])('returns the %i-th roots of unity from zⁿ − 1 to near machine precision', (n) => {
    const p = [1, ...new Array<number>(n - 1).fill(0), -1];
    const r = roots(p);
    expect(r).toHaveLength(n);
    const expected = Array.from({ length: n }, (_, k) => ({ re: Math.cos((2 * Math.PI * k) / n), im: Math.sin((2 * Math.PI * k) / n) }));
    expect(worstDistance(r, expected)).toBeLessThanOrEqual(1e-13);
    expectExactConjugates(r);
  });

  it('finds 50 roots spread over a disc of radius 2 with every backward error at rounding level', () => {
    // deterministic spread: 25 conjugate pairs on a spiral
    const expected: Complex[] = [];
    for (let k = 0; k < 25; k++) {
      const radius = 0.5 + (1.5 * k) / 24;
      const angle = 0.2 + (2.7 * k) / 24;
      expected.push({ re: radius * Math.cos(angle), im: radius * Math.sin(angle) }, { re: radius * Math.cos(angle), im: -radius * Math.sin(angle) });
    }
    const p = fromRoots(expected);
    const r = roots(p);
    expect(r).toHaveLength(50);
    for (const x of r) expect(scaledResidual(p, x)).toBeLessThanOrEqual(1e-12);
    expectExactConjugates(r);
  });
});

describe('roots — high order and ill-conditioned together', () => {
  // Where the roots are badly determined by the coefficients (forward error large), a solver can
  // still return values with a tiny backward error — each one an exact root of a polynomial whose
  // coefficients differ from the given ones by a few units of rounding. That is what `roots` promises;
  // the companion-matrix eigenvalues of the same polynomials reach about 1e-11, and refining the
  // exact roots with the same Aberth iteration stops immediately at about 1e-14. The bound 1e-10 below
  // is thousands of times the solver's own stopping rule (4nε ≈ 4e-14 for n = 50).
  function spiral(pairs: number): Complex[] {
    const out: Complex[] = [];
    for (let k = 0; k < pairs; k++) {
      const theta = (Math.PI / 2) * (0.05 + (0.9 * k) / (pairs - 1));
      const radius = 1 + (0.5 * k) / (pairs - 1);
      out.push({ re: -radius * Math.cos(theta), im: radius * Math.sin(theta) }, { re: -radius * Math.cos(theta), im: -radius * Math.sin(theta) });
    }
    return out;
  }

  it.each([36, 40, 50])('returns %i roots on a spiral each with backward error at rounding level', (n) => {
    const p = fromRoots(spiral(n / 2));
    const r = roots(p);
    expect(r).toHaveLength(n);
    const worst = Math.max(...r.map((x) => scaledResidual(p, x)));
    expect(worst).toBeLessThanOrEqual(1e-10);
  });

  it('returns the 40 poles of a low-pass prototype (evenly on the left unit half-circle) each with backward error at rounding level', () => {
    const poles = Array.from({ length: 40 }, (_, k) => {
      const theta = Math.PI / 2 + (Math.PI * (2 * k + 1)) / 80;
      return { re: Math.cos(theta), im: Math.sin(theta) };
    });
    const p = fromRoots(poles);
    const worst = Math.max(...roots(p).map((x) => scaledResidual(p, x)));
    expect(worst).toBeLessThanOrEqual(1e-10);
  });
});

describe('refineRoots', () => {
  it('polishes perturbed approximations back onto the roots and reports convergence', () => {
    const p = fromRoots([{ re: -1, im: 0 }, { re: -2, im: 1 }, { re: -2, im: -1 }, { re: 3, im: 0 }]);
    const re = Float64Array.from([-1.05, -2.1, -1.95, 3.02]);
    const im = Float64Array.from([0.01, 1.04, -0.97, 0]);
    const outcome = refineRoots(p, re, im, 60);
    expect(outcome.converged).toBe(true);
    const found = Array.from(re, (x, i) => ({ re: x, im: im[i] }));
    expect(worstDistance(found, [{ re: -1, im: 0 }, { re: -2, im: 1 }, { re: -2, im: -1 }, { re: 3, im: 0 }])).toBeLessThanOrEqual(1e-12);
  });

  it('reports no convergence when it is given too few sweeps from a poor start', () => {
    const p = fromRoots(Array.from({ length: 12 }, (_, k) => ({ re: -1 - k, im: 0 })));
    const re = new Float64Array(12).fill(100);
    const im = Float64Array.from({ length: 12 }, (_, k) => k);
    expect(refineRoots(p, re, im, 1).converged).toBe(false);
  });
});
