/**
 * Stable gain ranges and imaginary-axis crossings against limits derived in the tests themselves from
 * the Routh–Hurwitz criterion, and `routh()` against the real parts of companion-matrix eigenvalues.
 *
 * Criterion used throughout (E. J. Routh 1877, A. Hurwitz 1895; stated in every control handbook,
 * e.g. K. Ogata, "Modern Control Engineering", ch. 5 — recalled from memory): a real polynomial
 * a0·sⁿ + a1·sⁿ⁻¹ + … + an with a0 > 0 has every root in the open left half-plane exactly when all
 * Hurwitz determinants are positive. For low degrees that reads:
 *   cubic:   all a_i > 0 and a1·a2 > a0·a3;
 *   quartic: all a_i > 0 and a1·a2·a3 > a0·a3² + a1²·a4  (Δ3 > 0; then Δ2 > 0 follows).
 * At a boundary gain where the s¹ row of the Routh array vanishes, the s² row [A, B] gives the
 * auxiliary equation A·s² + B = 0, i.e. the crossing at s = ±j·√(B/A).
 */
import { describe, expect, it, vi } from 'vitest';
import { fromRoots, routh, type GainPoint, type LocusRequest, type LocusResult } from '../../projects/locus-core/src/public-api';
import { expectClose } from '../support/tolerance';
import { matchedRelativeGaps } from './support/assignment';
import { companionEigenvalues } from './support/eigen';
import { auxiliaryFrequency, derivedStableRanges, type DerivedRange } from './support/hurwitz';
import { locusInSeparateProcess } from './support/isolated';
import { polyAdd, polyFromRealRoots, polyMul, polyPad, polyScale } from './support/poly';
import { Draw } from './support/random';

// locus calls run in a separate process that may have to time out (see support/isolated.ts)
vi.setConfig({ testTimeout: 600_000 });

const BOUNDARY_TOLERANCE = 1e-9;

/** `locus` run in a separate process (see support/isolated.ts); the test fails if the call does not return. */
function isolatedLocus(request: LocusRequest): LocusResult {
  const outcome = locusInSeparateProcess(request);
  expect(outcome.failure ?? 'returned', 'locus must return').toBe('returned');
  return outcome.result as LocusResult;
}

function expectRanges(actual: readonly { from: number | null; to: number | null }[], expected: readonly { from: number | null; to: number | null }[], label: string): void {
  expect(actual.length, `${label}: number of stable intervals (got ${JSON.stringify(actual.map((r) => [r.from, r.to]))})`).toBe(expected.length);
  actual.forEach((r, i) => {
    const e = expected[i];
    for (const end of ['from', 'to'] as const) {
      const want = e[end];
      const got = r[end];
      if (want === null) expect(got, `${label}: interval ${i} ${end}`).toBeNull();
      else expectClose(got as number, want, BOUNDARY_TOLERANCE, 0, `${label}: interval ${i} ${end}`);
    }
  });
}

/** Asserts that the result lists the crossing pair ±jω (or the origin when ω = 0) at gain K. */
function expectCrossingAt(crossings: readonly GainPoint[], gain: number, omega: number, label: string): void {
  const here = crossings.filter((c) => Math.abs(c.gain - gain) <= BOUNDARY_TOLERANCE * Math.abs(gain));
  expect(here.length, `${label}: crossings at K = ${gain} among ${JSON.stringify(crossings)}`).toBeGreaterThanOrEqual(omega === 0 ? 1 : 2);
  for (const c of here) {
    // on the imaginary axis: the real part is zero to the precision of the point
    expect(Math.abs(c.point.re), `${label}: real part of the crossing at K = ${gain}`).toBeLessThanOrEqual(BOUNDARY_TOLERANCE * Math.max(1, omega));
    expectClose(Math.abs(c.point.im), omega, BOUNDARY_TOLERANCE, BOUNDARY_TOLERANCE, `${label}: crossing frequency at K = ${gain}`);
  }
  if (omega > 0) {
    expect(here.some((c) => c.point.im > 0), `${label}: upper crossing`).toBe(true);
    expect(here.some((c) => c.point.im < 0), `${label}: lower crossing`).toBe(true);
  }
}

/** D + K·N built by the test. */
function closedLoop(numerator: readonly number[], denominator: readonly number[], gain: number): number[] {
  return polyAdd(denominator, polyScale(polyPad(numerator, denominator.length), gain));
}

