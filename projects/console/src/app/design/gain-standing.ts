import type { GainRange } from '@polewright/locus-core';

/** How far the gain may move before the loop's stability changes, towards the nearest limit. */
export interface NearestLimit {
  /** The gain at the limit. */
  readonly gain: number;
  /** Factor between the current gain and the limit, ≥ 1. */
  readonly ratio: number;
  /** The same factor in dB (20·log10). */
  readonly decibels: number;
  /** `up`: the limit lies above the gain; `down`: below. */
  readonly direction: 'up' | 'down';
}

/**
 * The limit of stability nearest to a gain K > 0, by factor, from the engine's exact stable ranges: for a
 * stable K the nearer end of its range (the usual gain margin, or its lower counterpart for a conditionally
 * stable loop); for an unstable K the nearest end of a stable range. Null when there is none (stable for
 * every K > 0, or never stable). The elements' stability summary computes the same figures for its list.
 * Example: ranges [{from: 0, to: 20}], K = 2 → up ×10 = 20 dB to K = 20.
 */
export function nearestLimit(ranges: readonly GainRange[], gain: number): NearestLimit | null {
  if (!(gain > 0) || !Number.isFinite(gain)) return null;
  const inside = ranges.find((r) => r.from < gain && (r.to === null || gain < r.to));
  const edges = inside ? [inside.from, inside.to] : ranges.flatMap((r) => [r.from, r.to]);
  let best: NearestLimit | null = null;
  for (const edge of edges) {
    if (edge === null || !(edge > 0)) continue;
    const ratio = edge >= gain ? edge / gain : gain / edge;
    if (best === null || ratio < best.ratio) best = { gain: edge, ratio, decibels: 20 * Math.log10(ratio), direction: edge >= gain ? 'up' : 'down' };
  }
  return best;
}
