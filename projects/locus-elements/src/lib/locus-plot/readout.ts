import { poleFigures, type Complex, type LocusResult } from '@polewright/locus-core';
import { formatGain } from './features';
import { formatFigure } from './guides';
import type { Frame } from './plot-frame';

/** The locus point nearest to a pixel, interpolated between two traced points. */
export interface LocusHit {
  readonly branch: number;
  readonly gain: number;
  readonly point: Complex;
  /** Distance from the pixel to the point, in pixels. */
  readonly distance: number;
  /** Damping ratio at the point (through s = ln(z)/T in z). */
  readonly dampingRatio: number;
  /** Natural frequency ωn in rad/s; null for a z-point at the origin. */
  readonly naturalFrequency: number | null;
}

/**
 * The nearest point of the locus to the pixel (px, py): each traced segment is projected on in pixel
 * space, and the gain at the foot is interpolated between the segment's two gains (linear in K; the
 * segments are short). Null when the locus is farther than `within` pixels. With `onlyBranch`, only
 * that branch is searched (a drag along a branch stays on it).
 */
export function nearestLocusPoint(result: LocusResult, frame: Frame, px: number, py: number, within = Infinity, onlyBranch?: number): LocusHit | null {
  let best: { branch: number; gain: number; re: number; im: number; d2: number } | null = null;
  result.branches.forEach((branch, index) => {
    if (onlyBranch !== undefined && onlyBranch >= 0 && index !== onlyBranch) return;
    const points = branch.points;
    let ax = frame.x(points[0]?.re ?? 0);
    let ay = frame.y(points[0]?.im ?? 0);
    for (let i = 1; i < points.length; i++) {
      const bx = frame.x(points[i].re);
      const by = frame.y(points[i].im);
      const dx = bx - ax;
      const dy = by - ay;
      const len2 = dx * dx + dy * dy;
      const t = len2 > 0 ? Math.min(1, Math.max(0, ((px - ax) * dx + (py - ay) * dy) / len2)) : 0;
      const fx = ax + t * dx - px;
      const fy = ay + t * dy - py;
      const d2 = fx * fx + fy * fy;
      if (Number.isFinite(d2) && (!best || d2 < best.d2)) {
        const a = points[i - 1];
        const b = points[i];
        best = { branch: index, gain: a.gain + t * (b.gain - a.gain), re: a.re + t * (b.re - a.re), im: a.im + t * (b.im - a.im), d2 };
      }
      ax = bx;
      ay = by;
    }
  });
  const found = best as { branch: number; gain: number; re: number; im: number; d2: number } | null;
  if (!found || Math.sqrt(found.d2) > within) return null;
  const point = { re: found.re, im: found.im };
  const figures = poleFigures(point, result.domain, result.sampleTime);
  return { branch: found.branch, gain: found.gain, point, distance: Math.sqrt(found.d2), dampingRatio: figures.dampingRatio, naturalFrequency: figures.naturalFrequency };
}

/** The read-out line for a hit: gain, damping ratio, natural frequency and the point. */
export function readoutText(hit: LocusHit): string {
  const wn = hit.naturalFrequency === null ? '∞' : formatFigure(hit.naturalFrequency);
  return `K ${formatGain(hit.gain)} · ζ ${formatFigure(Number(hit.dampingRatio.toFixed(3)))} · ωn ${wn} rad/s`;
}
