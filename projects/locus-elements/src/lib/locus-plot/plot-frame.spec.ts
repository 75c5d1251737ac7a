import { locus } from '@polewright/locus-core';
import { zoomIdentity } from 'd3-zoom';
import { DEMO_PLANTS } from '../../testing/demo-loops';
import { fitExtent, frameOf, MARGIN, unitsPerPixel, visibleExtent } from './plot-frame';

describe('plot frame', () => {
  it('keeps one plane unit the same length on both axes, whatever the shape of the drawing', () => {
    for (const size of [{ width: 900, height: 300 }, { width: 300, height: 700 }]) {
      const frame = frameOf(size, { minRe: -5, maxRe: 1, minIm: -2, maxIm: 2 });
      expect(Math.abs(frame.x(1) - frame.x(0))).toBeCloseTo(Math.abs(frame.y(1) - frame.y(0)), 9);
      const view = visibleExtent(frame);
      // the asked-for extent is inside the view and touches it on one axis
      expect(view.minRe).toBeLessThanOrEqual(-5 + 1e-9);
      expect(view.maxIm).toBeGreaterThanOrEqual(2 - 1e-9);
      expect(Math.min(view.maxRe - 1, view.maxIm - 2)).toBeCloseTo(0, 9);
    }
  });

  it('draws the imaginary axis upwards and keeps the margins for tick labels', () => {
    const frame = frameOf({ width: 640, height: 400 }, { minRe: -1, maxRe: 1, minIm: -1, maxIm: 1 });
    expect(frame.y(1)).toBeLessThan(frame.y(-1));
    expect(frame.inner.left).toBe(MARGIN.left);
    expect(frame.inner.bottom).toBe(400 - MARGIN.bottom);
  });

  it('zooms about the transform and scales the units per pixel by its factor', () => {
    const extent = { minRe: -4, maxRe: 0, minIm: -2, maxIm: 2 };
    const plain = frameOf({ width: 500, height: 400 }, extent);
    const zoomed = frameOf({ width: 500, height: 400 }, extent, zoomIdentity.scale(2));
    expect(unitsPerPixel(zoomed)).toBeCloseTo(unitsPerPixel(plain) / 2, 12);
  });

  it('fits the features of the locus, not its far branch ends', () => {
    const result = locus({ plant: DEMO_PLANTS.beltSpeed });
    const fit = fitExtent(result);
    for (const p of [...result.openLoop.poles, ...result.openLoop.zeros, ...result.crossings.map((c) => c.point)]) {
      expect(p.re).toBeGreaterThan(fit.minRe);
      expect(p.re).toBeLessThan(fit.maxRe);
      expect(Math.abs(p.im)).toBeLessThan(fit.maxIm);
    }
    const farthest = Math.max(...result.branches.map((b) => Math.abs(b.points[b.points.length - 1].im)));
    expect(farthest).toBeGreaterThan(4 * fit.maxIm);
  });

  it('always fits the whole unit circle of a z-plane loop', () => {
    const fit = fitExtent(locus({ plant: DEMO_PLANTS.chargerCurrent }));
    expect(fit.minRe).toBeLessThan(-1);
    expect(fit.maxRe).toBeGreaterThan(1);
    expect(fit.minIm).toBeLessThan(-1);
    expect(fit.maxIm).toBeGreaterThan(1);
  });
});
