import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import type { Complex } from '../complex/complex';
import type { DesignRequest, DesignTargets, GainRange } from '../types/results';
import { designGains } from './design-gains';

/*
 * Every returned range is judged here without the engine: the closed-loop poles at a gain are the
 * eigenvalues of the companion matrix of D + K·N (computed with ml-matrix), and their figures are
 * computed from the definitions ζ = −Re s/|s|, σ = −Re s, ωn = |s| (z-poles through s = ln(z)/T).
 * Settling time uses Ts ≈ 4/σ and overshoot ζ = −ln(OS)/√(π² + ln²(OS)) — the standard second-order
 * relations the API documents (recalled from memory, e.g. from Ogata's "Modern Control Engineering").
 */

/** Closed-loop poles: eigenvalues of the companion matrix of the monic polynomial D + K·N. */
function closedLoopPoles(numerator: readonly number[], denominator: readonly number[], gain: number): Complex[] {
  const n = denominator.length - 1;
  const padded = [...new Array<number>(n + 1 - numerator.length).fill(0), ...numerator];
  const c = denominator.map((d, i) => d + gain * padded[i]);
  const companion = Matrix.zeros(n, n);
  for (let j = 0; j < n; j++) companion.set(0, j, -c[j + 1] / c[0]);
  for (let i = 1; i < n; i++) companion.set(i, i - 1, 1);
  const eig = new EigenvalueDecomposition(companion);
  return eig.realEigenvalues.map((re, i) => ({ re, im: eig.imaginaryEigenvalues[i] }));
}

/** The pole as an s-plane value (z-poles through s = ln(z)/T, principal branch). */
function asS(p: Complex, sampleTime: number | null): Complex {
  if (sampleTime === null) return p;
  return { re: Math.log(Math.hypot(p.re, p.im)) / sampleTime, im: Math.atan2(p.im, p.re) / sampleTime };
}

/** Whether every pole is stable and meets the targets, judged from the definitions. */
function meetsTargets(poles: readonly Complex[], targets: DesignTargets, sampleTime: number | null): boolean {
  let zetaMin = targets.minDampingRatio ?? 0;
  if (targets.maxOvershootPct !== undefined) {
    const l = Math.log(targets.maxOvershootPct / 100);
    zetaMin = Math.max(zetaMin, -l / Math.sqrt(Math.PI ** 2 + l * l));
  }
  const sigmaMin = targets.maxSettlingTime !== undefined ? 4 / targets.maxSettlingTime : 0;
  return poles.every((p) => {
    const stable = sampleTime === null ? p.re < 0 : Math.hypot(p.re, p.im) < 1;
    const s = asS(p, sampleTime);
    const wn = Math.hypot(s.re, s.im);
    const zeta = -s.re / wn;
    return (
      stable &&
      zeta >= zetaMin &&
      -s.re >= sigmaMin &&
      wn >= (targets.naturalFrequency?.min ?? 0) &&
      wn <= (targets.naturalFrequency?.max ?? Infinity)
    );
  });
}

/**
 * Inside every range (at its checked gain and at its geometric middle) the targets hold; just outside
 * each finite end (a relative 1e-6 away) they do not.
 */
function expectRangesExact(ranges: readonly GainRange[], plant: { numerator: number[]; denominator: number[] }, targets: DesignTargets, sampleTime: number | null = null): void {
  const judge = (k: number) => meetsTargets(closedLoopPoles(plant.numerator, plant.denominator, k), targets, sampleTime);
  expect(ranges.length).toBeGreaterThan(0);
  for (const r of ranges) {
    const inside = r.to === null ? [2 * Math.max(r.from, 1), r.from * (1 + 1e-6) || 1e-6] : [Math.sqrt(Math.max(r.from, r.to * 1e-6) * r.to), r.to * (1 - 1e-6), r.from > 0 ? r.from * (1 + 1e-6) : r.to * 1e-3];
    if (r.checkedAt !== undefined) inside.push(r.checkedAt);
    for (const k of inside) expect(judge(k), `targets at K = ${k}, inside (${r.from}, ${r.to})`).toBe(true);
    if (r.from > 0) expect(judge(r.from * (1 - 1e-6)), `targets just below ${r.from}`).toBe(false);
    if (r.to !== null) expect(judge(r.to * (1 + 1e-6)), `targets just above ${r.to}`).toBe(false);
  }
}

