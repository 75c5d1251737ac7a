import { normalizePlant } from '@polewright/locus-core';
import { parseCoefficients } from './coefficients';
import { emptyPlantFields, type PlantFields, plantOf } from './plant-body';
import { convertPlant, isBlank } from './plant-conversion';

function fields(change: Partial<PlantFields>): PlantFields {
  return { ...emptyPlantFields(), ...change };
}

/** N and D of a plant as the engine sees them (denominator monic). */
function engineForm(f: PlantFields): { numerator: readonly number[]; denominator: readonly number[] } {
  const normalized = normalizePlant(plantOf(f), '/plant');
  return { numerator: normalized.numerator, denominator: normalized.denominator };
}

function expectSamePlant(a: PlantFields, b: PlantFields): void {
  const x = engineForm(a);
  const y = engineForm(b);
  expect(y.denominator.length).toBe(x.denominator.length);
  expect(y.numerator.length).toBe(x.numerator.length);
  // conversions round to 12 significant digits for display: compare at 1e-9 relative
  x.denominator.forEach((c, i) => expect(y.denominator[i]).toBeCloseTo(c, 9));
  x.numerator.forEach((c, i) => expect(y.numerator[i]).toBeCloseTo(c, 9));
}

describe('convertPlant', () => {
  const expression = fields({ expression: '2.4*(s+3)/(s*(s+1.2)*(s^2+2.6*s+17))' });

  it('turns an expression into coefficients (through the engine, denominator monic)', () => {
    const converted = convertPlant(expression, 'coefficients');
    expect(converted.message).toBeNull();
    expect(converted.fields?.form).toBe('coefficients');
    expect(parseCoefficients(converted.fields!.numerator).values).toEqual([2.4, 7.2]);
    expect(parseCoefficients(converted.fields!.denominator).values).toEqual([1, 3.8, 20.12, 20.4, 0]);
  });

  it('factors an expression into poles, zeros and gain, complex poles as exact conjugate pairs', () => {
    const converted = convertPlant(expression, 'factored').fields!;
    expect(converted.gain).toBe(2.4);
    expect(converted.zeros).toEqual([{ re: -3, im: 0 }]);
    const poles = converted.poles;
    expect(poles.slice(0, 2)).toEqual([{ re: 0, im: 0 }, { re: -1.2, im: 0 }]);
    expect(poles[2].re).toBeCloseTo(-1.3, 10);
    expect(poles[2].im).toBeCloseTo(Math.sqrt(17 - 1.69), 10);
    expect(poles[3]).toEqual({ re: poles[2].re, im: -(poles[2].im as number) });
    expectSamePlant(expression, converted);
  });

  it('multiplies poles and zeros out into coefficients (factored → coefficients via the core)', () => {
    const factored = fields({ form: 'factored', zeros: [{ re: -3, im: 0 }], poles: [{ re: 0, im: 0 }, { re: -2, im: 1 }, { re: -2, im: -1 }], gain: 4 });
    const converted = convertPlant(factored, 'coefficients').fields!;
    expect(parseCoefficients(converted.numerator).values).toEqual([4, 12]);
    expect(parseCoefficients(converted.denominator).values).toEqual([1, 4, 5, 0]);
  });

  it('writes poles and zeros as a product expression with quadratic factors for pairs', () => {
    const factored = fields({ form: 'factored', zeros: [{ re: -3, im: 0 }], poles: [{ re: 0, im: 0 }, { re: -2, im: 1 }, { re: -2, im: -1 }], gain: 4 });
    const converted = convertPlant(factored, 'expression').fields!;
    expect(converted.expression).toBe('4*(s+3)/(s*(s^2+4*s+5))');
    expectSamePlant(factored, converted);
  });

  it('writes coefficients as a polynomial quotient, keeping the numbers as typed', () => {
    const coefficients = fields({ form: 'coefficients', numerator: '2 -1', denominator: '4 0 1' });
    const converted = convertPlant(coefficients, 'expression').fields!;
    expect(converted.expression).toBe('(2*s-1)/(4*s^2+1)');
    expectSamePlant(coefficients, converted);
  });

  it('treats a double root as two real poles, not a pair with rounding-noise imaginary parts', () => {
    const converted = convertPlant(fields({ expression: '(s+0.6)^2/(s^3*(s+4.5)*(s+11))' }), 'factored').fields!;
    expect(converted.zeros.every((z) => z.im === 0)).toBe(true);
    expect(converted.zeros.map((z) => z.re)).toEqual([-0.6, -0.6]);
  });

  it('keeps the time base (domain, sampling period, dead time) as it was', () => {
    const sampled = fields({ expression: '0.08*(z+0.7)/((z-1)*(z-0.62))', domain: 'z', sampleTime: 0.05, deadTime: 0.1 });
    const converted = convertPlant(sampled, 'coefficients').fields!;
    expect(converted).toMatchObject({ domain: 'z', sampleTime: 0.05, deadTime: 0.1 });
    expect(parseCoefficients(converted.denominator).values).toEqual([1, -1.62, 0.62]);
  });

  it('says why a plant cannot be converted, in the engine’s words', () => {
    expect(convertPlant(fields({ expression: '1/(s+1' }), 'coefficients').message).toMatch(/^the expression cannot be parsed/);
    expect(convertPlant(fields({ form: 'coefficients', numerator: '1 x', denominator: '1 1' }), 'factored').message).toContain('the numerator cannot be read');
    expect(convertPlant(fields({ form: 'factored', poles: [{ re: -1, im: 2 }], gain: 1 }), 'coefficients').message).toContain('has a complex pole without its conjugate');
  });

  it('knows when the current form holds nothing to convert', () => {
    expect(isBlank(fields({ expression: '  ' }))).toBe(true);
    expect(isBlank(fields({ form: 'factored' }))).toBe(true);
    expect(isBlank(expression)).toBe(false);
  });
});
