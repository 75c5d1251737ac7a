import type { LocusResult } from '@polewright/locus-core';
import { frameOf } from './plot-frame';
import { nearestLocusPoint, readoutText } from './readout';

// a hand-made two-branch locus: one branch along the real axis, one rising at 45° (ζ = 0.7071 there)
const result = {
  domain: 's',
  sampleTime: null,
  branches: [
    { points: [{ gain: 0, re: -1, im: 0 }, { gain: 2, re: -5, im: 0 }] },
    { points: [{ gain: 0, re: -1, im: 1 }, { gain: 4, re: -3, im: 3 }] },
  ],
} as unknown as LocusResult;
const frame = frameOf({ width: 600, height: 600 }, { minRe: -6, maxRe: 1, minIm: -3.5, maxIm: 3.5 });

describe('read-out', () => {
  it('interpolates the gain at the foot of the pointer on the nearest segment', () => {
    const hit = nearestLocusPoint(result, frame, frame.x(-3), frame.y(0.2));
    expect(hit?.branch).toBe(0);
    expect(hit?.gain).toBeCloseTo(1, 9);
    expect(hit?.point.re).toBeCloseTo(-3, 9);
    expect(hit?.dampingRatio).toBeCloseTo(1, 9);
    expect(hit?.naturalFrequency).toBeCloseTo(3, 9);
  });

  it('gives the damping ratio and natural frequency of the point through the core', () => {
    const hit = nearestLocusPoint(result, frame, frame.x(-2), frame.y(2));
    expect(hit?.branch).toBe(1);
    expect(hit?.gain).toBeCloseTo(2, 9);
    expect(hit?.dampingRatio).toBeCloseTo(Math.SQRT1_2, 9);
    expect(hit?.naturalFrequency).toBeCloseTo(2 * Math.SQRT2, 9);
    expect(readoutText(hit!)).toBe('K 2 · ζ 0.707 · ωn 2.83 rad/s');
  });

  it('finds nothing farther than asked, and keeps to one branch when told', () => {
    expect(nearestLocusPoint(result, frame, frame.x(0.9), frame.y(-3), 10)).toBeNull();
    expect(nearestLocusPoint(result, frame, frame.x(-3), frame.y(0.2), Infinity, 1)?.branch).toBe(1);
  });
});
