import type { GainRange, LocusResult } from '@polewright/locus-core';
import { pointAtGain } from './branch';
import { featurePoints, formatComplex, formatGain } from './features';
import { groupCoincident } from './markers';

/** The locus as text: the accessible alternative to the drawing. */
export interface LocusTable {
  /** Column headings: one per branch. */
  readonly branches: readonly string[];
  /** One row per sampled gain: the gain and the closed-loop pole on each branch. */
  readonly rows: readonly { readonly gain: string; readonly poles: readonly string[] }[];
  /** Open-loop poles and zeros, asymptotes, break points, crossings — one sentence each. */
  readonly features: readonly string[];
  /** The stable gain ranges as the core certified them, e.g. `0 < K < 16.71`. */
  readonly stableRanges: readonly string[];
}

/** Rows of the table: K = 0 and this many gains spread logarithmically over the interesting span. */
const SAMPLED = 8;

/**
 * The table alternative of a locus: the branches at sampled gains (K = 0, then log-spaced from the
 * smallest traced gain to ten times the largest feature gain, within the traced span), the features
 * and the stable ranges.
 */
export function locusTable(result: LocusResult): LocusTable {
  const gains = sampleGains(result);
  const rows = gains.map((gain) => ({
    gain: formatGain(gain),
    poles: result.branches.map((b) => {
      const p = pointAtGain(b.points, gain);
      return p ? formatComplex(p) : '—';
    }),
  }));
  const features: string[] = [];
  for (const g of groupCoincident(result.openLoop.poles)) features.push(`Open-loop pole${g.count > 1 ? ` (×${g.count})` : ''} at ${formatComplex(g.point)}`);
  for (const g of groupCoincident(result.openLoop.zeros)) features.push(`Open-loop zero${g.count > 1 ? ` (×${g.count})` : ''} at ${formatComplex(g.point)}`);
  if (result.asymptotes) {
    const angles = result.asymptotes.anglesDeg.map((a) => `${Number(a.toFixed(1))}°`).join(', ');
    features.push(`Asymptotes from ${formatComplex({ re: result.asymptotes.centroid, im: 0 })} at ${angles}`);
  }
  for (const f of featurePoints(result)) features.push(f.description);
  return {
    branches: result.branches.map((_, i) => `Branch ${i + 1}`),
    rows,
    features,
    stableRanges: result.stableGainRanges.map(formatRange),
  };
}

/** A gain range as an inequality, e.g. `23.68 < K < 481.2` or `K > 5`. */
export function formatRange(range: GainRange): string {
  if (range.to === null) return range.from === 0 ? 'K > 0' : `K > ${formatGain(range.from)}`;
  return `${formatGain(range.from)} < K < ${formatGain(range.to)}`;
}

/**
 * The smallest positive gain traced on any branch, or null when none is (points run in ascending gain, so
 * each branch's first positive point is its smallest; a loop, not a spread, so long traces cannot overflow).
 */
export function smallestTracedGain(result: LocusResult): number | null {
  let floor = Infinity;
  for (const branch of result.branches) {
    const first = branch.points.find((p) => p.gain > 0);
    if (first && first.gain < floor) floor = first.gain;
  }
  return Number.isFinite(floor) ? floor : null;
}

/** The gains sampled for the table (see `locusTable`), rounded to two significant digits. */
export function sampleGains(result: LocusResult): number[] {
  const floor = smallestTracedGain(result);
  if (floor === null) return [0];
  const featureGains = [...result.breakPoints, ...result.crossings].map((f) => f.gain).filter((g) => g > 0);
  const top = Math.min(result.gainSpan.max, 10 * Math.max(floor * 100, ...featureGains));
  const out = [0];
  const lo = Math.log10(Math.max(floor, top / 1e6));
  const hi = Math.log10(top);
  for (let i = 0; i < SAMPLED; i++) {
    const g = Number((10 ** (lo + ((hi - lo) * i) / (SAMPLED - 1))).toPrecision(2));
    if (g > out[out.length - 1] && g <= result.gainSpan.max) out.push(g);
  }
  return out;
}
