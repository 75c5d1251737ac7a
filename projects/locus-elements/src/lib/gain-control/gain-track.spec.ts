import type { LocusResult } from '@polewright/locus-core';
import { locus } from '@polewright/locus-core';
import { gainSpanOf, parseGain, TRACK_STEPS, trackScale, trackSegments } from './gain-track';

describe('gainSpanOf', () => {
  it('spans from 1/30 of the smallest to 30× the largest gain where the locus changes', () => {
    // 1/(s(s+1)(s+2)): break point near K ≈ 0.385, crossing at K = 6 (Routh, by hand)
    const result = locus({ plant: { expression: '1/(s*(s+1)*(s+2))' } });
    const { lo, hi } = gainSpanOf(result, 1);
    const gains = [...result.breakPoints.map((b) => b.gain), ...result.crossings.map((c) => c.gain)].filter((g) => g > 0);
    expect(lo).toBeCloseTo(Math.min(...gains) / 30, 12);
    expect(hi).toBeCloseTo(6 * 30, 6);
  });

  it('stretches to hold a gain outside the span, and honours min and max', () => {
    const result = { crossings: [{ gain: 10, point: { re: 0, im: 1 } }], breakPoints: [], stableGainRanges: [] } as unknown as LocusResult;
    expect(gainSpanOf(result, 1e6).hi).toBe(3e6);
    expect(gainSpanOf(result, 1, 0.01, 50)).toEqual({ lo: 0.01, hi: 50 });
    expect(gainSpanOf(null, 2)).toEqual({ lo: 0.002, hi: 2000 });
  });
});

describe('trackSegments', () => {
  it('cuts the track at the stable-range edges and merges neighbours of one kind', () => {
    const segments = trackSegments([{ from: 0.5, to: 40 }], 0.05, 400);
    expect(segments.map((s) => [s.from, s.to, s.isStable])).toEqual([
      [0.05, 0.5, false],
      [0.5, 40, true],
      [40, 400, false],
    ]);
    // log track: 0.05 → 0.5 is one decade of log10(8000) ≈ 3.9 decades
    expect(segments[0].left).toBe(0);
    expect(segments[0].width).toBeCloseTo(100 / Math.log10(8000), 9);
    expect(segments.reduce((sum, s) => sum + s.width, 0)).toBeCloseTo(100, 9);
  });

  it('is one stable stretch when every gain on the track is stable', () => {
    expect(trackSegments([{ from: 0, to: null }], 1, 100).map((s) => s.isStable)).toEqual([true]);
  });

  it('maps gain to slider position logarithmically and clamps outside the span', () => {
    const scale = trackScale(1, 100);
    expect(scale(10)).toBeCloseTo(TRACK_STEPS / 2, 9);
    expect(scale(1e4)).toBe(TRACK_STEPS);
    expect(scale.invert(TRACK_STEPS / 4)).toBeCloseTo(Math.sqrt(10), 9);
  });
});

describe('parseGain', () => {
  it('reads plain, exponent and thousands-grouped numbers', () => {
    expect(parseGain(' 2.5 ')).toEqual({ gain: 2.5 });
    expect(parseGain('1e3')).toEqual({ gain: 1000 });
    expect(parseGain('14,270')).toEqual({ gain: 14270 });
  });

  it('refuses text, zero, negative and empty input with a reason', () => {
    expect(parseGain('abc')).toEqual({ error: expect.stringMatching(/not a number/) });
    expect(parseGain('0')).toEqual({ error: expect.stringMatching(/above zero/) });
    expect(parseGain('-2')).toEqual({ error: expect.stringMatching(/above zero/) });
    expect(parseGain('')).toEqual({ error: expect.stringMatching(/Enter a gain/) });
  });
});
