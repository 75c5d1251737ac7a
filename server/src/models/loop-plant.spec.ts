import { locus, normalizePlant } from '@polewright/locus-core';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../tests/support/tolerance.js';
import { loopPlant, plantNotes } from './loop-plant.js';

describe('loopPlant', () => {
  it('is the stored plant itself when there is no compensator', () => {
    const plant = { expression: '2/(s*(s+3))', deadTime: 0.2 };
    expect(loopPlant({ plant, compensator: null })).toBe(plant);
    expect(plantNotes({ plant, compensator: null })).toEqual([]);
  });

  it('multiplies the compensator in: 1/(s+1) with 3(s+2)/s is 3(s+2)/(s(s+1))', () => {
    const loop = normalizePlant(loopPlant({ plant: { numerator: [1], denominator: [1, 1] }, compensator: { zeros: [{ re: -2, im: 0 }], poles: [{ re: 0, im: 0 }], gain: 3 } }));
    // expanded by hand: numerator 3s + 6, denominator s² + s
    expect(loop.numerator).toEqual([3, 6]);
    expect(loop.denominator).toEqual([1, 1, 0]);
  });

  it('gives the same locus as the whole loop written as one expression', () => {
    const compensator = { zeros: [{ re: -1, im: 1 }, { re: -1, im: -1 }], poles: [{ re: -8, im: 0 }, { re: 0, im: 0 }], gain: 2.5 };
    const viaLoop = locus({ plant: loopPlant({ plant: { expression: '4/((s+3)*(s+0.5))' }, compensator }) });
    const direct = locus({ plant: { expression: '2.5*(s^2+2*s+2)*4/((s+8)*s*(s+3)*(s+0.5))' } });
    expect(viaLoop.stableGainRanges).toHaveLength(direct.stableGainRanges.length);
    viaLoop.stableGainRanges.forEach((r, i) => {
      expectClose(r.from, direct.stableGainRanges[i].from, 1e-9, 1e-12);
      if (r.to !== null) expectClose(r.to, direct.stableGainRanges[i].to as number, 1e-9);
    });
    viaLoop.normalizedPlant.denominator.forEach((c, i) => expectClose(c, direct.normalizedPlant.denominator[i], 1e-12, 1e-12));
  });

  it('works in the loop’s domain: a discretised plant takes a z-domain compensator', () => {
    const plant = { expression: '1/(s+1)', discretize: { sampleTime: 0.1 } };
    const loop = loopPlant({ plant, compensator: { zeros: [{ re: 0.5, im: 0 }], poles: [{ re: 1, im: 0 }], gain: 1 } });
    expect(loop).toMatchObject({ domain: 'z', sampleTime: 0.1 });
    expect(normalizePlant(loop).denominator).toHaveLength(3);
  });

  it('keeps the notes the engine can no longer make once the dead time is multiplied out', () => {
    const parts = { plant: { expression: '1/(s+1)', deadTime: 0.5 }, compensator: { zeros: [], poles: [], gain: 2 } };
    expect(plantNotes(parts).map((w) => w.code)).toContain('dead-time-approximated');
  });
});
