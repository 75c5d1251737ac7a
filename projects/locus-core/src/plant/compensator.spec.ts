import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import { ValidationError } from '../errors';
import { locus } from '../locus/locus';
import { loopPlant, MAX_COMPENSATOR_ROOTS, plantNotes, readCompensator } from './compensator';
import { normalizePlant } from './normalize';

function pointersOf(run: () => unknown): string[] {
  try {
    run();
  } catch (error) {
    if (error instanceof ValidationError) return error.issues.map((i) => i.pointer);
    throw error;
  }
  return [];
}

describe('readCompensator', () => {
  it('reads zeros, poles and gain, with im and gain defaulting to 0 and 1', () => {
    expect(readCompensator({ zeros: [{ re: -2 }], poles: [] })).toEqual({ zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 });
    expect(readCompensator(null)).toBeNull();
    expect(readCompensator(undefined)).toBeNull();
  });

  it('names every field at fault under the given pointer', () => {
    expect(pointersOf(() => readCompensator({ zeros: [{ re: 'x' }], poles: 3, gain: 0 }, '/c'))).toEqual(['/c/zeros/0', '/c/poles', '/c/gain']);
    expect(pointersOf(() => readCompensator([1, 2]))).toEqual(['/compensator']);
  });

  it('refuses a complex value without its conjugate, pointing at it', () => {
    expect(pointersOf(() => readCompensator({ zeros: [{ re: -1, im: 1 }, { re: -1, im: -1 }, { re: -3, im: 2 }], poles: [] }))).toEqual(['/compensator/zeros/2']);
  });

  it('refuses more roots than the limit', () => {
    const many = Array.from({ length: MAX_COMPENSATOR_ROOTS + 1 }, (_, i) => ({ re: -1 - i, im: 0 }));
    expect(pointersOf(() => readCompensator({ zeros: [], poles: many }))).toEqual(['/compensator/poles']);
  });
});

describe('loopPlant', () => {
  it('is the plant itself when there is no compensator, with no notes to carry', () => {
    const plant = { expression: '2/(s*(s+3))', deadTime: 0.2 };
    expect(loopPlant({ plant, compensator: null })).toBe(plant);
    expect(plantNotes({ plant, compensator: null })).toEqual([]);
  });

  it('multiplies compensator and plant: 4(s+3)/(s+9) × 1/(s(s+2)) = (4s+12)/(s³+11s²+18s)', () => {
    // expanded by hand: (s+9)·s·(s+2) = s³ + 11s² + 18s
    const plant = loopPlant({ plant: { expression: '1/(s*(s+2))' }, compensator: { zeros: [{ re: -3, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 4 } });
    expect(plant).toEqual({ numerator: [4, 12], denominator: [1, 11, 18, 0], domain: 's' });
  });

  it('multiplies complex compensator pairs into real coefficients', () => {
    // (s − (−1+2j))(s − (−1−2j)) = s² + 2s + 5, by hand
    const plant = loopPlant({ plant: { numerator: [1], denominator: [1, 1, 0, 0] }, compensator: { zeros: [{ re: -1, im: 2 }, { re: -1, im: -2 }], poles: [], gain: 1 } });
    expect(plant).toEqual({ numerator: [1, 2, 5], denominator: [1, 1, 0, 0], domain: 's' });
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

  it('works in the loop’s domain: a sampled plant keeps its sampling period, a discretised one becomes z', () => {
    const sampled = loopPlant({ plant: { expression: '0.5/(z-0.5)', domain: 'z', sampleTime: 0.1 }, compensator: { zeros: [{ re: 0.2, im: 0 }], poles: [{ re: 1, im: 0 }], gain: 2 } });
    // 2(z − 0.2) · 0.5 = z − 0.2 over (z − 1)(z − 0.5) = z² − 1.5z + 0.5, by hand
    expect(sampled).toEqual({ numerator: [1, -0.2], denominator: [1, -1.5, 0.5], domain: 'z', sampleTime: 0.1 });
    const discretised = loopPlant({ plant: { expression: '1/(s+1)', discretize: { sampleTime: 0.1 } }, compensator: { zeros: [{ re: 0.5, im: 0 }], poles: [{ re: 1, im: 0 }], gain: 1 } });
    expect(discretised).toMatchObject({ domain: 'z', sampleTime: 0.1 });
    expect(normalizePlant(discretised).denominator).toHaveLength(3);
  });

  it('uses a normalised plant handed in instead of normalising again', () => {
    const plant = { expression: '1/(s*(s+2))' };
    const normalized = normalizePlant(plant);
    const parts = { plant, compensator: { zeros: [{ re: -3, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 4 } };
    expect(loopPlant(parts, normalized)).toEqual(loopPlant(parts));
  });

  it('keeps the notes the engine can no longer make once the dead time is multiplied out', () => {
    const parts = { plant: { expression: '1/(s+1)', deadTime: 0.5 }, compensator: { zeros: [], poles: [], gain: 2 } };
    expect(plantNotes(parts).map((w) => w.code)).toContain('dead-time-approximated');
  });

  it('refuses a compensator that makes the loop improper, pointing at its zeros', () => {
    const improper = () => loopPlant({ plant: { expression: '1/(s+1)' }, compensator: { zeros: [{ re: -1, im: 0 }, { re: -2, im: 0 }], poles: [], gain: 1 } });
    expect(improper).toThrow(/improper/);
    expect(pointersOf(improper)).toEqual(['/compensator/zeros']);
  });
});
