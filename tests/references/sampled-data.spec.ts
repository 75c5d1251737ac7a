/**
 * Sampled-data (z-plane) references: the Jury test and the bilinear map against eigenvalue moduli,
 * a z-loop's stable gain range against the Jury conditions worked by hand, and zero-order-hold
 * equivalents (with and without dead time) against closed forms and analytic step responses.
 */
import { describe, expect, it, vi } from 'vitest';
import { bilinear, fromRoots, jury, normalizePlant, routh, zeroOrderHoldEquivalent, type LocusRequest, type LocusResult } from '../../projects/locus-core/src/public-api';
import { expectClose } from '../support/tolerance';
import { companionEigenvalues } from './support/eigen';
import { locusInSeparateProcess } from './support/isolated';
import { polyMul, polyPad, polyScale } from './support/poly';
import { Draw } from './support/random';

// locus calls run in a separate process that may have to time out (see support/isolated.ts)
vi.setConfig({ testTimeout: 600_000 });

/** `locus` run in a separate process (see support/isolated.ts); the test fails if the call does not return. */
function isolatedLocus(request: LocusRequest): LocusResult {
  const outcome = locusInSeparateProcess(request);
  expect(outcome.failure ?? 'returned', 'locus must return').toBe('returned');
  return outcome.result as LocusResult;
}

/** Random real polynomial whose roots keep at least `gap` from the unit circle; returns it with its count of roots outside. */
function polynomialOffCircle(draw: Draw, n: number, gap: number): { p: number[]; outside: number } {
  const chosen: { re: number; im: number }[] = [];
  const outsideShare = draw.uniform(0, 1) < 0.35 ? 0 : draw.uniform(0, 0.5);
  while (chosen.length < n) {
    const radius = draw.uniform(0, 1) < outsideShare ? draw.uniform(1 + gap, 2.5) : draw.uniform(0.02, 1 - gap);
    const pair = n - chosen.length >= 2 && draw.uniform(0, 1) < 0.6;
    const angle = pair ? draw.uniform(0.1, Math.PI - 0.1) : draw.uniform(0, 1) < 0.5 ? 0 : Math.PI;
    const z = { re: radius * Math.cos(angle), im: pair ? radius * Math.sin(angle) : 0 };
    if (chosen.some((q) => Math.hypot(q.re - z.re, q.im - z.im) < 0.08)) continue;
    if (pair) chosen.push(z, { re: z.re, im: -z.im });
    else chosen.push(z);
  }
  return { p: polyScale(fromRoots(chosen), draw.sign() * draw.logUniform(-2, 2)), outside: chosen.filter((z) => Math.hypot(z.re, z.im) > 1).length };
}

describe('z-plane stability tests against eigenvalue moduli', () => {
  it('agrees with the companion eigenvalues on whether every root is inside the unit circle: jury(p), routh(bilinear(p)) and the moduli', () => {
    const draw = Draw.seeded(5150);
    let compared = 0;
    let stableCases = 0;
    for (let c = 0; c < 400; c++) {
      const n = draw.integer(1, 14);
      const { p, outside } = polynomialOffCircle(draw, n, 0.03);
      const moduli = companionEigenvalues(p).map((r) => Math.hypot(r.re, r.im));
      const outsideByEigenvalues = moduli.filter((m) => m > 1).length;
      if (outsideByEigenvalues !== outside) continue; // the eigensolver is no reference for this one
      const stable = outside === 0;
      expect(jury(p).isStable, `case ${c}: jury, ${JSON.stringify(p)}`).toBe(stable);
      // z = (1 + w)/(1 − w) maps the inside of the unit circle onto the open left half-plane, so the
      // Routh count of the mapped polynomial is the number of roots outside the circle
      const mapped = routh(bilinear(p));
      expect(mapped.unstableCount, `case ${c}: routh(bilinear(p)), ${JSON.stringify(p)}`).toBe(outside);
      expect(mapped.isStable, `case ${c}`).toBe(stable);
      compared++;
      if (stable) stableCases++;
    }
    expect(compared).toBeGreaterThan(380);
    expect(stableCases).toBeGreaterThan(60);
  });

  it('maps z = 0.5 to w = −1/3 and z = −3 to w = 2 through the bilinear map', () => {
    // z = (1 + w)/(1 − w) ⇔ w = (z − 1)/(z + 1): 0.5 ↦ −1/3 (inside ↦ left half-plane), −3 ↦ 2 (outside ↦ right).
    // By hand: (1 − w)·((1 + w)/(1 − w) − 0.5) = 1 + w − 0.5 + 0.5w = 1.5w + 0.5, root w = −1/3.
    const image = bilinear([1, -0.5]);
    expect(image.length).toBe(2);
    expectClose(-image[1] / image[0], -1 / 3, 1e-15, 0, 'image of z = 0.5');
    // (1 − w)·((1 + w)/(1 − w) + 3) = 1 + w + 3 − 3w = 4 − 2w, root w = 2
    const outside = bilinear([1, 3]);
    expectClose(-outside[1] / outside[0], 2, 1e-15, 0, 'image of z = −3');
  });

  it('calls a polynomial with a root exactly on the unit circle not stable', () => {
    // (z − 1)(z − 0.5) = z² − 1.5z + 0.5 and (z² + 1)(z + 0.5): roots 1 and ±j are on the circle
    expect(jury([1, -1.5, 0.5]).isStable).toBe(false);
    expect(jury(polyMul([1, 0, 1], [1, 0.5])).isStable).toBe(false);
    // (z + 1)(z − 0.2): the root −1 leaves the bilinear image with a lower degree
    expect(jury([1, 0.8, -0.2]).isStable).toBe(false);
  });
});