describe('stable gain ranges of loop families with closed-form Routh–Hurwitz limits', () => {
  it('keeps K/(s(s + a)(s + b)) stable exactly for 0 < K < a·b·(a + b), with the crossing at ω = √(a·b)', () => {
    // D + K·N = s³ + (a+b)s² + ab·s + K. Cubic condition a1·a2 > a0·a3: (a+b)·ab > K, and K > 0 for a3 > 0.
    // At K = ab(a+b) the s² row is [a+b, K]: (a+b)s² + ab(a+b) = 0, so s = ±j√(ab).
    for (const [a, b] of [[0.5, 3], [2, 7], [1.3, 1.3], [10, 40], [0.02, 0.3]]) {
      const limit = a * b * (a + b);
      const label = `K/(s(s+${a})(s+${b}))`;
      const result = isolatedLocus({ plant: { numerator: [1], denominator: polyFromRealRoots([0, -a, -b]) }, includeNegativeGains: true });
      expectRanges(result.stableGainRanges, [{ from: 0, to: limit }], label);
      expectCrossingAt(result.crossings, limit, Math.sqrt(a * b), label);
      expect(result.crossings.filter((c) => c.gain > 0).length, `${label}: crossings at K > 0`).toBe(2);
      // for K < 0 the constant coefficient K is negative: never stable
      expect(result.negativeStableGainRanges, label).toEqual([]);
    }
  });

  it('keeps K/(s + a)⁴ stable exactly for −a⁴ < K < 4a⁴, crossing at ω = a and at the origin', () => {
    // D + K·N = s⁴ + 4a s³ + 6a² s² + 4a³ s + (a⁴ + K).
    // Quartic condition: 4a·6a²·4a³ > (4a³)² + (4a)²(a⁴ + K) ⇔ 96a⁶ > 32a⁶ + 16a²K ⇔ K < 4a⁴.
    // Check by the roots: s + a = K^{1/4}·e^{±jπ/4}, Re s = −a + K^{1/4}/√2 = 0 at K = 4a⁴, where Im s = K^{1/4}/√2 = a.
    // s² row at the limit: [(a1a2 − a0a3)/a1, a4] = [5a², 5a⁴] ⇒ 5a²s² + 5a⁴ = 0, s = ±ja.
    // For K < 0 the last condition a4 = a⁴ + K > 0 gives K > −a⁴ (the quartic inequality holds for K < 0);
    // at K = −a⁴ the closed loop has a root at s = 0.
    for (const a of [0.7, 2, 5]) {
      const label = `K/(s+${a})^4`;
      const result = isolatedLocus({ plant: { numerator: [1], denominator: polyFromRealRoots([-a, -a, -a, -a]) }, includeNegativeGains: true });
      expectRanges(result.stableGainRanges, [{ from: 0, to: 4 * a ** 4 }], label);
      expectCrossingAt(result.crossings, 4 * a ** 4, a, label);
      expectRanges(result.negativeStableGainRanges ?? [], [{ from: -(a ** 4), to: 0 }], `${label}, K < 0`);
      expectCrossingAt(result.crossings, -(a ** 4), 0, `${label}, K < 0`);
    }
  });

  it('keeps K(s + z)/(s(s + a)(s + b)(s + c)) stable up to the positive root of the Routh quadratic in K', () => {
    // With e1 = a+b+c, e2 = ab+bc+ca, e3 = abc: D + K·N = s⁴ + e1 s³ + e2 s² + (e3 + K) s + K z.
    // Quartic condition e1·e2·(e3+K) > (e3+K)² + e1²·z·K, i.e.
    //   K² + (2e3 − e1e2 + e1² z)·K + (e3² − e1e2e3) < 0.
    // Since e1e2 > e3 for positive a, b, c the constant term is negative: one negative root and one
    // positive root K*, and the loop is stable exactly for 0 < K < K*. There ω² = a3/a1 = (e3 + K*)/e1
    // (the odd part a1 s³ + a3 s vanishes at s = jω), which the s² row of the Routh array must reproduce.
    for (const [a, b, c, z] of [[1, 3, 6, 2], [0.5, 2, 9, 0.8], [2, 5, 5, 7], [0.3, 0.9, 4, 0.1]]) {
      const e1 = a + b + c;
      const e2 = a * b + b * c + c * a;
      const e3 = a * b * c;
      const B = 2 * e3 - e1 * e2 + e1 * e1 * z;
      const C = e3 * e3 - e1 * e2 * e3;
      const limit = (-B + Math.sqrt(B * B - 4 * C)) / 2;
      const omega = Math.sqrt((e3 + limit) / e1);
      const numerator = [1, z];
      const denominator = polyFromRealRoots([0, -a, -b, -c]);
      const label = `K(s+${z})/(s(s+${a})(s+${b})(s+${c}))`;
      expectClose(auxiliaryFrequency(closedLoop(numerator, denominator, limit)), omega, 1e-9, 0, `${label}: auxiliary equation vs closed form`);
      const result = isolatedLocus({ plant: { numerator, denominator } });
      expectRanges(result.stableGainRanges, [{ from: 0, to: limit }], label);
      expectCrossingAt(result.crossings, limit, omega, label);
    }
  });

  it('derives, with the test’s own symbolic Hurwitz determinants, the hand-derived limits of the families above', () => {
    // a check of the test machinery itself before it is used on loops without a closed form
    const a = 2;
    const b = 7;
    expectRanges(derivedStableRanges([1], polyFromRealRoots([0, -a, -b])), [{ from: 0, to: a * b * (a + b) }], 'cubic family');
    expectRanges(derivedStableRanges([1], polyFromRealRoots([-a, -a, -a, -a])), [{ from: 0, to: 4 * a ** 4 }], 'quartic family');
    expectRanges(derivedStableRanges([1], polyFromRealRoots([-a, -a, -a, -a]), -1), [{ from: 0, to: a ** 4 }], 'quartic family, |K| for K < 0');
  });
});

