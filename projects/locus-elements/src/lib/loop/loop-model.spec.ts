import { ValidationError } from '@polewright/locus-core';
import { loopPlant, parseModelInput, plantNotes, readModel } from './loop-model';

describe('parseModelInput', () => {
  it('reads a bare expression string as an expression plant without compensator', () => {
    expect(parseModelInput('  1/(s*(s+2)) ')).toEqual({ plant: { expression: '1/(s*(s+2))' }, compensator: null });
  });

  it('reads a JSON plant in coefficient form', () => {
    const model = parseModelInput('{"numerator":[1],"denominator":[1,3,2]}');
    expect(model.plant).toEqual({ numerator: [1], denominator: [1, 3, 2] });
    expect(model.compensator).toBeNull();
  });

  it('reads a Model resource with its compensator and name, ignoring the other fields', () => {
    const text = JSON.stringify({
      id: 'a1', name: 'Line 3 belt speed', revision: 2,
      plant: { expression: '1/(s*(s+2))' },
      compensator: { zeros: [{ re: -3, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 4 },
    });
    const model = parseModelInput(text);
    expect(model.name).toBe('Line 3 belt speed');
    expect(model.compensator).toEqual({ zeros: [{ re: -3, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 4 });
  });

  it('refuses text that is neither JSON nor an expression the core can read, saying why', () => {
    expect(() => parseModelInput('{"expression": ')).toThrow(/not valid JSON/);
    expect(() => parseModelInput('   ')).toThrow(/empty/);
    expect(() => parseModelInput('s^3/(s+1)')).toThrow(ValidationError);
  });

  it('names the compensator field at fault', () => {
    const bad = () => readModel({ plant: { expression: '1/(s+1)' }, compensator: { zeros: [{ re: -1, im: 2 }], poles: [], gain: 1 } });
    expect(bad).toThrow(ValidationError);
    try {
      bad();
    } catch (error) {
      expect((error as ValidationError).issues[0].pointer).toBe('/compensator/zeros');
    }
    expect(() => readModel({ plant: { expression: '1/(s+1)' }, compensator: { zeros: [], poles: [], gain: 0 } })).toThrow(/gain/);
    expect(() => readModel({ plant: { expression: '1/(s+1)' }, compensator: { zeros: [{ re: 'x' }], poles: [] } })).toThrow(/zeros\/0/);
  });

  it('refuses a value that is not a model at all', () => {
    expect(() => readModel(42)).toThrow(/must be a plant object/);
    expect(() => readModel([1, 2])).toThrow(/must be a plant object/);
  });
});

describe('loopPlant', () => {
  it('is the plant itself when there is no compensator', () => {
    const plant = { expression: '1/(s*(s+2))' };
    expect(loopPlant({ plant, compensator: null })).toBe(plant);
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

  it('keeps a sampled loop in the z-plane with its sampling period', () => {
    const plant = loopPlant({ plant: { expression: '0.5/(z-0.5)', domain: 'z', sampleTime: 0.1 }, compensator: { zeros: [{ re: 0.2, im: 0 }], poles: [{ re: 1, im: 0 }], gain: 2 } });
    // 2(z − 0.2) · 0.5 = z − 0.2 over (z − 1)(z − 0.5) = z² − 1.5z + 0.5, by hand
    expect(plant).toEqual({ numerator: [1, -0.2], denominator: [1, -1.5, 0.5], domain: 'z', sampleTime: 0.1 });
  });

  it('keeps the core notes on the plant that the multiplied loop can no longer produce', () => {
    const plant = { expression: '1/(s+1)', deadTime: 0.5 };
    expect(plantNotes({ plant, compensator: null })).toEqual([]);
    expect(plantNotes({ plant, compensator: { zeros: [], poles: [], gain: 2 } }).map((w) => w.code)).toContain('dead-time-approximated');
  });

  it('refuses a compensator that makes the loop improper, pointing at its zeros', () => {
    const improper = () => loopPlant({ plant: { expression: '1/(s+1)' }, compensator: { zeros: [{ re: -1, im: 0 }, { re: -2, im: 0 }], poles: [], gain: 1 } });
    expect(improper).toThrow(/improper/);
  });
});