describe('stable gain range of a z-loop against the Jury conditions worked by hand', () => {
  // G(z) = (z + b)/((z − 1)(z − a)), 0 < a < 1, 0 < b < 1. Closed loop:
  //   P(z) = (z − 1)(z − a) + K(z + b) = z² + (K − 1 − a)z + (a + K b).
  // Jury conditions for a monic quadratic z² + c1 z + c0 (E. I. Jury, "Theory and Application of the
  // z-Transform Method", 1964 — recalled from memory): |c0| < 1, P(1) > 0, P(−1) > 0.
  //   P(1)  = K(1 + b) > 0                 ⇔ K > 0;
  //   P(−1) = 2(1 + a) − K(1 − b) > 0      ⇔ K < 2(1 + a)/(1 − b)   (a root leaves through z = −1);
  //   c0 = a + K b < 1                     ⇔ K < (1 − a)/b          (a pair leaves through e^{±jθ},
  //                                            cos θ = −c1/2 = (1 + a − K)/2).
  // For K < 0, P(1) < 0: never stable.
  const cases = [
    { a: 0.6, b: 0.5, T: 0.05 }, // (1 − a)/b = 0.8 < 2(1.6)/0.5 = 6.4: complex pair on the circle
    { a: 0.2, b: 0.1, T: 0.2 }, //  (1 − a)/b = 8 > 2(1.2)/0.9 = 2.667: real root at z = −1
  ];
  for (const { a, b, T } of cases) {
    it(`is stable exactly for 0 < K < min((1 − a)/b, 2(1 + a)/(1 − b)) with a = ${a}, b = ${b}, and crosses where the hand calculation says`, () => {
      const pairLimit = (1 - a) / b;
      const realLimit = (2 * (1 + a)) / (1 - b);
      const limit = Math.min(pairLimit, realLimit);
      const result = isolatedLocus({ plant: { numerator: [1, b], denominator: polyMul([1, -1], [1, -a]), domain: 'z', sampleTime: T }, includeNegativeGains: true });
      expect(result.stableGainRanges.length).toBe(1);
      expect(result.stableGainRanges[0].from).toBe(0);
      expectClose(result.stableGainRanges[0].to as number, limit, 1e-9, 0, 'upper limit');
      expect(result.negativeStableGainRanges).toEqual([]);
      const here = result.crossings.filter((c) => Math.abs(c.gain - limit) <= 1e-9 * limit);
      expect(here.length).toBeGreaterThan(0);
      for (const c of here) {
        expectClose(Math.hypot(c.point.re, c.point.im), 1, 1e-9, 0, 'crossing on the unit circle');
        if (pairLimit < realLimit) expectClose(c.point.re, (1 + a - limit) / 2, 1e-9, 1e-12, 'cos θ of the crossing');
        else expectClose(c.point.re, -1, 1e-9, 0, 'crossing at z = −1');
      }
    });
  }

  it('gives the zero-order-hold equivalent of 1/(s(s + 1)) the stable range of its closed-form quadratic', () => {
    // With E = e^{−T}: G(z) = (n1 z + n0)/((z − 1)(z − E)), n1 = T − 1 + E, n0 = 1 − E − T E (derived in the
    // zero-order-hold section below). P(z) = z² + (K n1 − 1 − E)z + (E + K n0):
    //   c0 < 1 ⇔ K < (1 − E)/n0;  P(−1) = 2(1 + E) − K(n1 − n0) > 0 ⇔ K < 2(1 + E)/(n1 − n0);  P(1) = K·T(1 − E) > 0.
    for (const T of [0.1, 0.5, 2]) {
      const E = Math.exp(-T);
      const n1 = T - 1 + E;
      const n0 = 1 - E - T * E;
      const limit = Math.min((1 - E) / n0, n1 > n0 ? (2 * (1 + E)) / (n1 - n0) : Infinity);
      const result = isolatedLocus({ plant: { expression: '1/(s*(s+1))', discretize: { sampleTime: T } } });
      expect(result.domain).toBe('z');
      expect(result.stableGainRanges.length, `T = ${T}`).toBe(1);
      expectClose(result.stableGainRanges[0].to as number, limit, 1e-9, 0, `T = ${T}: upper limit`);
    }
  });
});