interface Conditional {
  readonly label: string;
  readonly numerator: number[];
  readonly denominator: number[];
  /** Stable set when it is known in closed form; otherwise it is derived symbolically in K. */
  readonly handDerived?: DerivedRange[];
}

/** Invented loops whose stable set does not start at K = 0, is bounded away from it, or has two parts. */
const conditional: Conditional[] = [
  {
    // D + K·N = s⁴ + 10s³ + K s² + K s + K/4. Quartic condition: 10·K·K > K² + 100·K/4 ⇔ 9K² > 25K ⇔ K > 25/9;
    // at K = 25/9 the crossing is at ω² = a3/a1 = K/10 = 5/18.
    label: 'K(s+0.5)²/(s³(s+10)) — triple integrator with a double lead zero',
    numerator: polyMul([1, 0.5], [1, 0.5]),
    denominator: polyFromRealRoots([0, 0, 0, -10]),
    handDerived: [{ from: 25 / 9, to: null }],
  },
  {
    label: 'K(s+0.4)²/(s³(s+6)(s+9)) — stable only on a bounded interval away from 0',
    numerator: polyMul([1, 0.4], [1, 0.4]),
    denominator: polyFromRealRoots([0, 0, 0, -6, -9]),
  },
  {
    label: 'K(s+2)²/(s(s−1)(s+6)(s+10)) — unstable open-loop pole, stable from a minimum gain on',
    numerator: polyMul([1, 2], [1, 2]),
    denominator: polyFromRealRoots([0, 1, -6, -10]),
  },
  {
    label: 'K(s²+0.9s+2.25)/(s(s+4)(s+6)(s²+0.4s+1)) — lightly damped mode: two stable intervals',
    numerator: [1, 0.9, 2.25],
    denominator: polyMul(polyFromRealRoots([0, -4, -6]), [1, 0.4, 1]),
  },
];

describe('conditionally stable loops against symbolic-in-K Hurwitz determinants', () => {
  it('finds the hand-derived stable set of the triple-integrator loop with the symbolic machinery too', () => {
    const loop = conditional[0];
    expectRanges(derivedStableRanges(loop.numerator, loop.denominator), loop.handDerived ?? [], loop.label);
  });

  it('has the expected shape of stable set for each invented loop (so the cases test what they claim)', () => {
    const shapes = conditional.map((loop) => derivedStableRanges(loop.numerator, loop.denominator));
    expect(shapes[0][0].from).toBeGreaterThan(0);
    expect(shapes[1].length).toBe(1);
    expect(shapes[1][0].from).toBeGreaterThan(0);
    expect(shapes[1][0].to).not.toBeNull();
    expect(shapes[2][0].from).toBeGreaterThan(0);
    expect(shapes[3].length).toBe(2);
  });

  for (const loop of conditional) {
    it(`reports the exact stable gain ranges and axis crossings of ${loop.label}`, () => {
      const derived = loop.handDerived ?? derivedStableRanges(loop.numerator, loop.denominator);
      // run apart: a call that never returns must fail this test, not exhaust the whole run
      const outcome = locusInSeparateProcess({ plant: { numerator: loop.numerator, denominator: loop.denominator } });
      expect(outcome.failure ?? 'returned', `${loop.label}: locus must return`).toBe('returned');
      const result = outcome.result as LocusResult;
      expectRanges(result.stableGainRanges, derived, loop.label);
      const boundaries = derived.flatMap((r) => [r.from, r.to]).filter((k): k is number => k !== null && k > 0);
      for (const gain of boundaries) {
        const polynomial = closedLoop(loop.numerator, loop.denominator, gain);
        // a boundary where the constant coefficient vanishes is a crossing at the origin
        const omega = Math.abs(polynomial[polynomial.length - 1]) <= 1e-12 * Math.max(...polynomial.map(Math.abs)) ? 0 : auxiliaryFrequency(polynomial);
        expectCrossingAt(result.crossings, gain, omega, loop.label);
      }
      // every reported crossing, at a boundary or not (a touch-and-return leaves stability unchanged),
      // must lie on the imaginary axis
      for (const c of result.crossings) expect(Math.abs(c.point.re), `${loop.label}: crossing ${JSON.stringify(c)} is on the imaginary axis`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(c.point.im)));
    });
  }
});

