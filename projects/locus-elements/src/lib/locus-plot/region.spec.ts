import type { Complex } from '@polewright/locus-core';
import { clipToStrip, targetRegion } from './region';

const view = { minRe: -12, maxRe: 2, minIm: -8, maxIm: 8 };
const none = { min: null, max: null };

// even-odd ray casting; enough for the simple outlines the region makes
function inside(polygon: readonly Complex[], p: Complex): boolean {
  let hit = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const a = polygon[i];
    const b = polygon[j];
    if (a.im > p.im !== b.im > p.im && p.re < ((b.re - a.re) * (p.im - a.im)) / (b.im - a.im) + a.re) hit = !hit;
  }
  return hit;
}

describe('target region', () => {
  it('is nothing when the targets constrain nothing', () => {
    expect(targetRegion({ minDampingRatio: null, minDecayRate: null, naturalFrequency: none }, 's', null, view)).toBeNull();
  });

  it('holds the s-plane points meeting a damping ratio and a decay rate, and only those', () => {
    const outline = targetRegion({ minDampingRatio: 0.5, minDecayRate: 1, naturalFrequency: none }, 's', null, view) as Complex[];
    // ζ = 0.6 and decay 3 → in; ζ = 0.316 (−1 + 3j) → out; decay 0.5 → out; right half-plane → out
    expect(inside(outline, { re: -3, im: 4 })).toBe(true);
    expect(inside(outline, { re: -1, im: 3 })).toBe(false);
    expect(inside(outline, { re: -0.5, im: 0 })).toBe(false);
    expect(inside(outline, { re: 1, im: 0 })).toBe(false);
    expect(inside(outline, { re: -8, im: 0 })).toBe(true);
  });

  it('bounds the region by a natural-frequency band', () => {
    const outline = targetRegion({ minDampingRatio: null, minDecayRate: null, naturalFrequency: { min: 2, max: 5 } }, 's', null, view) as Complex[];
    expect(inside(outline, { re: -3, im: 1 })).toBe(true);
    expect(inside(outline, { re: -1, im: 1 })).toBe(false);
    expect(inside(outline, { re: -6, im: 0 })).toBe(false);
  });

  it('maps the region into the z-plane through z = exp(sT), inside the unit circle', () => {
    const T = 0.1;
    const outline = targetRegion({ minDampingRatio: 0.5, minDecayRate: null, naturalFrequency: none }, 'z', T, view) as Complex[];
    expect(outline.every((p) => Math.hypot(p.re, p.im) <= 1 + 1e-9)).toBe(true);
    const z = (s: Complex): Complex => ({ re: Math.exp(s.re * T) * Math.cos(s.im * T), im: Math.exp(s.re * T) * Math.sin(s.im * T) });
    expect(inside(outline, z({ re: -6, im: 4 }))).toBe(true); // ζ ≈ 0.83
    expect(inside(outline, z({ re: -2, im: 9 }))).toBe(false); // ζ ≈ 0.22
  });

  it('clips a polygon to the strip |Im s| ≤ h', () => {
    const square = [
      { re: 0, im: -5 },
      { re: 1, im: -5 },
      { re: 1, im: 5 },
      { re: 0, im: 5 },
    ];
    const clipped = clipToStrip(square, 2);
    expect(Math.max(...clipped.map((p) => Math.abs(p.im)))).toBe(2);
    expect(clipped.length).toBe(4);
  });
});