/** Compares two rational functions b/a given by coefficients, after making both denominators monic. */
function expectSameRational(actual: { numerator: readonly number[]; denominator: readonly number[] }, expected: { numerator: readonly number[]; denominator: readonly number[] }, label: string): void {
  const lead = actual.denominator[0];
  const leadE = expected.denominator[0];
  const den = actual.denominator.map((c) => c / lead);
  const denE = expected.denominator.map((c) => c / leadE);
  expect(den.length, `${label}: denominator degree`).toBe(denE.length);
  const size = Math.max(...denE.map(Math.abs));
  den.forEach((c, i) => expectClose(c, denE[i], 1e-10, 1e-13 * size, `${label}: denominator coefficient ${i}`));
  const length = Math.max(actual.numerator.length, expected.numerator.length);
  const num = polyPad(actual.numerator.map((c) => c / lead), length);
  const numE = polyPad(expected.numerator.map((c) => c / leadE), length);
  const numSize = Math.max(...numE.map(Math.abs));
  num.forEach((c, i) => expectClose(c, numE[i], 1e-10, 1e-12 * numSize, `${label}: numerator coefficient ${i}`));
}

/** Unit-step response of b(z)/a(z) at the samples, by the difference equation (the test's own). */
function sampledStep(numerator: readonly number[], denominator: readonly number[], count: number): number[] {
  const n = denominator.length - 1;
  const b = polyPad(numerator, n + 1);
  const y: number[] = [];
  for (let k = 0; k < count; k++) {
    let acc = 0;
    for (let i = 0; i <= n && i <= k; i++) acc += b[i];
    for (let i = 1; i <= n && i <= k; i++) acc -= denominator[i] * y[k - i];
    y.push(acc / denominator[0]);
  }
  return y;
}

