import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import { evaluateComplex } from '../polynomial/evaluate';
import type { LocusResult } from '../types/results';
import { locus } from './locus';
import { characteristic } from './stable-ranges';

/*
 * Stability boundaries below come from the Routh–Hurwitz condition for a cubic s³ + a₂s² + a₁s + a₀
 * (stable iff all aᵢ > 0 and a₂a₁ > a₀; at a₂a₁ = a₀ the roots ±j√a₁ sit on the axis) or from closed-form
 * roots — standard results, recalled from memory.
 */

/**
 * Largest scaled residual |p(x)|/Σ|a_k|r^k of the traced points, p = D + K·N, with r = max(|x|, 1e-12):
 * the modulus floor keeps a point a hair away from an exact root at 0 from counting as wrong.
 */
function worstResidual(result: LocusResult): number {
  const { numerator, denominator } = result.normalizedPlant;
  let worst = 0;
  for (const branch of result.branches) {
    for (const p of branch.points) {
      const poly = characteristic(numerator, denominator, p.gain);
      const r = Math.max(Math.hypot(p.re, p.im), 1e-12);
      const v = evaluateComplex(poly, p);
      worst = Math.max(worst, Math.hypot(v.re, v.im) / poly.reduce((acc, a) => acc * r + Math.abs(a), 0));
    }
  }
  return worst;
}

/** Every crossing lies on the imaginary axis and is a root of D + K·N at its gain (relative to D and K·N). */
function expectCrossingsOnAxis(result: LocusResult): void {
  const { numerator, denominator } = result.normalizedPlant;
  for (const c of result.crossings) {
    expect(Math.abs(c.point.re), `crossing at K = ${c.gain}, x = ${c.point.re}${c.point.im >= 0 ? '+' : ''}${c.point.im}j`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(c.point.im)));
    const d = evaluateComplex(denominator, c.point);
    const n = evaluateComplex(numerator, c.point);
    const modulus = Math.hypot(c.point.re, c.point.im);
    const size = (p: readonly number[]) => p.reduce((a, x) => a * modulus + Math.abs(x), 0);
    expect(Math.hypot(d.re + c.gain * n.re, d.im + c.gain * n.im) / (size(denominator) + Math.abs(c.gain) * size(numerator))).toBeLessThanOrEqual(1e-9);
  }
}

describe('locus — low order', () => {
  it('crosses into the right half-plane of 1/(s(s + 1)(s + 2)) at K = 6 through ±j√2 and is stable below', () => {
    // s³ + 3s² + 2s + K: Routh gives 3·2 > K
    const result = locus({ plant: { expression: '1/(s*(s+1)*(s+2))' } });
    expect(result.branches).toHaveLength(3);
    expect(result.crossings).toHaveLength(2);
    for (const c of result.crossings) {
      expectClose(c.gain, 6, 1e-12);
      expect(Math.abs(c.point.re)).toBeLessThanOrEqual(1e-12);
      expectClose(Math.abs(c.point.im), Math.SQRT2, 1e-12);
    }
    expect(result.stableGainRanges).toHaveLength(1);
    expect(result.stableGainRanges[0].from).toBe(0);
    expectClose(result.stableGainRanges[0].to as number, 6, 1e-12);
    expect(result.gainSpan.max).toBeGreaterThan(6);
  });

  it('reports only the true crossings of 1/(s(s + 1)(s + 5)): K = 30 at ±j√5', () => {
    // s³ + 6s² + 5s + K: 6·5 = 30; above K = 30 the pair stays in the right half-plane, so there is no
    // second crossing
    const result = locus({ plant: { expression: '1/(s*(s+1)*(s+5))' } });
    expectCrossingsOnAxis(result);
    expect(result.crossings.map((c) => c.gain)).toHaveLength(2);
    for (const c of result.crossings) {
      expectClose(c.gain, 30, 1e-12);
      expectClose(Math.abs(c.point.im), Math.sqrt(5), 1e-12);
    }
    expectClose(result.stableGainRanges[0].to as number, 30, 1e-12);
  });

  it('is stable for every K > 0 when the second-order loop 1/(s(s + 2)) can never cross', () => {
    const result = locus({ plant: { expression: '1/(s*(s+2))' } });
    expect(result.stableGainRanges).toEqual([expect.objectContaining({ from: 0, to: null })]);
    expect(result.crossings).toEqual([]);
  });

  it('finds the stable window (3/1.0001, 18.75…) of a loop that is open-loop unstable', () => {
    // (s + 1.0001)/((s + 1)(s + 2)(s + 3)(s − 0.5)): D = s⁴ + 5.5s³ + 8s² + 0.5s − 3, so
    // D + K·N = s⁴ + 5.5s³ + 8s² + (0.5 + K)s + (1.0001K − 3). A real pole crosses at the origin when the
    // constant term vanishes, K = 3/1.0001. The quartic Hurwitz condition a₃a₂a₁ − a₃²a₀ − a₄a₁² > 0 reads
    // 112.5 + 12.746975K − K² > 0 here, so the pair crosses at the positive root of that quadratic.
    const upper = (12.746975 + Math.sqrt(12.746975 ** 2 + 4 * 112.5)) / 2;
    const result = locus({ plant: { expression: '(s+1.0001)/((s+1)*(s+2)*(s+3)*(s-0.5))' } });
    expectCrossingsOnAxis(result);
    expect(result.stableGainRanges).toHaveLength(1);
    expectClose(result.stableGainRanges[0].from, 3 / 1.0001, 1e-12);
    expectClose(result.stableGainRanges[0].to as number, upper, 1e-12);
  });

  it('traces positive feedback too when asked: 1/(s(s + 2)) is unstable for every K < 0', () => {
    // s² + 2s + K has a root in the right half-plane for K < 0
    const result = locus({ plant: { expression: '1/(s*(s+2))' }, includeNegativeGains: true });
    expect(result.gainSpan.min).toBeLessThan(0);
    expect(result.negativeStableGainRanges).toEqual([]);
    const gains = result.branches[0].points.map((p) => p.gain);
    for (let k = 1; k < gains.length; k++) expect(gains[k]).toBeGreaterThan(gains[k - 1]);
    expect(gains).toContain(0);
  });

  it('stops just short of the ill-posed gain of a biproper plant with a negative leading ratio', () => {
    // (1 − s)/(s + 1): D + K·N = (1 − K)s + (1 + K) loses its degree at K = 1
    const result = locus({ plant: { expression: '(1-s)/(s+1)' } });
    expect(result.gainSpan.max).toBeLessThan(1);
    expect(result.warnings.map((w) => w.code)).toContain('ill-posed-gain');
    // the single pole −(1 + K)/(1 − K) runs off to −∞ as K → 1 and is stable on the way
    expect(result.stableGainRanges[0].from).toBe(0);
  });
});

