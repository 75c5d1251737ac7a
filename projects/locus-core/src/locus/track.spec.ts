import { afterAll, describe, expect, it } from 'vitest';
import { BoundedCore, describeOutcome } from '../../../../tests/support/bounded-core';
import { expectClose } from '../../../../tests/support/tolerance';
import type { Complex } from '../complex/complex';
import { scaledResidual } from '../polynomial/evaluate';
import { fromRoots } from '../polynomial/from-roots';
import { roots } from '../polynomial/roots';
import { characteristic } from './stable-ranges';
import { trace, type Trace } from './track';

/*
 * Closed forms used (solving the quadratic or the binomial equation by hand):
 *   s² + 2s + 2 + K = 0  →  s = −1 ± j√(1 + K)
 *   s² + 2s + K = 0      →  s = −1 ± √(1 − K)   (real for K ≤ 1, complex beyond)
 *   (s + 1)⁴ + K = 0     →  s = −1 + K^(1/4)·e^{j(2l+1)π/4}
 */

function pointsAt(t: Trace, k: number): Complex[] {
  return Array.from(t.re[k], (re, i) => ({ re, im: t.im[k][i] }));
}

function worstDistance(actual: readonly Complex[], expected: readonly Complex[]): number {
  const free = [...expected];
  let worst = 0;
  for (const a of actual) {
    let best = 0;
    free.forEach((e, j) => {
      if (Math.hypot(e.re - a.re, e.im - a.im) < Math.hypot(free[best].re - a.re, free[best].im - a.im)) best = j;
    });
    worst = Math.max(worst, Math.hypot(free[best].re - a.re, free[best].im - a.im));
    free.splice(best, 1);
  }
  return worst;
}

/** No branch's new point is farther from its old point than another branch's new point (1e-9 slack). */
function expectNoSwaps(t: Trace): void {
  for (let k = 0; k + 1 < t.gains.length; k++) {
    const a = pointsAt(t, k);
    const b = pointsAt(t, k + 1);
    a.forEach((p, i) => {
      const own = Math.hypot(b[i].re - p.re, b[i].im - p.im);
      b.forEach((q, j) => {
        if (j !== i && Math.hypot(a[j].re - p.re, a[j].im - p.im) > 1e-9) expect(own).toBeLessThanOrEqual(Math.hypot(q.re - p.re, q.im - p.im) + 1e-9);
      });
    });
  }
}

describe('trace — low order', () => {
  it('follows s² + 2s + 2 + K exactly: every point is −1 ± j√(1 + K)', () => {
    const d = [1, 2, 2];
    const t = trace([1], d, roots(d), 50, [], { scale: 2, center: -1, gainScale: 1 });
    expect(t.gains[0]).toBe(0);
    expect(t.gains[t.gains.length - 1]).toBe(50);
    t.gains.forEach((g, k) => {
      const expected = [{ re: -1, im: Math.sqrt(1 + g) }, { re: -1, im: -Math.sqrt(1 + g) }];
      expect(worstDistance(pointsAt(t, k), expected)).toBeLessThanOrEqual(1e-12 * Math.sqrt(1 + g));
    });
    // each branch stays in its own half-plane
    for (let k = 0; k < t.gains.length; k++) expect(Math.sign(t.im[k][0])).toBe(Math.sign(t.im[0][0]));
  });

  it('passes through the break-away point of 1/(s(s + 2)) at K = 1 and lands on it exactly', () => {
    const d = [1, 2, 0];
    const t = trace([1], d, roots(d), 10, [1], { scale: 2, center: -1, gainScale: 1 });
    const k1 = t.gains.indexOf(1);
    expect(k1).toBeGreaterThan(0);
    // at K = 1 both branches sit on the double root −1 (to about √ε)
    for (const p of pointsAt(t, k1)) expect(Math.hypot(p.re + 1, p.im)).toBeLessThanOrEqual(1e-7);
    t.gains.forEach((g, k) => {
      const r = Math.sqrt(Math.abs(1 - g));
      const expected = g <= 1 ? [{ re: -1 + r, im: 0 }, { re: -1 - r, im: 0 }] : [{ re: -1, im: r }, { re: -1, im: -r }];
      // near K = 1 the roots are √(1 − K)-sensitive; elsewhere they are exact to rounding
      expect(worstDistance(pointsAt(t, k), expected)).toBeLessThanOrEqual(1e-7);
    });
    expectNoSwaps(t);
  });

  it('lands exactly on every waypoint inside the span and ignores those outside it', () => {
    const d = [1, 3, 2];
    const waypoints = [0.37, 2.5, 2.5, 7, 40, -3, 0];
    const t = trace([1], d, roots(d), 20, waypoints, { scale: 2, center: -1.5, gainScale: 1 });
    for (const w of [0.37, 2.5, 7]) expect(t.gains.filter((g) => g === w)).toHaveLength(1);
    expect(t.gains.includes(40)).toBe(false);
    expect(t.gains.includes(-3)).toBe(false);
    for (let k = 1; k < t.gains.length; k++) expect(t.gains[k]).toBeGreaterThan(t.gains[k - 1]);
  });

  it('traces negative gains when the end gain is negative: s² + 2s + K has the real roots −1 ± √(1 − K)', () => {
    const d = [1, 2, 0];
    const t = trace([1], d, roots(d), -3, [-1.5], { scale: 2, center: -1, gainScale: 1 });
    expect(t.gains[t.gains.length - 1]).toBe(-3);
    expect(t.gains).toContain(-1.5);
    for (let k = 1; k < t.gains.length; k++) expect(t.gains[k]).toBeLessThan(t.gains[k - 1]);
    t.gains.forEach((g, k) => {
      const r = Math.sqrt(1 - g);
      expect(worstDistance(pointsAt(t, k), [{ re: -1 + r, im: 0 }, { re: -1 - r, im: 0 }])).toBeLessThanOrEqual(1e-12 * (1 + r));
    });
  });
});

