import { loopPlant as coreLoopPlant, plantNotes as corePlantNotes, ValidationError } from '@polewright/locus-core';
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
      expect((error as ValidationError).issues[0].pointer).toBe('/compensator/zeros/0');
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
  // the multiplication itself is the core's loopPlant, checked in projects/locus-core/src/plant/compensator.spec.ts
  it('is the plant itself when there is no compensator', () => {
    const plant = { expression: '1/(s*(s+2))' };
    expect(loopPlant({ plant, compensator: null })).toBe(plant);
  });

  it('gives exactly the core result (what the server computes) for the same plant and compensator', () => {
    const model = { plant: { expression: '1/(s*(s+2))', deadTime: 0.1 }, compensator: { zeros: [{ re: -3, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 4 } };
    expect(loopPlant(model)).toEqual(coreLoopPlant(model));
    expect(loopPlant(model)).toEqual(loopPlant(model));
    expect(plantNotes(model)).toEqual(corePlantNotes(model));
  });

  it('refuses a compensator that makes the loop improper, pointing at its zeros', () => {
    const improper = () => loopPlant({ plant: { expression: '1/(s+1)' }, compensator: { zeros: [{ re: -1, im: 0 }, { re: -2, im: 0 }], poles: [], gain: 1 } });
    expect(improper).toThrow(/improper/);
  });
});
