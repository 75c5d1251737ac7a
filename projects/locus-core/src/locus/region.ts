import type { Complex } from '../complex/complex';
import { evaluateComplex } from '../polynomial/evaluate';
import type { Polynomial } from '../polynomial/polynomial';
import type { Domain } from '../types/plant';

/** The part of the plane where the locus is interesting: a real centre and a size. */
export interface Region {
  readonly center: number;
  readonly scale: number;
}

/**
 * Region spanned by the open-loop poles and zeros and the other finite features (break points, axis
 * crossings, asymptote centroid); the unit circle is always part of a z-plane region.
 */
export function regionOf(points: readonly Complex[], domain: Domain): Region {
  const all = domain === 'z' ? [...points, { re: 1, im: 0 }, { re: -1, im: 0 }, { re: 0, im: 1 }] : [...points];
  const finite = all.filter((p) => Number.isFinite(p.re) && Number.isFinite(p.im));
  if (finite.length === 0) return { center: 0, scale: 1 };
  let minRe = Infinity, maxRe = -Infinity, maxIm = 0;
  for (const p of finite) {
    minRe = Math.min(minRe, p.re);
    maxRe = Math.max(maxRe, p.re);
    maxIm = Math.max(maxIm, Math.abs(p.im));
  }
  const center = (minRe + maxRe) / 2;
  let scale = Math.max(maxRe - minRe, 2 * maxIm);
  if (!(scale > 0)) scale = Math.max(Math.abs(center), 1);
  return { center, scale };
}

/**
 * A gain scale K₀ for the loop: |D(x)/N(x)| at a point one region size above the centre, i.e. the gain
 * at which the loop gain magnitude is 1 there. Falls back to 1 when that is not a positive finite number.
 */
export function gainScaleOf(numerator: Polynomial, denominator: Polynomial, region: Region): number {
  const x = { re: region.center, im: region.scale };
  const d = evaluateComplex(denominator, x);
  const n = evaluateComplex(numerator, x);
  const k = Math.hypot(d.re, d.im) / Math.hypot(n.re, n.im);
  return Number.isFinite(k) && k > 0 ? k : 1;
}
