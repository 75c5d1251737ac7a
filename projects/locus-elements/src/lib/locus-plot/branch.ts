import type { Complex, LocusPoint, LocusResult } from '@polewright/locus-core';
import { line } from 'd3-shape';
import type { Frame } from './plot-frame';

/** A polyline in pixels. */
export type PixelLine = readonly (readonly [number, number])[];

// how far outside the plotting area a polyline is kept (in plotting-area sizes): far enough that the
// clip path hides the cut, near enough that no coordinate grows to where SVG rendering loses precision
const KEEP = 4;

const pathOf = line<readonly [number, number]>()
  .x((p) => p[0])
  .y((p) => p[1]);

/**
 * The SVG path of every branch in a frame: one `d` per branch (sub-paths where a branch leaves and
 * re-enters the kept box around the plotting area).
 */
export function branchPaths(result: LocusResult, frame: Frame): string[] {
  return result.branches.map((branch) => planePath(branch.points, frame));
}

/** The SVG path `d` of a polyline of plane points (any curve: a branch, a guide, a region edge). */
export function planePath(points: readonly Complex[], frame: Frame, closed = false): string {
  const d = pixelPieces(points, frame).map((piece) => pathOf(piece as [number, number][]) ?? '').join('');
  return closed && d ? `${d}Z` : d;
}

/** The branch polyline in pixels, cut into the pieces that lie in the kept box around the plotting area. */
export function pixelPieces(points: readonly Complex[], frame: Frame): PixelLine[] {
  const { left, right, top, bottom } = frame.inner;
  const w = right - left;
  const h = bottom - top;
  const box = { x0: left - KEEP * w, x1: right + KEEP * w, y0: top - KEEP * h, y1: bottom + KEEP * h };
  const pieces: [number, number][][] = [];
  let current: [number, number][] = [];
  for (let i = 1; i < points.length; i++) {
    const a: [number, number] = [frame.x(points[i - 1].re), frame.y(points[i - 1].im)];
    const b: [number, number] = [frame.x(points[i].re), frame.y(points[i].im)];
    const clipped = clipSegment(a, b, box);
    if (!clipped) {
      if (current.length) pieces.push(current);
      current = [];
      continue;
    }
    const [p, q, cutEnd] = clipped;
    if (current.length === 0) current.push(p);
    current.push(q);
    if (cutEnd) {
      pieces.push(current);
      current = [];
    }
  }
  if (current.length > 1) pieces.push(current);
  if (points.length === 1) pieces.push([[frame.x(points[0].re), frame.y(points[0].im)]]);
  return pieces.filter((piece) => piece.length > 1);
}

/**
 * Liang–Barsky clipping of the segment a→b to an axis-aligned box: the kept part and whether its end was
 * cut (the segment leaves the box), or null when nothing of it is inside.
 */
export function clipSegment(
  a: readonly [number, number],
  b: readonly [number, number],
  box: { x0: number; x1: number; y0: number; y1: number },
): [[number, number], [number, number], boolean] | null {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  let t0 = 0;
  let t1 = 1;
  const edges: [number, number][] = [
    [-dx, a[0] - box.x0],
    [dx, box.x1 - a[0]],
    [-dy, a[1] - box.y0],
    [dy, box.y1 - a[1]],
  ];
  for (const [p, q] of edges) {
    if (!Number.isFinite(p) || !Number.isFinite(q)) return null;
    if (p === 0) {
      if (q < 0) return null;
      continue;
    }
    const r = q / p;
    if (p < 0) t0 = Math.max(t0, r);
    else t1 = Math.min(t1, r);
    if (t0 > t1) return null;
  }
  return [[a[0] + t0 * dx, a[1] + t0 * dy], [a[0] + t1 * dx, a[1] + t1 * dy], t1 < 1];
}

/**
 * The point of a branch at gain `gain`, interpolated linearly between the two traced points around it
 * (null outside the traced span). The traced points are close together, so the chord stays within the
 * tracking tolerance of the locus.
 */
export function pointAtGain(points: readonly LocusPoint[], gain: number): Complex | null {
  if (points.length === 0 || gain < points[0].gain || gain > points[points.length - 1].gain) return null;
  let lo = 0;
  let hi = points.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid].gain <= gain) lo = mid;
    else hi = mid;
  }
  const a = points[lo];
  const b = points[hi];
  const t = b.gain === a.gain ? 0 : (gain - a.gain) / (b.gain - a.gain);
  return { re: a.re + t * (b.re - a.re), im: a.im + t * (b.im - a.im) };
}
