/**
 * Padé approximants against their closed form and the Taylor series of e^{−sT}; closed-loop step
 * responses and figures against the analytic responses of first- and second-order loops; z-pole
 * figures against s = ln(z)/T.
 */
import { describe, expect, it, vi } from 'vitest';
import { closedLoop, normalizePlant, pade, type LocusResult } from '../../projects/locus-core/src/public-api';
import { expectClose } from '../support/tolerance';
import { derivedStableRanges } from './support/hurwitz';
import { locusInSeparateProcess } from './support/isolated';
import { polyEvalComplex, polyMul } from './support/poly';

// locus calls run in a separate process that may have to time out (see support/isolated.ts)
vi.setConfig({ testTimeout: 600_000 });

function factorial(n: number): bigint {
  let f = 1n;
  for (let i = 2n; i <= BigInt(n); i++) f *= i;
  return f;
}

/**
 * Closed form of the [q/q] Padé approximant of e^{−x} (G. A. Baker, P. Graves-Morris, "Padé
 * Approximants", 2nd ed., §1.2 — recalled from memory): Q(x) = Σ c_k x^k, P(x) = Σ (−1)^k c_k x^k,
 * c_k = (2q − k)!·q! / ((2q)!·k!·(q − k)!), computed here exactly in integers, then rounded once.
 */
function padeCoefficient(q: number, k: number): number {
  return ratio(factorial(2 * q - k) * factorial(q), factorial(2 * q) * factorial(k) * factorial(q - k));
}

/** An exact integer ratio as a double (each integer is below 10^60, so both convert with one rounding). */
function ratio(numerator: bigint, denominator: bigint): number {
  return Number(numerator) / Number(denominator);
}

/** Coefficient of x^j in Q(x)·e^{−x} − P(x) and the sum of the magnitudes of its terms. */
function seriesRemainder(q: number, j: number): { value: number; size: number } {
  let value = 0;
  let size = 0;
  for (let k = 0; k <= Math.min(j, q); k++) {
    let term = padeCoefficient(q, k);
    for (let i = 1; i <= j - k; i++) term *= -1 / i; // (−1)^{j−k}/(j − k)!
    value += term;
    size += Math.abs(term);
  }
  if (j <= q) {
    const p = (j % 2 === 0 ? 1 : -1) * padeCoefficient(q, j);
    value -= p;
    size += Math.abs(p);
  }
  return { value, size };
}