describe('zero-order-hold equivalents against closed forms', () => {
  // Standard results for G(z) = (1 − z⁻¹)·Z{G(s)/s} (G. F. Franklin, J. D. Powell, M. Workman, "Digital
  // Control of Dynamic Systems", 3rd ed., ch. 4, table of ZOH equivalents — recalled from memory):
  //   1/(s + a)  → (1 − e^{−aT}) / (a(z − e^{−aT}))
  //   1/s²       → T²(z + 1) / (2(z − 1)²)
  it('turns 1/(s + a) into (1 − e^{−aT})/(a(z − e^{−aT}))', () => {
    for (const [a, T] of [[2, 0.1], [0.5, 1], [30, 0.01], [1, 3]]) {
      const E = Math.exp(-a * T);
      expectSameRational(zeroOrderHoldEquivalent([1], [1, a], T), { numerator: [(1 - E) / a], denominator: [1, -E] }, `1/(s+${a}), T = ${T}`);
    }
  });

  it('turns 1/s² into T²(z + 1)/(2(z − 1)²)', () => {
    for (const T of [0.01, 0.1, 1, 2.5]) {
      expectSameRational(zeroOrderHoldEquivalent([1], [1, 0, 0], T), { numerator: [T * T / 2, T * T / 2], denominator: [1, -2, 1] }, `1/s², T = ${T}`);
    }
  });

  it('turns 1/(s(s + 1)) into ((T − 1 + e^{−T})z + (1 − e^{−T} − T e^{−T}))/((z − 1)(z − e^{−T}))', () => {
    // 1/(s²(s + 1)) = 1/s² − 1/s + 1/(s + 1), whose z-transform is Tz/(z − 1)² − z/(z − 1) + z/(z − E), E = e^{−T}.
    // Times (z − 1)/z: T/(z − 1) − 1 + (z − 1)/(z − E); over (z − 1)(z − E) the numerator is
    // T(z − E) − (z − 1)(z − E) + (z − 1)² = (T − 1 + E)z + (1 − E − T E).
    for (const T of [0.05, 0.5, 2]) {
      const E = Math.exp(-T);
      const expected = { numerator: [T - 1 + E, 1 - E - T * E], denominator: polyMul([1, -1], [1, -E]) };
      expectSameRational(zeroOrderHoldEquivalent([1], [1, 1, 0], T), expected, `1/(s(s+1)), T = ${T}`);
      expectSameRational(normalizePlant({ expression: '1/(s*(s+1))', discretize: { sampleTime: T } }), expected, `plant 1/(s(s+1)) discretized, T = ${T}`);
    }
  });

  it('delays by whole samples as z^−d times the undelayed equivalent', () => {
    const plants: [number[], number[]][] = [[[1], [1, 2]], [[1], [1, 1, 0]], [[2, 1], [1, 3, 2.5, 0.5]]];
    for (const [num, den] of plants) {
      for (const [T, d] of [[0.1, 1], [0.1, 3], [0.25, 5]]) {
        const plain = zeroOrderHoldEquivalent(num, den, T);
        const delayed = zeroOrderHoldEquivalent(num, den, T, d * T);
        expectSameRational(delayed, { numerator: plain.numerator, denominator: [...plain.denominator, ...new Array<number>(d).fill(0)] }, `${JSON.stringify(num)}/${JSON.stringify(den)}, T = ${T}, d = ${d}`);
      }
    }
  });

  it('reproduces the continuous step response of a plant with fractional dead time at every sampling instant', () => {
    // The held input of a unit step is the unit step itself, so the sampled plant's step response equals
    // the continuous response at t = kT exactly. For a delay τ, with t′ = t − τ (response 0 for t′ < 0):
    //   1/(s + a):          y = (1 − e^{−a t′})/a
    //   1/((s + a)(s + b)): y = (1/(ab))·(1 − (b e^{−a t′} − a e^{−b t′})/(b − a))   (partial fractions)
    //   1/(s(s + 1)):       y = t′ − 1 + e^{−t′}
    const a = 1.5;
    const b = 4;
    const plants: { num: number[]; den: number[]; y: (t: number) => number; label: string }[] = [
      { num: [1], den: [1, a], y: (t) => (1 - Math.exp(-a * t)) / a, label: '1/(s+1.5)' },
      { num: [1], den: polyMul([1, a], [1, b]), y: (t) => (1 - (b * Math.exp(-a * t) - a * Math.exp(-b * t)) / (b - a)) / (a * b), label: '1/((s+1.5)(s+4))' },
      { num: [1], den: [1, 1, 0], y: (t) => t - 1 + Math.exp(-t), label: '1/(s(s+1))' },
    ];
    for (const plant of plants) {
      for (const [T, tau] of [[0.1, 0.037], [0.1, 0.25], [0.5, 1.3], [0.2, 0.6 + 0.2 * 0.999]]) {
        const sampled = zeroOrderHoldEquivalent(plant.num, plant.den, T, tau);
        const count = Math.ceil((tau + 8) / T);
        const y = sampledStep(sampled.numerator, sampled.denominator, count);
        for (let k = 0; k < count; k++) {
          const t = k * T - tau;
          const expected = t <= 0 ? 0 : plant.y(t);
          expectClose(y[k], expected, 1e-9, 1e-11, `${plant.label}, T = ${T}, τ = ${tau}, sample ${k}`);
        }
      }
    }
  });

  it('gives the same sampled plant through a plant with { discretize, deadTime } as the closed form with a fractional delay', () => {
    // 1/(s + a) delayed by τ = dT + θ (modified z-transform, same reference as above, recalled from memory):
    //   G(z) = z^{−d−1}·((1 − e^{−a(T−θ)})z + (e^{−a(T−θ)} − e^{−aT}))/(a(z − e^{−aT})).
    // Check of the numerator from the step response: its first non-zero sample is y((d+1)T) = (1 − e^{−a(T−θ)})/a.
    const a = 2;
    const T = 0.1;
    const d = 2;
    const theta = 0.03;
    const E = Math.exp(-a * T);
    const Ep = Math.exp(-a * (T - theta));
    const expected = { numerator: [(1 - Ep) / a, (Ep - E) / a], denominator: [1, -E, ...new Array<number>(d + 1).fill(0)] };
    expectSameRational(zeroOrderHoldEquivalent([1], [1, a], T, d * T + theta), expected, 'zeroOrderHoldEquivalent');
    expectSameRational(normalizePlant({ numerator: [1], denominator: [1, a], deadTime: d * T + theta, discretize: { sampleTime: T } }), expected, 'normalized plant');
  });
});