describe('trace — repeated roots', () => {
  it('fans out of the quadruple pole of 1/(s + 1)⁴ along the four diagonals, |s + 1| = K^(1/4)', () => {
    const d = [1, 4, 6, 4, 1];
    const t = trace([1], d, roots(d), 16, [], { scale: 2, center: -1, gainScale: 1 });
    expect(t.gains[t.gains.length - 1]).toBe(16);
    t.gains.forEach((g, k) => {
      if (g === 0) return;
      for (const p of pointsAt(t, k)) {
        // the start is only known to ε^(1/4) (see roots.spec); a perturbation δ of the constant term moves
        // each root by about δ/(4K^(3/4)), so the radius is exact to well below 1e-3 once K is not tiny
        expect(Math.abs(Math.hypot(p.re + 1, p.im) - g ** 0.25)).toBeLessThanOrEqual(1e-3);
        if (g > 1e-4) {
          const direction = (Math.atan2(p.im, p.re + 1) * 180) / Math.PI;
          expect(Math.min(...[45, 135, -45, -135].map((a) => Math.abs(direction - a)))).toBeLessThanOrEqual(1);
        }
      }
      expect(scaledResidual(characteristic([1], d, g), pointsAt(t, k)[0])).toBeLessThanOrEqual(1e-9);
    });
    // at the end the four branches are on four different diagonals
    const last = pointsAt(t, t.gains.length - 1).map((p) => Math.round((Math.atan2(p.im, p.re + 1) * 180) / Math.PI / 45));
    expect(new Set(last).size).toBe(4);
  });
});

describe('trace — ill-conditioned', () => {
  const core = new BoundedCore({ heapMb: 32 });
  afterAll(() => core.close());

  it('finishes when two waypoints differ by one unit in the last place (they map to the same path position)', async () => {
    // Crossing gains of a conjugate pair of crossing points are computed separately and can differ in the
    // last bit; asinh(K/K₀) maps such neighbours to the same double, so the step between them is 0.
    const a = 1e6;
    const b = a + 2 ** -33; // the next double after 1e6 (its spacing there is 2^−33 ≈ 1.16e-10)
    expect(b).toBeGreaterThan(a);
    const outcome = await core.call('trace', [[1], [1, 3, 2], roots([1, 3, 2]), 1e7, [a, b], { scale: 2, center: -1.5, gainScale: 1 }]);
    if (outcome.kind !== 'result') throw new Error(`trace with waypoints ${a} and ${b}: ${describeOutcome(outcome)}`);
    const t = outcome.value as Trace;
    expect(t.gains[t.gains.length - 1]).toBe(1e7);
    expect(t.gains).toContain(a);
    for (let k = 1; k < t.gains.length; k++) expect(t.gains[k]).toBeGreaterThanOrEqual(t.gains[k - 1]);
  });

  it('keeps two poles 1e-6 apart on their own branches through their break-away point', () => {
    // (s + 1)(s + 1 + 1e-6) + K: break-away at −1 − 5e-7 with K = (5e-7)² = 2.5e-13
    const d = fromRoots([{ re: -1, im: 0 }, { re: -1 - 1e-6, im: 0 }]);
    const t = trace([1], d, roots(d), 4, [2.5e-13], { scale: 1, center: -1, gainScale: 1e-12 });
    t.gains.forEach((g, k) => {
      for (const p of pointsAt(t, k)) expect(scaledResidual(characteristic([1], d, g), p)).toBeLessThanOrEqual(1e-9);
    });
    const end = pointsAt(t, t.gains.length - 1);
    // K = 4: s ≈ −1 − 5e-7 ± j·√(4 − 2.5e-13) ≈ −1 ± 2j
    expect(worstDistance(end, [{ re: -1, im: 2 }, { re: -1, im: -2 }])).toBeLessThanOrEqual(1e-6);
  });
});

describe('trace — high order', () => {
  it('traces all 50 roots of a 50-pole plant with two zeros, every point a root to backward error 1e-9', () => {
    const poles: Complex[] = [];
    for (let k = 0; k < 25; k++) {
      const theta = (Math.PI / 2) * (0.05 + (0.9 * k) / 24);
      const radius = 1 + 0.02 * k;
      poles.push({ re: -radius * Math.cos(theta), im: radius * Math.sin(theta) }, { re: -radius * Math.cos(theta), im: -radius * Math.sin(theta) });
    }
    const d = fromRoots(poles);
    const n = fromRoots([{ re: -0.3, im: 0 }, { re: -2, im: 0 }]);
    const t = trace(n, d, roots(d), 100, [], { scale: 3, center: -0.8, gainScale: 0.01 });
    expect(t.re[0]).toHaveLength(50);
    expect(t.gains[t.gains.length - 1]).toBe(100);
    t.gains.forEach((g, k) => {
      const c = characteristic(n, d, g);
      for (const p of pointsAt(t, k)) expect(scaledResidual(c, p)).toBeLessThanOrEqual(1e-9);
    });
  });
});
