/**
 * Classic worked root-locus examples whose published figures are well known. Each published value is
 * marked "recalled from memory" with its source, and each is re-derived in a comment; the checks use
 * the exact derived values to 1e-9 and the published rounded figures to their printed precision.
 *
 * Every locus call runs in a separate process (see support/isolated.ts) so that an engine call that
 * does not return fails its test instead of the whole run.
 */
import { describe, expect, it, vi } from 'vitest';
import type { Complex, LocusResult } from '../../projects/locus-core/src/public-api';
import { expectClose, expectComplexClose } from '../support/tolerance';
import { locusInSeparateProcess } from './support/isolated';
import { polyFromRealRoots, polyMul } from './support/poly';

// locus calls run in a separate process that may have to time out (see support/isolated.ts)
vi.setConfig({ testTimeout: 600_000 });

const EXACT = 1e-9;

/** The locus of a loop, computed once on first use; every test that needs it fails if it did not return. */
function lazyLocus(numerator: number[], denominator: number[], includeNegativeGains = false): () => LocusResult {
  let outcome: ReturnType<typeof locusInSeparateProcess> | null = null;
  return () => {
    outcome ??= locusInSeparateProcess({ plant: { numerator, denominator }, includeNegativeGains });
    expect(outcome.failure ?? 'returned', 'locus must return').toBe('returned');
    return outcome.result as LocusResult;
  };
}

function nearest<T extends { point: Complex }>(items: readonly T[], target: Complex): T {
  let best = items[0];
  for (const item of items) {
    if (Math.hypot(item.point.re - target.re, item.point.im - target.im) < Math.hypot(best.point.re - target.re, best.point.im - target.im)) best = item;
  }
  return best;
}

describe('K/(s(s + 1)(s + 2)): the textbook third-order type-1 loop', () => {
  // Published figures (K. Ogata, "Modern Control Engineering", 5th ed., ch. 6, the first root-locus
  // example — recalled from memory): asymptotes from −1 at ±60° and 180°; break-away point s ≈ −0.4226
  // with K ≈ 0.3849; imaginary-axis crossing at s = ±j√2 for K = 6; stable for 0 < K < 6.
  // Derivation: D = s³ + 3s² + 2s, N = 1.
  //   centroid (Σp − Σz)/(n − m) = (0 − 1 − 2)/3 = −1; angles (2l + 1)·180°/3 = 60°, 180°, 300° ≡ −60°.
  //   dK/ds = 0 with K = −D(s): 3s² + 6s + 2 = 0, s = −1 ± 1/√3; −1 + 1/√3 ≈ −0.42265 lies on the real-axis
  //   segment (−1, 0); K = −s(s + 1)(s + 2) there = 2/(3√3) ≈ 0.38490 (with s + 1 = 1/√3: −(1/√3 − 1)(1/√3)(1/√3 + 1)
  //   = −(1/3 − 1)/√3 = 2/(3√3)).
  //   Routh: s³ + 3s² + 2s + K is stable iff 3·2 > K; the s² row 3s² + 6 = 0 gives s = ±j√2.
  const locusOf = lazyLocus([1], polyFromRealRoots([0, -1, -2]));

  it('has the asymptote centroid −1 and angles −60°, 60°, 180°', () => {
    const result = locusOf();
    expect(result.asymptotes).not.toBeNull();
    expectClose(result.asymptotes?.centroid as number, -1, EXACT, 0, 'centroid');
    const angles = [...(result.asymptotes?.anglesDeg ?? [])].sort((a, b) => a - b);
    expect(angles.length).toBe(3);
    [-60, 60, 180].forEach((a, i) => expectClose(angles[i], a, EXACT, 0, `angle ${i}`));
  });

  it('breaks away at s = −1 + 1/√3 ≈ −0.4226 with K = 2/(3√3) ≈ 0.3849', () => {
    const result = locusOf();
    const exactPoint = -1 + 1 / Math.sqrt(3);
    const exactGain = 2 / (3 * Math.sqrt(3));
    expectClose(exactPoint, -0.4226, 0, 5e-5, 'derivation agrees with the published point');
    expectClose(exactGain, 0.3849, 0, 5e-5, 'derivation agrees with the published gain');
    const positive = result.breakPoints.filter((b) => b.gain > 0);
    expect(positive.length).toBe(1);
    expectComplexClose(positive[0].point, { re: exactPoint, im: 0 }, EXACT, EXACT, 'break-away point');
    expectClose(positive[0].gain, exactGain, EXACT, 0, 'break-away gain');
    // the other root of dK/ds = 0, −1 − 1/√3, has K < 0 and is not part of the K > 0 locus
    expect(result.breakPoints.some((b) => Math.abs(b.point.re - (-1 - 1 / Math.sqrt(3))) < 1e-6)).toBe(false);
  });

  it('crosses the imaginary axis at s = ±j√2 for K = 6 and is stable exactly for 0 < K < 6', () => {
    const result = locusOf();
    const positive = result.crossings.filter((c) => c.gain > 0);
    expect(positive.length).toBe(2);
    for (const c of positive) {
      expectClose(c.gain, 6, EXACT, 0, 'crossing gain');
      expectComplexClose(c.point, { re: 0, im: Math.sign(c.point.im) * Math.SQRT2 }, EXACT, EXACT, 'crossing point');
    }
    expect(result.stableGainRanges.length).toBe(1);
    expect(result.stableGainRanges[0].from).toBe(0);
    expectClose(result.stableGainRanges[0].to as number, 6, EXACT, 0, 'upper stable gain');
  });
});

