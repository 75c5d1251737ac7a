import type { DesignTargets, Schemas } from '../api/api-types';
import { bindingTargets, normalizedLoop, type Binding } from './binding-targets';
import { formatFigure } from './compensator-rows';

/** One feasible gain range as the ranges table shows it. */
export interface RangeRow {
  readonly from: number;
  readonly to: number | null;
  readonly fromText: string;
  readonly toText: string;
  /** What binds at the lower end (empty at K = 0). */
  readonly lower: readonly Binding[];
  /** What binds at the upper end (empty when unbounded). */
  readonly upper: readonly Binding[];
  /** The gain a click on the row sets. */
  readonly suggested: number;
  readonly suggestedText: string;
  /** How the suggestion was chosen, in words. */
  readonly rule: string;
}

/** Ways a suggestion is placed inside a range, in words (shown under the table). */
export const SUGGESTION_RULES = {
  middle: 'geometric middle √(from·to): the same factor (and dB) of room to either end',
  belowTop: 'half the upper end: 6 dB of room below it',
  aboveBottom: 'twice the lower end: 6 dB of room above it',
  any: 'every positive gain qualifies: the current gain is kept',
} as const;

/**
 * The gain to suggest inside an open range (from, to): the geometric middle of a bounded range, half the
 * upper end of a range from 0, twice the lower end of an unbounded one; for (0, ∞) the current gain (or 1).
 * Rounded to the fewest significant digits (≥ 4) that keep it inside the range.
 * Example: (82.39, 121.1) → 99.89.
 */
export function suggestedGain(from: number, to: number | null, current: number): { gain: number; rule: string } {
  let raw: number;
  let rule: string;
  if (from > 0 && to !== null) [raw, rule] = [Math.sqrt(from * to), SUGGESTION_RULES.middle];
  else if (to !== null) [raw, rule] = [to / 2, SUGGESTION_RULES.belowTop];
  else if (from > 0) [raw, rule] = [2 * from, SUGGESTION_RULES.aboveBottom];
  else [raw, rule] = [current > 0 && Number.isFinite(current) ? current : 1, SUGGESTION_RULES.any];
  return { gain: roundInside(raw, from, to), rule };
}

function roundInside(value: number, from: number, to: number | null): number {
  for (let digits = 4; digits <= 15; digits++) {
    const rounded = Number(value.toPrecision(digits));
    if (rounded > from && (to === null || rounded < to)) return rounded;
  }
  return value;
}

/**
 * The rows of the feasible-ranges table from a design request and its result: each range with what binds
 * at its ends (judged on the request's loop against the region the engine applied) and a suggested gain.
 */
export function rangeRows(request: Schemas['DesignRequest'], result: Schemas['DesignResult'], currentGain: number): RangeRow[] {
  if (result.gainRanges.length === 0) return [];
  const loop = normalizedLoop(request.plant);
  const targets: DesignTargets | null = request.targets ?? null;
  const dominantOnly = request.dominantOnly ?? false;
  return result.gainRanges.map((range) => {
    const { gain, rule } = suggestedGain(range.from, range.to, currentGain);
    return {
      from: range.from,
      to: range.to,
      fromText: range.from === 0 ? '0' : formatFigure(range.from),
      toText: range.to === null ? '∞' : formatFigure(range.to),
      lower: bindingTargets(loop, result.region, targets, dominantOnly, range.from, 'lower'),
      upper: bindingTargets(loop, result.region, targets, dominantOnly, range.to, 'upper'),
      suggested: gain,
      suggestedText: formatFigure(gain, 6),
      rule,
    };
  });
}

/** Whether a gain lies inside one of the ranges (open intervals). */
export function insideRanges(ranges: readonly { from: number; to: number | null }[], gain: number): boolean {
  return ranges.some((r) => gain > r.from && (r.to === null || gain < r.to));
}
