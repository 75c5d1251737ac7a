import { locus } from '@polewright/locus-core';
import { DEMO_PLANTS } from '../../testing/demo-loops';
import { formatRange, locusTable, sampleGains } from './data-table';

describe('data table', () => {
  const result = locus({ plant: DEMO_PLANTS.beltSpeed });

  it('samples K = 0 and rising gains up to ten times the largest feature gain', () => {
    const gains = sampleGains(result);
    expect(gains[0]).toBe(0);
    for (let i = 1; i < gains.length; i++) expect(gains[i]).toBeGreaterThan(gains[i - 1]);
    const largestFeature = Math.max(...[...result.breakPoints, ...result.crossings].map((f) => f.gain));
    expect(gains[gains.length - 1]).toBeLessThanOrEqual(10 * largestFeature * 1.05);
    expect(gains[gains.length - 1]).toBeGreaterThan(largestFeature);
  });

  it('gives one column per branch and the open-loop poles in the K = 0 row', () => {
    const table = locusTable(result);
    expect(table.branches.length).toBe(4);
    expect(table.rows[0].gain).toBe('0');
    expect(new Set(table.rows[0].poles)).toEqual(new Set(['0', '-0.9', '-1.6 + 7.03j', '-1.6 − 7.03j']));
  });

  it('lists the features with their gains and the certified stable ranges', () => {
    const table = locusTable(result);
    expect(table.features).toContain('Open-loop zero at -1.5');
    expect(table.features.some((f) => f.startsWith('Asymptotes from -0.867 at'))).toBe(true);
    expect(table.features.some((f) => f.startsWith('Crosses the imaginary axis at 0 + 7.08j, K = 16.71'))).toBe(true);
    expect(table.stableRanges).toEqual(['0 < K < 16.71']);
  });

  it('writes unbounded ranges as one inequality', () => {
    expect(formatRange({ from: 2.5, to: null })).toBe('K > 2.5');
    expect(formatRange({ from: 0, to: null })).toBe('K > 0');
  });
});
