import { formatFigure, GUIDE_DAMPING, sPlaneGuides, zPlaneGuides } from './guides';

const view = { minRe: -10, maxRe: 2, minIm: -6, maxIm: 6 };

describe('plane guides', () => {
  it('draws each constant-damping ray of the s-plane through points with that damping ratio', () => {
    // ζ = −Re s / |s| along the ray (the definition; e.g. −3 + 4j has ζ = 0.6)
    for (const g of sPlaneGuides(view).filter((g) => g.kind === 'damping')) {
      const end = g.points[1];
      const zeta = -end.re / Math.hypot(end.re, end.im);
      expect(GUIDE_DAMPING.some((z) => Math.abs(z - zeta) < 1e-12)).toBe(true);
    }
    const ray = sPlaneGuides(view).find((g) => g.label === 'ζ 0.6');
    const end = ray?.points[1] ?? { re: 0, im: 0 };
    expect(end.im / end.re).toBeCloseTo(4 / -3, 12);
  });

  it('draws natural-frequency half-circles in the left half-plane at round radii', () => {
    const arcs = sPlaneGuides(view).filter((g) => g.kind === 'frequency');
    expect(arcs.length).toBeGreaterThan(1);
    for (const arc of arcs) {
      const radius = Math.hypot(arc.points[0].re, arc.points[0].im);
      expect(Number.isInteger(radius) || Number.isInteger(radius * 10)).toBe(true);
      for (const p of arc.points) {
        expect(Math.hypot(p.re, p.im)).toBeCloseTo(radius, 9);
        expect(p.re).toBeLessThanOrEqual(1e-9);
      }
    }
  });

  it('maps the s-plane guides into the z-plane through z = exp(sT)', () => {
    const guides = zPlaneGuides();
    const circle = guides.find((g) => g.kind === 'unit-circle');
    expect(circle?.points.every((p) => Math.abs(Math.hypot(p.re, p.im) - 1) < 1e-12)).toBe(true);
    // a constant-damping spiral: |z| = exp(−ζ·θ/√(1−ζ²)) at angle θ
    const spiral = guides.find((g) => g.label === 'ζ 0.6');
    for (const p of spiral?.points ?? []) {
      const theta = Math.atan2(p.im, p.re);
      if (theta < 0) continue;
      expect(Math.hypot(p.re, p.im)).toBeCloseTo(Math.exp((-0.6 * theta) / 0.8), 9);
    }
    // the ωn·T = π curve runs from z = −1 (φ = π/2) to z = exp(−π) on the real axis (φ = π)
    const last = guides.find((g) => g.label === 'ωn π/T');
    const points = last?.points ?? [];
    expect(points[0].re).toBeCloseTo(-1, 9);
    expect(points[points.length - 1].re).toBeCloseTo(Math.exp(-Math.PI), 9);
    expect(points[points.length - 1].im).toBeCloseTo(0, 9);
  });

  it('writes guide figures with at most three significant digits', () => {
    expect(formatFigure(12.345)).toBe('12.3');
    expect(formatFigure(0.5)).toBe('0.5');
    expect(formatFigure(250000)).toBe('2.5e5');
  });
});
