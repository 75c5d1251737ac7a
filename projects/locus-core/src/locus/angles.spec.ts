import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import type { Complex } from '../complex/complex';
import type { LocusResult } from '../types/results';
import { departureAndArrivalAngles } from './angles';
import { normalizeDegrees } from './asymptotes';
import { locus } from './locus';

/*
 * Departure and arrival angles follow from the angle condition ∠(K·N(x)/D(x)) = 180° applied next to
 * a complex pole or zero (standard root-locus construction, recalled from memory). Each value below is
 * worked out by hand in a comment and then checked twice: against the engine's formula and against the
 * direction in which the traced branch actually leaves the pole (or reaches the zero).
 */

function angleBetween(a: number, b: number): number {
  return Math.abs(normalizeDegrees(a - b));
}

function directionDeg(from: Complex, to: Complex): number {
  return (Math.atan2(to.im - from.im, to.re - from.re) * 180) / Math.PI;
}

/** Directions (degrees) of the first `count` traced points after gain 0, seen from the pole the branch starts at. */
function leavingDirections(result: LocusResult, pole: Complex, count = 3): number[][] {
  const scale = Math.max(1, Math.hypot(pole.re, pole.im));
  return result.branches
    .filter((b) => Math.hypot(b.points[0].re - pole.re, b.points[0].im - pole.im) <= 1e-6 * scale)
    .map((b) => b.points.slice(1, 1 + count).map((p) => directionDeg(pole, p)));
}

/** Direction (degrees) from the zero to the last traced point of the branch that ends next to it. */
function arrivingDirection(result: LocusResult, zero: Complex): { direction: number; distance: number } {
  const last = result.branches[0].points.length - 1;
  const ends = result.branches.map((b) => b.points[last]);
  const end = ends.reduce((best, p) => (Math.hypot(p.re - zero.re, p.im - zero.im) < Math.hypot(best.re - zero.re, best.im - zero.im) ? p : best));
  return { direction: directionDeg(zero, end), distance: Math.hypot(end.re - zero.re, end.im - zero.im) };
}

function departureAt(result: LocusResult, pole: Complex): number[] {
  return result.departureAngles.filter((d) => Math.hypot(d.pole.re - pole.re, d.pole.im - pole.im) <= 1e-6).map((d) => d.angleDeg);
}

describe('departure angles — low order', () => {
  it('leaves the poles −1 ± j of 1/(s² + 2s + 2) straight up and straight down', () => {
    // s² + 2s + 2 + K = 0 → s = −1 ± j√(1 + K): the pair moves vertically apart
    const result = locus({ plant: { expression: '1/(s^2+2*s+2)' } });
    expect(departureAt(result, { re: -1, im: 1 })).toEqual([90]);
    expect(departureAt(result, { re: -1, im: -1 })).toEqual([-90]);
    for (const d of leavingDirections(result, { re: -1, im: 1 })[0]) expect(angleBetween(d, 90)).toBeLessThanOrEqual(1e-6);
  });

  it('leaves −2 + 4j of K/(s(s + 4)(s² + 4s + 20)) at −90°, matching the traced branch', () => {
    // From −2 + 4j: to the pole 0 the angle is 180° − atan(2) ≈ 116.57°, to −4 it is atan(2) ≈ 63.43°,
    // to −2 − 4j it is 90°; departure = 180° − (116.57° + 63.43° + 90°) = −90° (straight towards the axis).
    const result = locus({ plant: { expression: '1/(s*(s+4)*(s^2+4*s+20))' } });
    expect(departureAt(result, { re: -2, im: 4 })).toHaveLength(1);
    expectClose(departureAt(result, { re: -2, im: 4 })[0], -90, 1e-9);
    expectClose(departureAt(result, { re: -2, im: -4 })[0], 90, 1e-9);
    const traced = leavingDirections(result, { re: -2, im: 4 });
    expect(traced).toHaveLength(1);
    for (const d of traced[0]) expect(angleBetween(d, -90)).toBeLessThanOrEqual(2);
  });

  it('leaves −1 + 3j of (s + 4)/((s + 1)(s² + 2s + 10)) at 45°, matching the traced branch', () => {
    // From −1 + 3j: to the zero −4 the angle is 45°, to the pole −1 it is 90°, to −1 − 3j it is 90°;
    // departure = 180° + 45° − 90° − 90° = 45°.
    const result = locus({ plant: { expression: '(s+4)/((s+1)*(s^2+2*s+10))' } });
    expectClose(departureAt(result, { re: -1, im: 3 })[0], 45, 1e-9);
    expectClose(departureAt(result, { re: -1, im: -3 })[0], -45, 1e-9);
    for (const d of leavingDirections(result, { re: -1, im: 3 })[0]) expect(angleBetween(d, 45)).toBeLessThanOrEqual(2);
    for (const d of leavingDirections(result, { re: -1, im: -3 })[0]) expect(angleBetween(d, -45)).toBeLessThanOrEqual(2);
  });

  it('reports no departure angle for real poles', () => {
    const result = locus({ plant: { expression: '1/(s*(s+1)*(s+2))' } });
    expect(result.departureAngles).toEqual([]);
    expect(result.arrivalAngles).toEqual([]);
  });
});

