import type { GainRange } from '@polewright/locus-core';

/** How far the gain may move before the loop changes stability, one direction. */
export interface GainLimit {
  /** The gain at the limit. */
  readonly gain: number;
  /** Factor between the current gain and the limit, ≥ 1. */
  readonly ratio: number;
  /** The same factor in dB (20·log10), ≥ 0. */
  readonly decibels: number;
  /** `up`: the gain may rise by `ratio` (an upper limit); `down`: it may fall by `ratio` (a lower limit). */
  readonly direction: 'up' | 'down';
}

/** Where the current gain stands against the stable gain ranges. */
export interface GainMargins {
  /** Whether the gain lies inside a stable range. */
  readonly isStable: boolean;
  /** The stable range holding the gain, or null. */
  readonly range: GainRange | null;
  /** Stable: the limits of its range (upper first); not stable: the nearest edge of a stable range each way. */
  readonly limits: readonly GainLimit[];
  /** The limit nearest to the gain (smallest ratio), or null when there is none (stable for every K > 0). */
  readonly nearest: GainLimit | null;
}

/**
 * Margins of a positive gain K against the stable ranges: for a stable K the factors by which it may rise
 * to the upper limit or fall to the lower limit of its range (the usual gain margin, and its lower
 * counterpart for a conditionally stable loop); for an unstable K the factor to the nearest stable range.
 * Example: ranges [{from: 0, to: 20}], K = 2 → one limit, up ×10 = 20 dB.
 */
export function gainMargins(ranges: readonly GainRange[], gain: number): GainMargins {
  if (!(gain > 0) || !Number.isFinite(gain)) return { isStable: false, range: null, limits: [], nearest: null };
  const range = ranges.find((r) => r.from < gain && (r.to === null || gain < r.to)) ?? null;
  const limits: GainLimit[] = [];
  if (range) {
    if (range.to !== null) limits.push(limit(range.to, gain));
    if (range.from > 0) limits.push(limit(range.from, gain));
  } else {
    const above = ranges.filter((r) => r.from >= gain).map((r) => r.from);
    const below = ranges.filter((r) => r.to !== null && r.to <= gain).map((r) => r.to as number);
    if (above.length) limits.push(limit(Math.min(...above), gain));
    if (below.length) limits.push(limit(Math.max(...below), gain));
  }
  const nearest = limits.reduce<GainLimit | null>((best, l) => (best === null || l.ratio < best.ratio ? l : best), null);
  return { isStable: range !== null, range, limits, nearest };
}

function limit(at: number, gain: number): GainLimit {
  const ratio = at >= gain ? at / gain : gain / at;
  return { gain: at, ratio, decibels: 20 * Math.log10(ratio), direction: at >= gain ? 'up' : 'down' };
}
