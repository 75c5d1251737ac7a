import { designGains, type DesignRequest } from '@polewright/locus-core';
import type { Schemas } from '../api/api-types';
import { designRequestOf } from './design-request';
import { insideRanges, rangeRows, suggestedGain, SUGGESTION_RULES } from './feasible-ranges';

// The engine itself answers here (the API passes the body to the same `designGains`), so the rows are
// checked against what the engine found, not against numbers written into the test.
function answer(request: Schemas['DesignRequest']): Schemas['DesignResult'] {
  return designGains(request as DesignRequest) as Schemas['DesignResult'];
}

const HOIST = { plant: { expression: '(s+0.6)^2/(s^3*(s+4.5)*(s+11))' }, compensator: null };
const BELT = { plant: { expression: '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))' }, compensator: null };

describe('suggestedGain', () => {
  it('takes the geometric middle of a bounded range: equal factors to both ends', () => {
    const { gain, rule } = suggestedGain(4, 100, 1);
    expect(gain).toBe(20);
    expect(rule).toBe(SUGGESTION_RULES.middle);
  });

  it('takes half the upper end of a range from 0, and twice the lower end of an unbounded one', () => {
    expect(suggestedGain(0, 16.7, 1)).toEqual({ gain: 8.35, rule: SUGGESTION_RULES.belowTop });
    expect(suggestedGain(3, null, 1)).toEqual({ gain: 6, rule: SUGGESTION_RULES.aboveBottom });
    expect(suggestedGain(0, null, 7.5)).toEqual({ gain: 7.5, rule: SUGGESTION_RULES.any });
  });

  it('rounds to 4 significant digits unless that would leave the range', () => {
    expect(suggestedGain(82.39439415473674, 121.09669756386018, 1).gain).toBe(99.89);
    const narrow = suggestedGain(1.000001, 1.000003, 1).gain;
    expect(narrow).toBeGreaterThan(1.000001);
    expect(narrow).toBeLessThan(1.000003);
  });
});

describe('rangeRows', () => {
  it('names the damping target at both ends of the hoist’s ζ ≥ 0.3 range, and suggests a gain inside', () => {
    const request = designRequestOf(HOIST, { minDampingRatio: 0.3 }, false);
    const result = answer(request);
    expect(result.gainRanges.length).toBe(1);
    const [row] = rangeRows(request, result, 107);
    expect(row.from).toBe(result.gainRanges[0].from);
    expect(row.lower.map((b) => b.limit)).toEqual(['damping']);
    expect(row.upper.map((b) => b.limit)).toEqual(['damping']);
    expect(row.lower[0].text).toBe('ζ ≥ 0.3');
    expect(insideRanges(result.gainRanges, row.suggested)).toBe(true);
  });

  it('names the stability limit where the range ends at the loop’s stability limit', () => {
    const request = designRequestOf(BELT, null, false);
    const result = answer(request);
    const [row] = rangeRows(request, result, 1);
    expect(row.from).toBe(0);
    expect(row.lower).toEqual([]);
    expect(row.upper.map((b) => b.limit)).toEqual(['stability']);
  });

  it('says the overshoot target binds when it sets the damping bound', () => {
    // 40 % overshoot stands for ζ ≈ 0.28, tighter than ζ ≥ 0.2: the overshoot target binds
    const request = designRequestOf(HOIST, { minDampingRatio: 0.2, maxOvershootPct: 40 }, false);
    const result = answer(request);
    const rows = rangeRows(request, result, 1);
    expect(rows.length).toBeGreaterThan(0);
    const limits = rows.flatMap((r) => [...r.lower, ...r.upper].map((b) => b.limit));
    expect(limits).toContain('overshoot');
    expect(limits).not.toContain('damping');
  });

  it('names the settling-time target where the decay rate runs out', () => {
    const request = designRequestOf(BELT, { maxSettlingTime: 12 }, true);
    const result = answer(request);
    const rows = rangeRows(request, result, 1);
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.flatMap((r) => [...r.lower, ...r.upper].map((b) => b.limit))).toContain('settling');
  });

  it('gives no rows when no gain meets all targets', () => {
    const request = designRequestOf(BELT, { minDampingRatio: 0.4 }, false);
    expect(rangeRows(request, answer(request), 1)).toEqual([]);
  });
});

describe('designRequestOf', () => {
  it('sends the plant itself without a compensator, with the ζ target as damping line', () => {
    expect(designRequestOf(HOIST, { minDampingRatio: 0.3 }, false)).toEqual({ plant: HOIST.plant, targets: { minDampingRatio: 0.3 }, dominantOnly: false, dampingLines: [0.3] });
    expect(designRequestOf(HOIST, null, true)).toEqual({ plant: HOIST.plant, dominantOnly: true, dampingLines: [0.5, 0.707] });
  });

  it('sends compensator × plant in the engine’s coefficient form with a compensator', () => {
    // 1/(s(s+2)) with zero −3, pole −9, gain 4 → 4(s+3)/(s(s+2)(s+9)) (the core's own example)
    const request = designRequestOf({ plant: { expression: '1/(s*(s+2))' }, compensator: { zeros: [{ re: -3, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 4 } }, null, false);
    expect(request.plant).toEqual({ numerator: [4, 12], denominator: [1, 11, 18, 0], domain: 's' });
  });
});
