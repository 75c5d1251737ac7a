import type { GainPoint } from '@polewright/locus-core';
import { formatFigure } from '../figures/figure-format';

/** One gain at which closed-loop poles reach the stability boundary, with where they cross it. */
export interface CrossingItem {
  readonly gain: number;
  readonly text: string;
}

/**
 * The positive crossing gains of a locus in ascending order, one item per gain (a conjugate pair of
 * crossing points is one crossing), each saying where the poles cross: the imaginary axis at ±jω (s), or
 * the unit circle at angle ±θ (z).
 * Example: a crossing of s = ±1.414j at K = 6 reads 'K = 6: imaginary axis at ±1.414j (ω = 1.414 rad/s)'.
 */
export function crossingItems(crossings: readonly GainPoint[], domain: 's' | 'z'): CrossingItem[] {
  const byGain = new Map<string, GainPoint[]>();
  for (const c of crossings) {
    if (!(c.gain > 0)) continue;
    const key = c.gain.toPrecision(9);
    byGain.set(key, [...(byGain.get(key) ?? []), c]);
  }
  return [...byGain.values()]
    .map((points) => ({ gain: points[0].gain, text: describe(points, domain) }))
    .sort((a, b) => a.gain - b.gain);
}

function describe(points: readonly GainPoint[], domain: 's' | 'z'): string {
  const gain = `K = ${formatFigure(points[0].gain)}`;
  const places = [...new Set(points.map((c) => (domain === 's' ? axisPlace(c) : circlePlace(c))))];
  return `${gain}: ${domain === 's' ? 'imaginary axis' : 'unit circle'} at ${places.join(', ')}`;
}

function axisPlace(c: GainPoint): string {
  const w = Math.abs(c.point.im);
  return w === 0 ? 's = 0' : `±${formatFigure(w)}j (ω = ${formatFigure(w)} rad/s)`;
}

function circlePlace(c: GainPoint): string {
  const angle = Math.abs(Math.atan2(c.point.im, c.point.re));
  if (angle === 0) return 'z = 1';
  if (Math.abs(angle - Math.PI) < 1e-12) return 'z = −1';
  return `angle ±${formatFigure((angle * 180) / Math.PI)}°`;
}