function design(request: DesignRequest) {
  return designGains(request);
}

describe('designGains — low order, where the boundaries have closed forms', () => {
  // K/(s(s + 2)): s² + 2s + K, complex for K > 1 with ωn = √K and ζ = 1/√K
  const plant = { numerator: [1], denominator: [1, 2, 0] };

  it('keeps ζ ≥ 0.5 on K/(s(s + 2)) exactly for 0 < K < 4 (ζ = 1/√K)', () => {
    const targets = { minDampingRatio: 0.5 };
    const result = design({ plant, targets });
    expect(result.gainRanges).toHaveLength(1);
    expect(result.gainRanges[0].from).toBe(0);
    expectClose(result.gainRanges[0].to as number, 4, 1e-12);
    expectRangesExact(result.gainRanges, plant, targets);
  });

  it('turns 5 % overshoot into ζ ≥ 0.690 and hence K < 1/ζ² ≈ 2.0997 on K/(s(s + 2))', () => {
    const targets = { maxOvershootPct: 5 };
    const result = design({ plant, targets });
    const l = Math.log(0.05);
    const zeta = -l / Math.sqrt(Math.PI ** 2 + l * l);
    expectClose(result.region.minDampingRatio as number, zeta, 1e-12);
    expectClose(result.gainRanges[0].to as number, 1 / zeta ** 2, 1e-10);
    expectRangesExact(result.gainRanges, plant, targets);
  });

  it('keeps ωn within [1.5, 3] rad/s on K/(s(s + 2)) exactly for 2.25 < K < 9', () => {
    // for K > 1, ωn = √K; below K = 1 the slower real pole is slower than 1 rad/s
    const targets = { naturalFrequency: { min: 1.5, max: 3 } };
    const result = design({ plant, targets });
    expect(result.gainRanges).toHaveLength(1);
    expectClose(result.gainRanges[0].from, 2.25, 1e-12);
    expectClose(result.gainRanges[0].to as number, 9, 1e-12);
    expectRangesExact(result.gainRanges, plant, targets);
  });

  it('turns a 4 s settling time into σ ≥ 1 and finds K ≥ 3 on K/(s(s + 4)), unbounded above', () => {
    // s² + 4s + K: for K ≤ 4 the slower pole is −2 + √(4 − K), at most −1 when K ≥ 3; above K = 4, σ = 2
    const targets = { maxSettlingTime: 4 };
    const result = design({ plant: { numerator: [1], denominator: [1, 4, 0] }, targets });
    expectClose(result.region.minDecayRate as number, 1, 1e-15);
    expect(result.gainRanges).toHaveLength(1);
    expectClose(result.gainRanges[0].from, 3, 1e-12);
    expect(result.gainRanges[0].to).toBeNull();
    expectRangesExact(result.gainRanges, { numerator: [1], denominator: [1, 4, 0] }, targets);
  });

  it('intersects two targets: σ ≥ 1 and ζ ≥ 0.5 on K/(s(s + 4)) give 3 < K < 16', () => {
    // ζ = 2/√K ≥ 0.5 ⇔ K ≤ 16
    const targets = { maxSettlingTime: 4, minDampingRatio: 0.5 };
    const result = design({ plant: { numerator: [1], denominator: [1, 4, 0] }, targets });
    expectClose(result.gainRanges[0].from, 3, 1e-12);
    expectClose(result.gainRanges[0].to as number, 16, 1e-12);
    expectRangesExact(result.gainRanges, { numerator: [1], denominator: [1, 4, 0] }, targets);
  });

  it('finds the gain where the locus of K/(s(s + 2)) crosses the ζ = 0.5 line: K = 4', () => {
    const result = design({ plant, dampingLines: [0.5] });
    expect(result.dampingLineGains).toHaveLength(1);
    expect(result.dampingLineGains[0].gains).toHaveLength(1);
    expectClose(result.dampingLineGains[0].gains[0], 4, 1e-12);
  });

  it('returns the stable ranges of the locus alongside the design ranges', () => {
    const result = design({ plant: { numerator: [1], denominator: [1, 3, 2, 0] }, targets: { minDampingRatio: 0.3 } });
    // s³ + 3s² + 2s + K is stable for 0 < K < 6 (Routh: 3·2 > K)
    expect(result.stableGainRanges).toHaveLength(1);
    expectClose(result.stableGainRanges[0].to as number, 6, 1e-12);
    expect(result.caution.length).toBeGreaterThan(0);
  });
});

