import type { Complex, LocusResult } from '@polewright/locus-core';
import { regionOf } from '@polewright/locus-core';
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import type { ZoomTransform } from 'd3-zoom';

/** A rectangle of the complex plane: real part along x, imaginary part along y. */
export interface Extent {
  readonly minRe: number;
  readonly maxRe: number;
  readonly minIm: number;
  readonly maxIm: number;
}

/** Pixel size of the drawing and the margins kept for tick labels. */
export interface FrameSize {
  readonly width: number;
  readonly height: number;
}

/** The margins (px) around the plotting area: room for the tick labels at the left and bottom. */
export const MARGIN = { top: 10, right: 12, bottom: 26, left: 46 } as const;

/** Scales from the plane to the pixels of the drawing, with one unit the same length on both axes. */
export interface Frame {
  readonly x: ScaleLinear<number, number>;
  readonly y: ScaleLinear<number, number>;
  readonly width: number;
  readonly height: number;
  /** The plotting area in pixels (inside the margins). */
  readonly inner: { readonly left: number; readonly top: number; readonly right: number; readonly bottom: number };
}

/**
 * The part of the plane a "fit" shows: the core's region of interest (open-loop poles and zeros, break
 * points, crossings, the asymptote centroid; the unit circle in z) with a margin around it. Far branch
 * ends (the locus runs to very large gains) are left out on purpose, or the features would shrink to a dot.
 */
export function fitExtent(result: LocusResult): Extent {
  const points: Complex[] = [
    ...result.openLoop.poles,
    ...result.openLoop.zeros,
    ...result.breakPoints.map((b) => b.point),
    ...result.crossings.map((c) => c.point),
  ];
  if (result.asymptotes) points.push({ re: result.asymptotes.centroid, im: 0 });
  if (result.domain === 's') points.push({ re: 0, im: 0 });
  const region = regionOf(points, result.domain);
  let maxIm = 0;
  let minRe = Infinity;
  let maxRe = -Infinity;
  for (const p of points) {
    minRe = Math.min(minRe, p.re);
    maxRe = Math.max(maxRe, p.re);
    maxIm = Math.max(maxIm, Math.abs(p.im));
  }
  if (result.domain === 'z') {
    minRe = Math.min(minRe, -1);
    maxRe = Math.max(maxRe, 1);
    maxIm = Math.max(maxIm, 1);
  }
  const pad = 0.18 * region.scale;
  return { minRe: minRe - pad, maxRe: maxRe + pad, minIm: -maxIm - pad, maxIm: maxIm + pad };
}

/**
 * The frame for a drawing of `size` showing `extent` (centred, the same scale on both axes so that angles
 * and circles keep their shape), after the zoom `transform` when given.
 */
export function frameOf(size: FrameSize, extent: Extent, transform?: ZoomTransform | null): Frame {
  const width = Math.max(size.width, 80);
  const height = Math.max(size.height, 80);
  const inner = { left: MARGIN.left, top: MARGIN.top, right: width - MARGIN.right, bottom: height - MARGIN.bottom };
  const innerWidth = inner.right - inner.left;
  const innerHeight = inner.bottom - inner.top;
  const unitsPerPixel = Math.max((extent.maxRe - extent.minRe) / innerWidth, (extent.maxIm - extent.minIm) / innerHeight) || 1;
  const cx = (extent.minRe + extent.maxRe) / 2;
  const cy = (extent.minIm + extent.maxIm) / 2;
  const halfW = (unitsPerPixel * innerWidth) / 2;
  const halfH = (unitsPerPixel * innerHeight) / 2;
  let x = scaleLinear().domain([cx - halfW, cx + halfW]).range([inner.left, inner.right]);
  let y = scaleLinear().domain([cy - halfH, cy + halfH]).range([inner.bottom, inner.top]);
  if (transform) {
    x = transform.rescaleX(x);
    y = transform.rescaleY(y);
  }
  return { x, y, width, height, inner };
}

/** The plane rectangle visible in a frame. */
export function visibleExtent(frame: Frame): Extent {
  const [re0, re1] = [frame.x.invert(frame.inner.left), frame.x.invert(frame.inner.right)];
  const [im0, im1] = [frame.y.invert(frame.inner.bottom), frame.y.invert(frame.inner.top)];
  return { minRe: Math.min(re0, re1), maxRe: Math.max(re0, re1), minIm: Math.min(im0, im1), maxIm: Math.max(im0, im1) };
}

/** Plane units per pixel in a frame (the same on both axes). */
export function unitsPerPixel(frame: Frame): number {
  return Math.abs(frame.x.invert(1) - frame.x.invert(0));
}

/** A plane point in pixels. */
export function toPixels(frame: Frame, p: Complex): [number, number] {
  return [frame.x(p.re), frame.y(p.im)];
}
