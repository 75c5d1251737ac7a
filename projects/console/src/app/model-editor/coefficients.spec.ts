import { FormControl } from '@angular/forms';
import { coefficientList, formatCoefficients, MAX_COEFFICIENTS, parseCoefficients, polynomialText } from './coefficients';

describe('parseCoefficients', () => {
  it('reads numbers separated by spaces, commas or semicolons, highest power first', () => {
    expect(parseCoefficients('1 3.8 20.12 20.4 0').values).toEqual([1, 3.8, 20.12, 20.4, 0]);
    expect(parseCoefficients(' 2.4, 7.2 ').values).toEqual([2.4, 7.2]);
    expect(parseCoefficients('1;-0.5;  +2e-3').values).toEqual([1, -0.5, 0.002]);
  });

  it('accepts a list pasted in square brackets', () => {
    expect(parseCoefficients('[1, 4, 3, 0]').values).toEqual([1, 4, 3, 0]);
  });

  it('asks for at least one coefficient when the field is empty', () => {
    const reading = parseCoefficients('   ');
    expect(reading.values).toBeNull();
    expect(reading.message).toBe('Give at least one coefficient, highest power first, e.g. "1 0.9 0".');
  });

  it('names the token that is not a number and its position', () => {
    expect(parseCoefficients('1 3.8 16.4 1x').message).toBe('"1x" (coefficient 4) is not a number. Separate the numbers with spaces or commas and write decimals with a point.');
    expect(parseCoefficients('1 s 2').message).toContain('"s" (coefficient 2)');
    expect(parseCoefficients('Infinity').message).toContain('"Infinity" (coefficient 1) is not a number');
  });

  it('refuses a number beyond double precision instead of turning it into Infinity', () => {
    expect(parseCoefficients('1 1e400').message).toBe('"1e400" (coefficient 2) is too large for double precision.');
  });

  it('refuses more coefficients than the contract allows', () => {
    const text = new Array(MAX_COEFFICIENTS + 1).fill('1').join(' ');
    expect(parseCoefficients(text).message).toBe(`Lists ${MAX_COEFFICIENTS + 1} coefficients; at most ${MAX_COEFFICIENTS}.`);
  });
});

describe('coefficientList validator', () => {
  it('puts the parsing message on the control as its own message', () => {
    expect(new FormControl('1 2 x', coefficientList).errors).toEqual({ coefficients: { message: expect.stringContaining('"x" (coefficient 3)') } });
    expect(new FormControl('1 2 3', coefficientList).errors).toBeNull();
  });
});

describe('formatCoefficients and polynomialText', () => {
  it('writes rounding noise away at 12 significant digits', () => {
    expect(formatCoefficients([1, 4.1000000000000005, 0.30000000000000004, 0])).toBe('1 4.1 0.3 0');
  });

  it('writes out which power each coefficient belongs to', () => {
    expect(polynomialText([2, 0, -1.5], 's')).toBe('2s² − 1.5');
    expect(polynomialText([0, 1, -1, 0], 'z')).toBe('z² − z');
    expect(polynomialText([1, 3.8, 20.12, 20.4, 0, 0, 0, 0, 0, 0, 0], 's')).toBe('s¹⁰ + 3.8s⁹ + 20.12s⁸ + 20.4s⁷');
    expect(polynomialText([0, 0], 's')).toBe('0');
  });
});