describe('designGains — third order and beyond (no closed form for the ends)', () => {
  it('judges every pole of K/(s(s + 1)(s + 5)) for ζ ≥ 0.5 and the range ends are where that changes', () => {
    const plant = { numerator: [1], denominator: [1, 6, 5, 0] };
    const targets = { minDampingRatio: 0.5 };
    const result = design({ plant, targets, dampingLines: [0.5] });
    expectRangesExact(result.gainRanges, plant, targets);
    // the damping-line gain is where a pole lies on the ζ = 0.5 ray: check it there
    for (const k of result.dampingLineGains[0].gains) {
      const onRay = closedLoopPoles(plant.numerator, plant.denominator, k).filter((p) => p.im > 0);
      expect(onRay.some((p) => Math.abs(-p.re / Math.hypot(p.re, p.im) - 0.5) <= 1e-9)).toBe(true);
    }
  });

  it('meets every target at once on a fourth-order plant with a zero', () => {
    const plant = { numerator: [1, 3], denominator: [1, 11, 38, 40, 0] }; // (s + 3)/(s(s + 2)(s + 4)(s + 5))
    const targets = { minDampingRatio: 0.4, maxSettlingTime: 8, naturalFrequency: { max: 6 } };
    expectRangesExact(design({ plant, targets }).gainRanges, plant, targets);
  });
});

describe('designGains — repeated roots', () => {
  it('finds the ζ = 0.5 limit of 1/(s + 1)⁴ at K = (√2·√3/(1 + √3))⁴ ≈ 0.6462', () => {
    // (s + 1)⁴ = −K → s = −1 + K^(1/4)·e^{±jπ/4}, ±j3π/4. With a = K^(1/4)/√2, the least damped pole
    // −1 + a + ja has ζ = (1 − a)/√((1 − a)² + a²); ζ = 1/2 ⇔ √3(1 − a) = a ⇔ a = √3/(1 + √3).
    const a = Math.sqrt(3) / (1 + Math.sqrt(3));
    const plant = { numerator: [1], denominator: [1, 4, 6, 4, 1] };
    const targets = { minDampingRatio: 0.5 };
    const result = design({ plant, targets });
    expect(result.gainRanges).toHaveLength(1);
    expectClose(result.gainRanges[0].to as number, (a * Math.SQRT2) ** 4, 1e-9);
    expectRangesExact(result.gainRanges, plant, targets);
  });
});

describe('designGains — sampled-data plants', () => {
  it('judges z-poles through s = ln(z)/T: 0.1/((z − 1)(z − 0.5)), T = 0.1 s, ζ ≥ 0.5', () => {
    const plant = { numerator: [0.1], denominator: [1, -1.5, 0.5] };
    const targets = { minDampingRatio: 0.5 };
    const result = design({ plant: { ...plant, domain: 'z', sampleTime: 0.1 }, targets, dampingLines: [0.5] });
    expectRangesExact(result.gainRanges, plant, targets, 0.1);
    expect(result.dampingLineGains[0].gains).toHaveLength(1);
    // at the damping-line gain the complex pole pair has ζ = 0.5 (to bisection accuracy)
    const k = result.dampingLineGains[0].gains[0];
    const upper = closedLoopPoles(plant.numerator, plant.denominator, k).find((p) => p.im > 0)!;
    const s = asS(upper, 0.1);
    expectClose(-s.re / Math.hypot(s.re, s.im), 0.5, 1e-6);
  });
});

describe('designGains — targets that cannot be met', () => {
  it('returns no range when the targets ask for more damping than the plant ever has', () => {
    // 1/(s² + 0.2s + 100): s² + 0.2s + 100 + K has ζ = 0.1/√(100 + K) < 0.01 for every K ≥ 0
    const result = design({ plant: { numerator: [1], denominator: [1, 0.2, 100] }, targets: { minDampingRatio: 0.5 } });
    expect(result.gainRanges).toEqual([]);
  });
});