describe('routh() against the real parts of companion-matrix eigenvalues', () => {
  it('counts the right-half-plane roots of polynomials built from roots off the imaginary axis, up to degree 30', () => {
    const draw = Draw.seeded(2718);
    let compared = 0;
    for (let c = 0; c < 300; c++) {
      const n = draw.integer(1, 30);
      const scale = draw.logUniform(-1, 1);
      const rightShare = draw.uniform(0, 1) < 0.3 ? 0 : draw.uniform(0, 0.6);
      // separated roots (so that the eigensolver places them well) with |Re| ≥ 0.1·scale
      const chosen: { re: number; im: number }[] = [];
      while (chosen.length < n) {
        const re = (draw.uniform(0, 1) < rightShare ? 1 : -1) * draw.uniform(0.1, 2.5) * scale;
        const pair = n - chosen.length >= 2 && draw.uniform(0, 1) < 0.5;
        const im = pair ? draw.uniform(0.1, 4) * scale : 0;
        if (chosen.some((q) => Math.hypot(q.re - re, q.im - im) < 0.15 * scale || Math.hypot(q.re - re, q.im + im) < 0.15 * scale)) continue;
        if (pair) chosen.push({ re, im }, { re, im: -im });
        else chosen.push({ re, im: 0 });
      }
      const p = polyScale(fromRoots(chosen), draw.sign() * draw.logUniform(-2, 2));
      const eigenvalues = companionEigenvalues(p);
      const unstable = eigenvalues.filter((r) => r.re > 0).length;
      // a high-degree polynomial with many real roots is ill-conditioned; where the eigensolver does not
      // even reproduce the count of the chosen roots, it is no reference and the case is skipped
      if (unstable !== chosen.filter((r) => r.re > 0).length) continue;
      const verdict = routh(p);
      expect(verdict.unstableCount, `case ${c}, degree ${n}`).toBe(unstable);
      expect(verdict.isStable, `case ${c}, degree ${n}`).toBe(unstable === 0);
      compared++;
    }
    expect(compared).toBeGreaterThan(280);
  });

  it('counts the right-half-plane roots of random-coefficient polynomials as the eigenvalues do', () => {
    const draw = Draw.seeded(1414);
    let compared = 0;
    for (let c = 0; c < 400; c++) {
      const n = draw.integer(1, 16);
      const p = [draw.sign() * draw.uniform(0.2, 2), ...Array.from({ length: n }, () => draw.normal() * draw.logUniform(-1, 1))];
      const eigenvalues = companionEigenvalues(p);
      // skip the rare polynomial with a root too close to the axis for the eigensolver to place it
      if (eigenvalues.some((r) => Math.abs(r.re) <= 1e-6 * Math.max(1, Math.hypot(r.re, r.im)))) continue;
      const unstable = eigenvalues.filter((r) => r.re > 0).length;
      expect(routh(p).unstableCount, `case ${c}: ${JSON.stringify(p)}`).toBe(unstable);
      compared++;
    }
    expect(compared).toBeGreaterThan(380);
  });

  it('calls a polynomial with a root on the imaginary axis not stable, without a count', () => {
    // (s² + 4)(s + 1)(s + 3) = s⁴ + 4s³ + 7s² + 16s + 12 and s(s + 1)(s + 2) = s³ + 3s² + 2s: exact integer
    // coefficients, so the roots ±2j and 0 are exactly on the axis
    expect(routh([1, 4, 7, 16, 12])).toEqual({ isStable: false, unstableCount: null });
    expect(routh([1, 3, 2, 0]).isStable).toBe(false);
    // the same quartic with the axis pair pushed just inside (s² + 0.01s + 4) is stable
    expect(routh(polyMul([1, 0.01, 4], [1, 4, 3])).isStable).toBe(true);
  });

  it('ignores a positive or negative overall factor', () => {
    const p = fromRoots([{ re: -1, im: 2 }, { re: -1, im: -2 }, { re: 0.5, im: 0 }, { re: -3, im: 0 }]);
    expect(routh(p).unstableCount).toBe(1);
    expect(routh(polyScale(p, -2.5)).unstableCount).toBe(1);
    expect(routh(polyScale(p, 1e-30)).unstableCount).toBe(1);
  });
});
