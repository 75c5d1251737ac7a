import type { GainRange, LocusResult } from '@polewright/locus-core';
import { scaleLog, type ScaleLogarithmic } from 'd3-scale';

/** Positions of the slider: 0 … TRACK_STEPS, logarithmic in the gain. */
export const TRACK_STEPS = 1000;

/** One stretch of the slider track, stable or not, in percent of the track. */
export interface TrackSegment {
  readonly from: number;
  readonly to: number;
  readonly isStable: boolean;
  readonly left: number;
  readonly width: number;
}

/**
 * The gain span the slider covers: from 1/30 of the smallest to 30× the largest gain where something
 * happens (crossing, break point, edge of a stable range), always holding the current gain; a span of
 * six decades around the gain when the locus shows no such gain. `min`/`max` override either end.
 */
export function gainSpanOf(locus: LocusResult | null, gain: number, min?: number, max?: number): { lo: number; hi: number } {
  const marks: number[] = [];
  if (locus) {
    for (const c of locus.crossings) marks.push(c.gain);
    for (const b of locus.breakPoints) marks.push(b.gain);
    for (const r of locus.stableGainRanges) marks.push(r.from, r.to ?? 0);
  }
  const positive = marks.filter((g) => g > 0 && Number.isFinite(g));
  const around = gain > 0 && Number.isFinite(gain) ? gain : 1;
  let lo = positive.length ? Math.min(...positive) / 30 : around / 1e3;
  let hi = positive.length ? Math.max(...positive) * 30 : around * 1e3;
  if (around < lo) lo = around / 3;
  if (around > hi) hi = around * 3;
  if (min !== undefined && min > 0 && Number.isFinite(min)) lo = min;
  if (max !== undefined && max > lo && Number.isFinite(max)) hi = max;
  return { lo, hi };
}

/** The logarithmic map from gain to slider position (clamped to the track). */
export function trackScale(lo: number, hi: number): ScaleLogarithmic<number, number> {
  return scaleLog().domain([lo, hi]).range([0, TRACK_STEPS]).clamp(true);
}

/** The track cut into stable and unstable stretches between `lo` and `hi` (open ranges of the core). */
export function trackSegments(ranges: readonly GainRange[], lo: number, hi: number): TrackSegment[] {
  const scale = trackScale(lo, hi);
  const cuts = [lo, hi];
  for (const r of ranges) {
    if (r.from > lo && r.from < hi) cuts.push(r.from);
    if (r.to !== null && r.to > lo && r.to < hi) cuts.push(r.to);
  }
  cuts.sort((a, b) => a - b);
  const segments: TrackSegment[] = [];
  for (let i = 0; i + 1 < cuts.length; i++) {
    const from = cuts[i];
    const to = cuts[i + 1];
    if (to <= from) continue;
    const middle = Math.sqrt(from * to);
    const isStable = ranges.some((r) => r.from < middle && (r.to === null || middle < r.to));
    const previous = segments[segments.length - 1];
    const left = (scale(from) / TRACK_STEPS) * 100;
    const right = (scale(to) / TRACK_STEPS) * 100;
    if (previous && previous.isStable === isStable) segments[segments.length - 1] = { ...previous, to, width: right - previous.left };
    else segments.push({ from, to, isStable, left, width: right - left });
  }
  return segments;
}

/**
 * Reads a gain typed by the user: a positive finite number (`2.5`, `1e3`, `1,250` with thousands commas).
 * Returns the gain, or the reason it is refused.
 */
export function parseGain(text: string): { gain: number } | { error: string } {
  const cleaned = text.trim().replace(/(\d),(?=\d{3}(\D|$))/g, '$1').replace('−', '-');
  if (cleaned === '') return { error: 'Enter a gain, e.g. 2.5.' };
  const gain = Number(cleaned);
  if (!Number.isFinite(gain)) return { error: `“${text.trim()}” is not a number; enter a gain such as 2.5 or 1e3.` };
  if (gain <= 0) return { error: 'The gain must be above zero on this control (negative gains mean positive feedback).' };
  return { gain };
}