describe('K/(s(s + 4)(s² + 4s + 20)): the loop with complex break points', () => {
  // Published figures (K. Ogata, "Modern Control Engineering", 5th ed., ch. 6, example with open-loop
  // poles 0, −4, −2 ± j4 — recalled from memory): asymptotes from −2 at ±45°, ±135°; break points at
  // s = −2 and s = −2 ± j2.45; crossing at s = ±j√10 for K = 260; departure from −2 + j4 at −90°.
  // Derivation: D = (s² + 4s)(s² + 4s + 20) = s⁴ + 8s³ + 36s² + 80s.
  //   centroid (0 − 4 − 2 − 2)/4 = −2; angles (2l + 1)·45°.
  //   dD/ds = 4s³ + 24s² + 72s + 80 = 4(s + 2)(s² + 4s + 10): s = −2, s = −2 ± j√6 (√6 ≈ 2.449).
  //   With u = s² + 4s = (s + 2)² − 4, D = u(u + 20) and K = −D: at s = −2, u = −4, K = 64; at s = −2 ± j√6,
  //   u = −10, K = 100 (real and positive: all four branches meet there; D + 100 = (s² + 4s + 10)²).
  //   Routh: s⁴ + 8s³ + 36s² + 80s + K → s² row [(8·36 − 80)/8, K] = [26, K]; s¹ row (26·80 − 8K)/26 = 0 at
  //   K = 260; 26s² + 260 = 0 gives s = ±j√10.
  //   Departure from −2 + j4: 180° − [∠(−2 + j4) + ∠(2 + j4) + ∠(j8)] = 180° − [116.565° + 63.435° + 90°] = −90°.
  const locusOf = lazyLocus([1], polyMul(polyFromRealRoots([0, -4]), [1, 4, 20]));

  it('has the asymptote centroid −2 and angles ±45°, ±135°', () => {
    const result = locusOf();
    expectClose(result.asymptotes?.centroid as number, -2, EXACT, 0, 'centroid');
    const angles = [...(result.asymptotes?.anglesDeg ?? [])].sort((a, b) => a - b);
    expect(angles.length).toBe(4);
    [-135, -45, 45, 135].forEach((a, i) => expectClose(angles[i], a, EXACT, 0, `angle ${i}`));
  });

  it('has break points at s = −2 (K = 64) and s = −2 ± j√6 (K = 100)', () => {
    const result = locusOf();
    expectClose(Math.sqrt(6), 2.45, 0, 5e-3, 'derivation agrees with the published 2.45');
    const real = nearest(result.breakPoints, { re: -2, im: 0 });
    expectComplexClose(real.point, { re: -2, im: 0 }, EXACT, EXACT, 'real break point');
    expectClose(real.gain, 64, EXACT, 0, 'gain at the real break point');
    for (const sign of [1, -1]) {
      const target = { re: -2, im: sign * Math.sqrt(6) };
      const b = nearest(result.breakPoints, target);
      expectComplexClose(b.point, target, EXACT, EXACT, 'complex break point');
      expectClose(b.gain, 100, EXACT, 0, 'gain at the complex break point');
    }
  });

  it('passes every branch through −2 ± j√6 at K = 100, where D + K·N = (s² + 4s + 10)²', () => {
    const result = locusOf();
    const k = result.branches[0].points.findIndex((p) => Math.abs(p.gain - 100) <= EXACT * 100);
    expect(k).toBeGreaterThan(0);
    for (const branch of result.branches) {
      const p = branch.points[k];
      // a double root of a polynomial known to working precision is found to about √ε
      expectComplexClose({ re: p.re, im: p.im }, { re: -2, im: Math.sign(p.im) * Math.sqrt(6) }, 1e-6, 1e-6, 'branch point at K = 100');
    }
  });

  it('crosses the imaginary axis at s = ±j√10 for K = 260 and is stable exactly for 0 < K < 260', () => {
    const result = locusOf();
    const positive = result.crossings.filter((c) => c.gain > 0);
    expect(positive.length).toBe(2);
    for (const c of positive) {
      expectClose(c.gain, 260, EXACT, 0, 'crossing gain');
      expectComplexClose(c.point, { re: 0, im: Math.sign(c.point.im) * Math.sqrt(10) }, EXACT, EXACT, 'crossing point');
    }
    expect(result.stableGainRanges.length).toBe(1);
    expectClose(result.stableGainRanges[0].to as number, 260, EXACT, 0, 'upper stable gain');
  });

  it('departs from −2 ± j4 at ∓90°', () => {
    const result = locusOf();
    for (const sign of [1, -1]) {
      const departure = nearest(result.departureAngles.map((d) => ({ ...d, point: d.pole })), { re: -2, im: 4 * sign });
      expectComplexClose(departure.pole, { re: -2, im: 4 * sign }, EXACT, EXACT, 'pole');
      expectClose(departure.angleDeg, -90 * sign, EXACT, 0, 'departure angle');
    }
  });
});