describe('Padé approximants of the dead time e^{−sT}', () => {
  it('has the closed-form coefficients c_k·T^k, with alternating signs in the numerator, for orders 1 to 10', () => {
    for (const T of [0.01, 0.3, 1, 4]) {
      for (let q = 1; q <= 10; q++) {
        const approximant = pade(T, q);
        expect(approximant.numerator.length).toBe(q + 1);
        expect(approximant.denominator.length).toBe(q + 1);
        for (let k = 0; k <= q; k++) {
          // highest power first: s^k sits at index q − k
          const c = padeCoefficient(q, k) * T ** k;
          expectClose(approximant.denominator[q - k], c, 1e-13, 0, `denominator s^${k}, q = ${q}, T = ${T}`);
          expectClose(approximant.numerator[q - k], (k % 2 === 0 ? 1 : -1) * c, 1e-13, 0, `numerator s^${k}, q = ${q}, T = ${T}`);
        }
      }
    }
  });

  it('matches the Taylor series of e^{−x} through x^{2q} and not beyond', () => {
    // Q(x)e^{−x} − P(x) = O(x^{2q+1}): its series coefficients vanish for j ≤ 2q
    for (let q = 1; q <= 10; q++) {
      for (let j = 0; j <= 2 * q; j++) {
        const { value, size } = seriesRemainder(q, j);
        expect(Math.abs(value), `q = ${q}, coefficient of x^${j}`).toBeLessThanOrEqual(1e-14 * size);
      }
      const next = seriesRemainder(q, 2 * q + 1);
      // the first non-vanishing coefficient: (q!)²/((2q)!(2q+1)!) in magnitude (the classical error
      // constant of the diagonal approximant, recalled from memory; for q = 1 by hand: e^{−x} − (1 − x/2)/(1 + x/2) = x³/12 + …)
      const constant = ratio(factorial(q) ** 2n, factorial(2 * q) * factorial(2 * q + 1));
      // the coefficient comes out of a cancelling sum: judge it against the size of its terms
      expectClose(Math.abs(next.value), constant, 0, 1e-14 * next.size, `q = ${q}, coefficient of x^${2 * q + 1}`);
      expect(Math.abs(next.value), `q = ${q}: the x^${2 * q + 1} coefficient is not zero`).toBeGreaterThan(1e3 * 1e-14 * next.size);
    }
  });

  it('differs from e^{−sT} at small s by the leading terms of the remainder, numerically', () => {
    // e^{−x} − P(x)/Q(x) = (r₁x^{2q+1} + r₂x^{2q+2} + …)/Q(x) = r₁x^{2q+1} + (r₂ − c₁r₁)x^{2q+2} + O(x^{2q+3})
    // with r₁, r₂ the series coefficients above and Q(x) = 1 + c₁x + …; beyond q = 3 the difference
    // sinks below double-precision rounding of e^{−x} at any x small enough for the expansion.
    for (let q = 1; q <= 3; q++) {
      const T = 0.8;
      const approximant = pade(T, q);
      const r1 = seriesRemainder(q, 2 * q + 1).value;
      const r2 = seriesRemainder(q, 2 * q + 2).value;
      const c1 = padeCoefficient(q, 1);
      for (const x of [0.02 * q, 0.03 * q]) {
        const s = x / T;
        const value = polyEvalComplex(approximant.numerator, s, 0).re / polyEvalComplex(approximant.denominator, s, 0).re;
        const error = Math.exp(-x) - value;
        const predicted = r1 * x ** (2 * q + 1) + (r2 - c1 * r1) * x ** (2 * q + 2);
        expectClose(error, predicted, 0.01, 0, `q = ${q}, x = ${x}`);
      }
    }
  });

  it('is all-pass like the dead time: |P(jω)| = |Q(jω)| at every frequency', () => {
    for (let q = 1; q <= 10; q++) {
      const approximant = pade(0.5, q);
      for (const w of [0.01, 0.7, 3, 40, 1000]) {
        const p = polyEvalComplex(approximant.numerator, 0, w);
        const d = polyEvalComplex(approximant.denominator, 0, w);
        expectClose(Math.hypot(p.re, p.im), Math.hypot(d.re, d.im), 1e-13, 0, `q = ${q}, ω = ${w}`);
      }
    }
  });

  it('puts the order-q approximant into the plant a dead time is given for', () => {
    const T = 0.4;
    const q = 3;
    const plant = normalizePlant({ numerator: [2], denominator: [1, 1], deadTime: T, padeOrder: q });
    const c = (k: number): number => padeCoefficient(q, k) * T ** k;
    const Q = [c(3), c(2), c(1), c(0)];
    const P = [-c(3), c(2), -c(1), c(0)];
    const expectedDen = polyMul([1, 1], Q);
    const expectedNum = polyMul([2], P);
    const lead = expectedDen[0];
    expect(plant.denominator.length).toBe(expectedDen.length);
    plant.denominator.forEach((v, i) => expectClose(v, expectedDen[i] / lead, 1e-12, 0, `denominator ${i}`));
    expect(plant.numerator.length).toBe(expectedNum.length);
    plant.numerator.forEach((v, i) => expectClose(v, expectedNum[i] / lead, 1e-12, 0, `numerator ${i}`));
    expect(plant.warnings.some((w) => w.code === 'dead-time-approximated')).toBe(true);
  });

  for (const [T, q] of [[0.4, 3], [1, 2], [0.25, 5]]) {
    it(`traces 2/(s + 1) with ${T} s of dead time (order-${q} Padé) and finds the stable gains its Hurwitz determinants give`, () => {
      const plant = { numerator: [2], denominator: [1, 1], deadTime: T, padeOrder: q };
      const { numerator, denominator } = normalizePlant(plant);
      const derived = derivedStableRanges(numerator, denominator);
      // run apart: a call that never returns must fail this test, not exhaust the whole run
      const outcome = locusInSeparateProcess({ plant });
      expect(outcome.failure ?? 'returned', 'locus must return').toBe('returned');
      const result = outcome.result as LocusResult;
      expect(result.stableGainRanges.length).toBe(derived.length);
      result.stableGainRanges.forEach((r, i) => {
        expectClose(r.from, derived[i].from, 1e-9, 0, `interval ${i} from`);
        if (derived[i].to === null) expect(r.to).toBeNull();
        else expectClose(r.to as number, derived[i].to as number, 1e-9, 0, `interval ${i} to`);
      });
    });
  }
});

/** Time of the first crossing of `level` by an increasing function on (lo, hi), by bisection. */
function firstCrossing(f: (t: number) => number, level: number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  for (let i = 0; i < 200 && b - a > 1e-15 * b; i++) {
    const m = (a + b) / 2;
    if (f(m) < level) a = m;
    else b = m;
  }
  return (a + b) / 2;
}