describe('locus — repeated roots', () => {
  it('crosses the axis from the quadruple pole of 1/(s + 1)⁴ at K = 4 through ±j', () => {
    // (s + 1)⁴ = −K → s = −1 + K^(1/4)·e^{±jπ/4}: on the axis when K^(1/4)/√2 = 1, i.e. K = 4, s = ±j
    const result = locus({ plant: { expression: '1/(s+1)^4' } });
    expect(result.branches).toHaveLength(4);
    expect(result.crossings).toHaveLength(2);
    for (const c of result.crossings) {
      expectClose(c.gain, 4, 1e-9);
      expectClose(Math.abs(c.point.im), 1, 1e-9);
    }
    expectClose(result.stableGainRanges[0].to as number, 4, 1e-9);
    expect(worstResidual(result)).toBeLessThanOrEqual(1e-9);
  });
});

describe('locus — ill-conditioned', () => {
  it('finds the crossing of poles spread over six decades, 1/((s + 0.001)(s + 1)(s + 1000))', () => {
    // a₂ = a₁ = 1001.001, a₀ = 1: crossing at K = a₂a₁ − 1, s = ±j√1001.001
    const a = 1001.001;
    const result = locus({ plant: { expression: '1/((s+0.001)*(s+1)*(s+1000))' } });
    expectCrossingsOnAxis(result);
    expect(result.crossings).toHaveLength(2);
    for (const c of result.crossings) {
      expectClose(c.gain, a * a - 1, 1e-12);
      expectClose(Math.abs(c.point.im), Math.sqrt(a), 1e-12);
    }
    expectClose(result.stableGainRanges[0].to as number, a * a - 1, 1e-12);
    expect(worstResidual(result)).toBeLessThanOrEqual(1e-9);
  });

  it('keeps a hidden unstable mode unstable at every gain', () => {
    // (s − 1)/((s − 1)(s + 2)): the factor s − 1 stays in D + K·N for every K
    const result = locus({ plant: { zeros: [{ re: 1, im: 0 }], poles: [{ re: 1, im: 0 }, { re: -2, im: 0 }], gain: 1 } });
    expect(result.stableGainRanges).toEqual([]);
    expect(result.warnings.map((w) => w.code)).toContain('hidden-unstable-mode');
  });
});

describe('locus — high order (degree 40–60)', () => {
  it('traces the 60 poles of (s + 0.5)/(s⁶⁰ + 1): 60 branches, every point a root to 1e-9', () => {
    const result = locus({ plant: { numerator: [1, 0.5], denominator: [1, ...new Array<number>(59).fill(0), 1] } });
    expect(result.branches).toHaveLength(60);
    expect(worstResidual(result)).toBeLessThanOrEqual(1e-9);
    // half of the poles of s⁶⁰ = −1 are in the right half-plane: never stable near K = 0
    expect(result.stableGainRanges.every((r) => r.from > 0)).toBe(true);
  });

  it('traces a 40-pole low-pass prototype (poles evenly on the left unit half-circle): 40 branches, every point a root to 1e-9', () => {
    const poles = Array.from({ length: 40 }, (_, k) => {
      const theta = Math.PI / 2 + (Math.PI * (2 * k + 1)) / 80;
      return { re: Math.cos(theta), im: Math.sin(theta) };
    });
    const result = locus({ plant: { poles, zeros: [], gain: 1 } });
    expect(result.branches).toHaveLength(40);
    expect(worstResidual(result)).toBeLessThanOrEqual(1e-9);
  });

  it('traces 40 real poles packed into [−2, −1]: 40 branches, every point a root to 1e-9', () => {
    const poles = Array.from({ length: 40 }, (_, k) => ({ re: -1 - k / 40, im: 0 }));
    const result = locus({ plant: { poles, zeros: [{ re: -0.5, im: 0 }], gain: 1 } });
    expect(result.branches).toHaveLength(40);
    expect(worstResidual(result)).toBeLessThanOrEqual(1e-9);
  });
});