describe('arrival angles — low order', () => {
  it('reaches the zero −1 + 2j of (s² + 2s + 5)/(s(s + 3)(s + 6)) at about −86.63°, matching the traced branch', () => {
    // At −1 + 2j: to the other zero −1 − 2j the angle is 90°; to the poles 0, −3, −6 it is
    // 180° − atan(2) ≈ 116.565°, 45° and atan(2/5) ≈ 21.801°. Arrival = 180° − 90° + 183.366° = 273.366° ≡ −86.634°.
    const expected = 180 - 90 + (180 - (Math.atan(2) * 180) / Math.PI) + 45 + (Math.atan(0.4) * 180) / Math.PI - 360;
    const result = locus({ plant: { expression: '(s^2+2*s+5)/(s*(s+3)*(s+6))' }, gainRange: { max: 1e7 } });
    const upper = result.arrivalAngles.find((a) => a.zero.im > 0)!;
    expectClose(upper.angleDeg, expected, 1e-9);
    expectClose(result.arrivalAngles.find((a) => a.zero.im < 0)!.angleDeg, -expected, 1e-9);
    const { direction, distance } = arrivingDirection(result, { re: -1, im: 2 });
    expect(distance).toBeLessThanOrEqual(1e-3);
    expect(angleBetween(direction, expected)).toBeLessThanOrEqual(1);
  });
});

describe('departure angles — repeated roots', () => {
  it('gives a double complex pole two departure angles 180° apart: (s² + 2s + 2)² leaves −1 ± j horizontally', () => {
    // (s² + 2s + 2)² + K = 0 → (s + 1)² + 1 = ±j√K → s ≈ −1 ± j ± √K/2 for small K: horizontal moves.
    const result = locus({ plant: { expression: '1/(s^2+2*s+2)^2' } });
    const angles = departureAt(result, { re: -1, im: 1 }).sort((a, b) => a - b);
    expect(angles).toHaveLength(2);
    // a double root is computed only to about √ε, and so are the angles measured from it
    expect(angleBetween(angles[0], 0)).toBeLessThanOrEqual(1e-3);
    expect(angleBetween(angles[1], 180)).toBeLessThanOrEqual(1e-3);
    const traced = leavingDirections(result, { re: -1, im: 1 }, 2);
    expect(traced).toHaveLength(2);
    for (const directions of traced) {
      for (const d of directions) expect(Math.min(angleBetween(d, 0), angleBetween(d, 180))).toBeLessThanOrEqual(3);
    }
  });

  it('splits q angles 360°/q apart at a q-fold complex pole', () => {
    // (s² + 1)³: seen from j the other poles are −j three times (90° each), so the q = 3 angles are
    // (180° − 270° + 360°·l)/3 shifted by whole turns/3: −30°, 90°, 210° ≡ −150°
    const poles: Complex[] = [];
    for (let i = 0; i < 3; i++) poles.push({ re: 0, im: 1 }, { re: 0, im: -1 });
    const angles = departureAndArrivalAngles([1], [1, 0, 3, 0, 3, 0, 1], poles, [])
      .departureAngles.filter((d) => d.pole.im > 0)
      .map((d) => d.angleDeg)
      .sort((a, b) => a - b);
    expect(angles).toEqual([-150, -30, 90]);
  });
});

describe('departure angles — ill-conditioned and high order', () => {
  it('leaves a lightly damped pair next to a nearly cancelling zero pair in the traced direction', () => {
    // poles −0.1 ± 5j, zeros −0.1 ± 5.05j (a notch just above the resonance), and a real pole −2
    const plant = { zeros: [{ re: -0.1, im: 5.05 }, { re: -0.1, im: -5.05 }], poles: [{ re: -0.1, im: 5 }, { re: -0.1, im: -5 }, { re: -2, im: 0 }, { re: -20, im: 0 }], gain: 1 };
    const result = locus({ plant });
    const angle = departureAt(result, { re: -0.1, im: 5 })[0];
    // From −0.1 + 5j: to the zero just above, −90°; to the zero below, 90°; to the pole below, 90°; to −2,
    // atan2(5, 1.9); to −20, atan2(5, 19.9). Departure = 180° + (−90° + 90°) − (90° + both atans).
    const expected = normalizeDegrees(180 + (-90 + 90) - 90 - (Math.atan2(5, 1.9) * 180) / Math.PI - (Math.atan2(5, 19.9) * 180) / Math.PI);
    expectClose(angle, expected, 1e-9);
    for (const d of leavingDirections(result, { re: -0.1, im: 5 })[0]) expect(angleBetween(d, expected)).toBeLessThanOrEqual(3);
  });

  it('matches every departure angle of a 16-pole plant with the traced directions', () => {
    // eight conjugate pairs on an arc of radius 2 in the left half-plane, plus two zeros
    const poles: Complex[] = [];
    for (let k = 0; k < 8; k++) {
      const theta = (Math.PI / 2) * (0.15 + (0.8 * k) / 7);
      poles.push({ re: -2 * Math.cos(theta), im: 2 * Math.sin(theta) }, { re: -2 * Math.cos(theta), im: -2 * Math.sin(theta) });
    }
    const result = locus({ plant: { poles, zeros: [{ re: -0.5, im: 0 }, { re: -3, im: 0 }], gain: 1 } });
    expect(result.departureAngles).toHaveLength(16);
    for (const { pole, angleDeg } of result.departureAngles) {
      const traced = leavingDirections(result, pole);
      expect(traced).toHaveLength(1);
      for (const d of traced[0]) expect(angleBetween(d, angleDeg), `departure from ${pole.re}${pole.im >= 0 ? '+' : ''}${pole.im}j`).toBeLessThanOrEqual(3);
    }
  });
});