describe('closed-loop step response of a second-order loop against the analytic response', () => {
  // K/(s(s + 2ζωn)) with K = ωn² closes to ωn²/(s² + 2ζωn s + ωn²), whose unit-step response is
  //   y(t) = 1 − e^{−ζωn t}(cos ωd t + ζ/√(1 − ζ²)·sin ωd t),  ωd = ωn√(1 − ζ²)
  // with the peak at tp = π/ωd and overshoot 100·exp(−πζ/√(1 − ζ²)) % (standard second-order results,
  // e.g. K. Ogata, "Modern Control Engineering", 5th ed., §5-3 — recalled from memory; they follow from
  // y′(t) = (ωn/√(1 − ζ²))·e^{−ζωn t}·sin ωd t, which is zero first at t = π/ωd).
  const cases = [
    { zeta: 0.15, wn: 2 },
    { zeta: 0.4, wn: 1 },
    { zeta: 0.7, wn: 10 },
  ];
  for (const { zeta, wn } of cases) {
    const root = Math.sqrt(1 - zeta * zeta);
    const wd = wn * root;
    const tp = Math.PI / wd;
    const y = (t: number): number => 1 - Math.exp(-zeta * wn * t) * (Math.cos(wd * t) + (zeta / root) * Math.sin(wd * t));
    // a record of whole multiples of tp, 400 samples per tp, so that a sample falls on the peak
    const periods = Math.ceil(9 / (zeta * wn * tp));
    const step = { duration: periods * tp, points: periods * 400 + 1 };
    const request = { plant: { numerator: [1], denominator: [1, 2 * zeta * wn, 0] }, gain: wn * wn, step };

    it(`follows the analytic step response at every sample for ζ = ${zeta}, ωn = ${wn}`, () => {
      const result = closedLoop(request);
      expect(result.stable).toBe(true);
      const response = result.step;
      expect(response).not.toBeNull();
      if (!response) return;
      expect(response.time.length).toBe(step.points);
      response.time.forEach((t, k) => expectClose(t, (k * step.duration) / (step.points - 1), 1e-12, 1e-15, `time ${k}`));
      response.output.forEach((v, k) => expectClose(v, y(response.time[k]), 1e-9, 1e-9, `sample ${k} at t = ${response.time[k]}`));
    });

    it(`reports overshoot, peak time, final value, rise and settling time of the analytic response for ζ = ${zeta}, ωn = ${wn}`, () => {
      const response = closedLoop(request).step;
      expect(response).not.toBeNull();
      if (!response) return;
      expectClose(response.finalValue as number, 1, 1e-15, 0, 'final value');
      expectClose(response.overshootPct as number, 100 * Math.exp((-Math.PI * zeta) / root), 1e-9, 0, 'overshoot %');
      expectClose(response.peak.time, tp, 1e-9, 0, 'peak time');
      expectClose(response.peak.value, 1 + Math.exp((-Math.PI * zeta) / root), 1e-9, 0, 'peak value');
      // 10–90 % rise time: first crossings of 0.1 and 0.9, which lie before the peak where y rises
      const rise = firstCrossing(y, 0.9, 0, tp) - firstCrossing(y, 0.1, 0, tp);
      expectClose(response.riseTime as number, rise, 1e-5, 0, 'rise time');
      // 2 % settling time: the last time |y − 1| = 0.02. Past t_e, where the envelope
      // e^{−ζωn t}/√(1 − ζ²) is 0.02, the response stays in the band; scan back from there.
      const te = Math.log(0.02 * root) / (-zeta * wn);
      const fine = tp / 4000;
      let t = te;
      while (t > 0 && Math.abs(y(t) - 1) <= 0.02) t -= fine;
      const outside = (u: number): number => -Math.abs(y(u) - 1); // increasing through −0.02 on (t, t + fine)
      const settling = firstCrossing(outside, -0.02, t, t + fine);
      expectClose(response.settlingTime as number, settling, 1e-4, 0, 'settling time');
    });
  }

  it('gives each closed-loop pole the damping ratio and natural frequency it was placed with', () => {
    for (const { zeta, wn } of cases) {
      const result = closedLoop({ plant: { numerator: [1], denominator: [1, 2 * zeta * wn, 0] }, gain: wn * wn });
      expect(result.poles.length).toBe(2);
      for (const p of result.poles) {
        expectClose(p.dampingRatio, zeta, 1e-12, 0, 'ζ');
        expectClose(p.naturalFrequency as number, wn, 1e-12, 0, 'ωn');
        expectClose(p.timeConstant as number, 1 / (zeta * wn), 1e-12, 0, 'τ');
        expect(p.isStable).toBe(true);
      }
    }
  });
});

