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
 * A gain scale K₀ for the loop: the smallest gain that moves an open-loop pole by about 5 % of the
 * region size — min over poles p and a few directions of |D(x)/N(x)| at x = p + 0.05·size·e^{jθ}
 * (near a pole, D(x) + K·N(x) = 0 puts a root at x exactly when K = −D(x)/N(x)). Below K₀ the path is
 * traced linearly in K, above it logarithmically. Falls back to |D/N| one region size above the centre,
 * and to 1, when those are not positive finite numbers.
 */
export function gainScaleOf(numerator: Polynomial, denominator: Polynomial, region: Region, poles: readonly Complex[] = []): number {
  const radius = 0.05 * region.scale;
  let best = Infinity;
  for (const p of poles) {
    if (p.im < 0) continue;
    for (const theta of [0.3, 1.9, 3.5, 5.1]) {
      const x = { re: p.re + radius * Math.cos(theta), im: p.im + radius * Math.sin(theta) };
      const k = ratio(numerator, denominator, x);
      if (k > 0 && k < best) best = k;
    }
  }
  if (Number.isFinite(best)) return best;
  const k = ratio(numerator, denominator, { re: region.center, im: region.scale });
  return k > 0 && Number.isFinite(k) ? k : 1;
}

function ratio(numerator: Polynomial, denominator: Polynomial, x: Complex): number {
  const d = evaluateComplex(denominator, x);
  const n = evaluateComplex(numerator, x);
  const k = Math.hypot(d.re, d.im) / Math.hypot(n.re, n.im);
  return Number.isFinite(k) ? k : NaN;
}