describe('K(s + 2)/(s² + 2s + 3): the locus that is a circle', () => {
  // Published figures (K. Ogata, "Modern Control Engineering", 5th ed., ch. 6, example with a zero at −2
  // and poles −1 ± j√2 — recalled from memory): the complex part of the locus is the circle of radius √3
  // about the zero; break-in at s ≈ −3.7320 with K ≈ 5.4641; departure from −1 + j√2 at ≈ 145°.
  // Derivation: with u = s + 2, K = −(s² + 2s + 3)/(s + 2) = −u + 2 − 3/u. Im K = Im u·(3/|u|² − 1) = 0 off the
  //   real axis exactly when |u| = √3: the circle |s + 2| = √3. dK/du = −1 + 3/u² = 0 at u = ±√3; u = −√3
  //   (s = −2 − √3) is on the locus with K = 2 + 2√3; u = +√3 (s = −2 + √3) has K = 2 − 2√3 < 0.
  //   Departure from p = −1 + j√2: 180° + ∠(p + 2) − ∠(p − p̄) = 180° + atan(√2) − 90° = 90° + 54.7356° = 144.7356°.
  const locusOf = lazyLocus([1, 2], [1, 2, 3]);
  const withNegativeGains = lazyLocus([1, 2], [1, 2, 3], true);

  it('keeps every complex point of the locus on the circle |s + 2| = √3', () => {
    const result = locusOf();
    let complexPoints = 0;
    for (const branch of result.branches) {
      for (const p of branch.points) {
        if (Math.abs(p.im) <= 1e-6) continue;
        expectClose(Math.hypot(p.re + 2, p.im), Math.sqrt(3), EXACT, 0, `point at K = ${p.gain}`);
        complexPoints++;
      }
    }
    expect(complexPoints).toBeGreaterThan(20);
  });

  it('breaks in at s = −2 − √3 ≈ −3.7320 with K = 2 + 2√3 ≈ 5.4641, and breaks away at −2 + √3 only for K = 2 − 2√3 < 0', () => {
    const result = locusOf();
    expectClose(-2 - Math.sqrt(3), -3.732, 0, 5e-4, 'derivation agrees with the published point');
    expectClose(2 + 2 * Math.sqrt(3), 5.4641, 0, 5e-5, 'derivation agrees with the published gain');
    expect(result.breakPoints.length).toBe(1);
    expectComplexClose(result.breakPoints[0].point, { re: -2 - Math.sqrt(3), im: 0 }, EXACT, EXACT, 'break-in point');
    expectClose(result.breakPoints[0].gain, 2 + 2 * Math.sqrt(3), EXACT, 0, 'break-in gain');
    const other = nearest(withNegativeGains().breakPoints, { re: -2 + Math.sqrt(3), im: 0 });
    expectComplexClose(other.point, { re: -2 + Math.sqrt(3), im: 0 }, EXACT, EXACT, 'negative-gain break point');
    expectClose(other.gain, 2 - 2 * Math.sqrt(3), EXACT, 0, 'negative-gain break gain');
  });

  it('departs from −1 ± j√2 at ±(90° + atan √2) ≈ ±144.74°', () => {
    const result = locusOf();
    const exact = 90 + (Math.atan(Math.SQRT2) * 180) / Math.PI;
    expectClose(exact, 145, 0, 0.5, 'derivation agrees with the published 145°');
    for (const sign of [1, -1]) {
      const departure = nearest(result.departureAngles.map((d) => ({ ...d, point: d.pole })), { re: -1, im: sign * Math.SQRT2 });
      expectClose(departure.angleDeg, sign * exact, EXACT, 0, 'departure angle');
    }
  });

  it('is stable for every K > 0 (both poles start in the left half-plane and the circle stays there)', () => {
    const result = locusOf();
    expect(result.stableGainRanges).toHaveLength(1);
    expect(result.stableGainRanges[0].from).toBe(0);
    expect(result.stableGainRanges[0].to).toBeNull();
  });
});