describe('closed-loop step response of a first-order loop against the analytic response', () => {
  // K/(s + a) closes to K/(s + a + K): y(t) = y∞(1 − e^{−t/τ}), τ = 1/(a + K), y∞ = K/(a + K).
  // 10 % at τ·ln(10/9), 90 % at τ·ln 10: rise time τ·ln 9. |y − y∞| = 0.02·y∞ at e^{−t/τ} = 0.02: settling τ·ln 50.
  for (const [a, K] of [[1, 1], [0.2, 5], [40, 10]]) {
    it(`has rise time ln(9)·τ, settling time ln(50)·τ, no overshoot and the exact samples for K = ${K}, a = ${a}`, () => {
      const tau = 1 / (a + K);
      const final = K / (a + K);
      const step = { duration: 8 * tau, points: 8001 };
      const result = closedLoop({ plant: { numerator: [1], denominator: [1, a] }, gain: K, step });
      const response = result.step;
      expect(response).not.toBeNull();
      if (!response) return;
      response.output.forEach((v, k) => expectClose(v, final * (1 - Math.exp(-response.time[k] / tau)), 1e-9, 1e-12, `sample ${k}`));
      expectClose(response.finalValue as number, final, 1e-14, 0, 'final value');
      expect(response.overshootPct).toBe(0);
      expectClose(response.riseTime as number, Math.log(9) * tau, 1e-6, 0, 'rise time');
      expectClose(response.settlingTime as number, Math.log(50) * tau, 1e-6, 0, 'settling time');
      expectClose(result.poles[0].timeConstant as number, tau, 1e-13, 0, 'pole time constant');
    });
  }
});

describe('figures of z-plane poles through s = ln(z)/T', () => {
  it('recovers the damping ratio, natural frequency and time constant of a pole pair placed at z = e^{sT}', () => {
    // D(z) = z² − 2r cos θ·z, N = 1, K = r²: the closed loop z² − 2r cos θ·z + r² has poles r·e^{±jθ}.
    // With r = e^{−ζωn T}, θ = ωn√(1 − ζ²)·T these are e^{sT} for s = −ζωn ± jωn√(1 − ζ²).
    for (const [zeta, wn, T] of [[0.3, 2, 0.1], [0.6, 10, 0.02], [0.05, 1, 0.5], [0.9, 3, 0.3]]) {
      const r = Math.exp(-zeta * wn * T);
      const theta = wn * Math.sqrt(1 - zeta * zeta) * T;
      expect(theta).toBeLessThan(Math.PI);
      const result = closedLoop({ plant: { numerator: [1], denominator: [1, -2 * r * Math.cos(theta), 0], domain: 'z', sampleTime: T }, gain: r * r });
      expect(result.poles.length).toBe(2);
      for (const p of result.poles) {
        expectClose(Math.hypot(p.re, p.im), r, 1e-12, 0, '|z|');
        expectClose(p.dampingRatio, zeta, 1e-9, 0, `ζ (ζ = ${zeta}, ωn = ${wn}, T = ${T})`);
        expectClose(p.naturalFrequency as number, wn, 1e-9, 0, `ωn (ζ = ${zeta}, ωn = ${wn}, T = ${T})`);
        expectClose(p.timeConstant as number, 1 / (zeta * wn), 1e-9, 0, 'τ');
        expect(p.isStable).toBe(true);
      }
    }
  });

  it('treats real z-poles through the principal logarithm: z = 0.5 is ζ = 1 and z = −0.5 oscillates at the Nyquist frequency', () => {
    const T = 0.1;
    // z = 0.5: s = ln(0.5)/T, real: ζ = 1, ωn = ln 2/T
    const positive = closedLoop({ plant: { numerator: [1], denominator: [1, 0], domain: 'z', sampleTime: T }, gain: -0.5 });
    expectClose(positive.poles[0].re, 0.5, 1e-15, 0, 'pole');
    expectClose(positive.poles[0].dampingRatio, 1, 1e-12, 0, 'ζ at z = 0.5');
    expectClose(positive.poles[0].naturalFrequency as number, Math.log(2) / T, 1e-12, 0, 'ωn at z = 0.5');
    // z = −0.5: s = (ln 0.5 + jπ)/T, ζ = ln 2/√(ln²2 + π²), ωn = √(ln²2 + π²)/T
    const negative = closedLoop({ plant: { numerator: [1], denominator: [1, 0], domain: 'z', sampleTime: T }, gain: 0.5 });
    expectClose(negative.poles[0].re, -0.5, 1e-15, 0, 'pole');
    const modulus = Math.hypot(Math.log(2), Math.PI);
    expectClose(negative.poles[0].dampingRatio, Math.log(2) / modulus, 1e-12, 0, 'ζ at z = −0.5');
    expectClose(negative.poles[0].naturalFrequency as number, modulus / T, 1e-12, 0, 'ωn at z = −0.5');
  });
});
