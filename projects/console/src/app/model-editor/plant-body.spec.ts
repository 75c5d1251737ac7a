import { conjugateOf, unpairedRows } from './conjugates';
import { complexText, emptyPlantFields, type PlantFields, plantFieldsOf, plantOf } from './plant-body';

function fields(change: Partial<PlantFields>): PlantFields {
  return { ...emptyPlantFields(), ...change };
}

describe('plantOf (the plant body of a save)', () => {
  it('sends an expression trimmed, and nothing for a continuous plant without dead time', () => {
    expect(plantOf(fields({ expression: '  2.4*(s+3)/(s*(s+1.2))  ' }))).toEqual({ expression: '2.4*(s+3)/(s*(s+1.2))' });
  });

  it('sends coefficient lists read from the text', () => {
    expect(plantOf(fields({ form: 'coefficients', numerator: '2.4 7.2', denominator: '1, 1.2, 0' }))).toEqual({ numerator: [2.4, 7.2], denominator: [1, 1.2, 0] });
  });

  it('gives null while a coefficient list cannot be read', () => {
    expect(plantOf(fields({ form: 'coefficients', numerator: '2.4 x', denominator: '1 1.2 0' }))).toBeNull();
  });

  it('sends poles, zeros (imaginary part 0 when empty) and gain', () => {
    const plant = plantOf(fields({ form: 'factored', zeros: [{ re: -3, im: null }], poles: [{ re: 0, im: 0 }, { re: -1.3, im: 2.1 }, { re: -1.3, im: -2.1 }], gain: 2.4 }));
    expect(plant).toEqual({ zeros: [{ re: -3, im: 0 }], poles: [{ re: 0, im: 0 }, { re: -1.3, im: 2.1 }, { re: -1.3, im: -2.1 }], gain: 2.4 });
  });

  it('sends domain and sampling period for a sampled plant, never a Padé order there', () => {
    expect(plantOf(fields({ expression: '0.08*(z+0.7)/((z-1)*(z-0.62))', domain: 'z', sampleTime: 0.05, deadTime: 0.1, padeOrder: 3 }))).toEqual({
      expression: '0.08*(z+0.7)/((z-1)*(z-0.62))',
      domain: 'z',
      sampleTime: 0.05,
      deadTime: 0.1,
    });
  });

  it('sends dead time with its Padé order, or with the zero-order hold instead of the order', () => {
    expect(plantOf(fields({ expression: '1/(s+1)', deadTime: 0.4, padeOrder: 5 }))).toEqual({ expression: '1/(s+1)', deadTime: 0.4, padeOrder: 5 });
    expect(plantOf(fields({ expression: '1/(s+1)', deadTime: 0.4, padeOrder: 5, discretize: { enabled: true, sampleTime: 0.1 } }))).toEqual({ expression: '1/(s+1)', deadTime: 0.4, discretize: { sampleTime: 0.1 } });
    expect(plantOf(fields({ expression: '1/(s+1)', deadTime: 0, padeOrder: 5 }))).toEqual({ expression: '1/(s+1)' });
  });
});

describe('plantFieldsOf (a stored plant into the form)', () => {
  it('recognises each form and keeps the time base', () => {
    expect(plantFieldsOf({ expression: '0.62/((5.8*s+1)*(1.4*s+1))', deadTime: 0.8, padeOrder: 3 })).toMatchObject({ form: 'expression', deadTime: 0.8, padeOrder: 3, domain: 's' });
    expect(plantFieldsOf({ numerator: [1, 2], denominator: [1, 4, 3, 0] })).toMatchObject({ form: 'coefficients', numerator: '1 2', denominator: '1 4 3 0' });
    expect(plantFieldsOf({ poles: [{ re: -2 }], gain: 3 })).toMatchObject({ form: 'factored', zeros: [], poles: [{ re: -2, im: 0 }], gain: 3 });
    expect(plantFieldsOf({ expression: '1/(s+1)', discretize: { sampleTime: 2 } })).toMatchObject({ discretize: { enabled: true, sampleTime: 2 } });
  });

  it('round-trips every form through the form and back', () => {
    const plants = [
      { expression: '0.85/((38*s+1)*(7*s+1))', deadTime: 3, discretize: { sampleTime: 2 } },
      { expression: '0.0041*(z+0.83)/((z-1)*(z^2-1.62*z+0.69))', domain: 'z' as const, sampleTime: 5e-5 },
      { numerator: [1, 2], denominator: [1, 4, 3, 0], deadTime: 0.2, padeOrder: 4 },
      { zeros: [{ re: -1, im: 0 }], poles: [{ re: 0, im: 0 }, { re: -2, im: 1 }, { re: -2, im: -1 }], gain: 5 },
    ];
    for (const plant of plants) expect(plantOf(plantFieldsOf(plant))).toEqual(plant);
  });
});

describe('conjugate pairs', () => {
  it('finds complex values without their conjugate, each value pairing once', () => {
    expect(unpairedRows([{ re: -1, im: 2 }, { re: -3, im: 0 }])).toEqual([0]);
    expect(unpairedRows([{ re: -1, im: 2 }, { re: -1, im: -2 }, { re: -1, im: 2 }])).toEqual([2]);
    expect(unpairedRows([{ re: -1, im: 2 }, { re: -1, im: -2 }, { re: 0, im: 0 }, { re: null, im: 5 }])).toEqual([]);
  });

  it('writes the conjugate to offer', () => {
    expect(conjugateOf({ re: -6, im: 2 })).toEqual({ re: -6, im: -2 });
    expect(complexText(conjugateOf({ re: -6, im: 2 }))).toBe('−6 − 2j');
    expect(complexText({ re: 0, im: 1.5 })).toBe('1.5j');
    expect(complexText({ re: 2, im: 0 })).toBe('2');
  });
});
