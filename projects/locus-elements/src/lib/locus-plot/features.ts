import type { Complex, LocusResult } from '@polewright/locus-core';
import { formatFigure } from './guides';
import type { Extent } from './plot-frame';

/** A marked point of the locus with the gain at which it happens. */
export interface FeaturePoint {
  readonly kind: 'break' | 'crossing';
  readonly point: Complex;
  readonly gain: number;
  /** Text drawn beside the mark (empty for the lower member of a conjugate pair). */
  readonly label: string;
  /** Sentence for the accessible name and the data table. */
  readonly description: string;
}

/** An asymptote: a ray from the centroid on the real axis at its angle. */
export interface Asymptote {
  readonly angleDeg: number;
  readonly points: readonly [Complex, Complex];
}

/** A gain for display: four significant digits, exponent form when very large or small. */
export function formatGain(gain: number): string {
  if (gain === 0) return '0';
  const abs = Math.abs(gain);
  if (abs >= 1e5 || abs < 1e-3) return gain.toExponential(2).replace('e+', 'e');
  return String(Number(gain.toPrecision(4)));
}

/** A complex value for display, e.g. `−1.6 + 7.03j`. */
export function formatComplex(p: Complex): string {
  const re = formatFigure(p.re);
  if (Math.abs(p.im) < 1e-12 * Math.max(1, Math.abs(p.re))) return re;
  const im = formatFigure(Math.abs(p.im));
  return `${re} ${p.im < 0 ? '−' : '+'} ${im}j`;
}

/**
 * The asymptotes of the locus (where the far branches go as K grows): rays from the centroid σ on the
 * real axis at the core's angles, long enough to leave the view.
 */
export function asymptoteRays(result: LocusResult, view: Extent): Asymptote[] {
  const a = result.asymptotes;
  if (!a) return [];
  const reach = 3 * Math.max(view.maxRe - view.minRe, view.maxIm - view.minIm) + Math.abs(a.centroid);
  return a.anglesDeg.map((angleDeg) => {
    const t = (angleDeg * Math.PI) / 180;
    return { angleDeg, points: [{ re: a.centroid, im: 0 }, { re: a.centroid + reach * Math.cos(t), im: reach * Math.sin(t) }] as const };
  });
}

/**
 * Break points (branches meet and leave the real axis) and crossings of the stability boundary (the
 * imaginary axis in s, the unit circle in z), each with its gain. Break points at K = 0 (multiple open-loop
 * poles) are left out: the pole mark already shows them. Of a conjugate pair only the upper one is labelled.
 */
export function featurePoints(result: LocusResult): FeaturePoint[] {
  const boundary = result.domain === 's' ? 'imaginary axis' : 'unit circle';
  const out: FeaturePoint[] = [];
  for (const b of result.breakPoints) {
    if (!(b.gain > 0)) continue;
    out.push({ kind: 'break', point: b.point, gain: b.gain, label: `K ${formatGain(b.gain)}`, description: `Break point at ${formatComplex(b.point)}, K = ${formatGain(b.gain)}` });
  }
  for (const c of result.crossings) {
    const lower = c.point.im < -1e-12;
    out.push({
      kind: 'crossing',
      point: c.point,
      gain: c.gain,
      label: lower ? '' : `K ${formatGain(c.gain)}`,
      description: `Crosses the ${boundary} at ${formatComplex(c.point)}, K = ${formatGain(c.gain)}`,
    });
  }
  return out;
}
