import { describe, expect, it } from 'vitest';
import { ValidationError } from '../errors';
import { MAX_EXPRESSION_LENGTH, parseExpression } from './expression';

const POINTER = '/plant/expression';

function parsed(text: string, variable: 's' | 'z' = 's'): { numerator: number[]; denominator: number[] } {
  return parseExpression(text, variable, POINTER);
}

/** The ValidationError a parse throws (fails the test when it throws nothing or something else). */
function rejection(text: string, variable: 's' | 'z' = 's'): ValidationError {
  try {
    parsed(text, variable);
  } catch (error) {
    expect(error).toBeInstanceOf(ValidationError);
    return error as ValidationError;
  }
  throw new Error(`"${text}" was accepted`);
}

describe('parseExpression — low order rational expressions', () => {
  it('multiplies out 4(s + 2)/(s(s + 1)) into 4s + 8 over s² + s', () => {
    expect(parsed('4*(s+2)/(s*(s+1))')).toEqual({ numerator: [4, 8], denominator: [1, 1, 0] });
  });

  it('reads implicit multiplication such as 2s', () => {
    expect(parsed('2s+1')).toEqual({ numerator: [2, 1], denominator: [1] });
  });

  it('keeps a common denominator when adding fractions over the same denominator', () => {
    // 1/(s+1) + 2/(s+1) = 3/(s+1), not (3s+3)/(s+1)²
    expect(parsed('1/(s+1) + 2/(s+1)')).toEqual({ numerator: [3], denominator: [1, 1] });
  });

  it('cross-multiplies fractions over different denominators', () => {
    // 1/s + 1/(s+1) = (2s + 1)/(s² + s)
    expect(parsed('1/s + 1/(s+1)')).toEqual({ numerator: [2, 1], denominator: [1, 1, 0] });
  });

  it('handles unary minus and unary plus', () => {
    expect(parsed('-s/(s+1)')).toEqual({ numerator: [-1, 0], denominator: [1, 1] });
    expect(parsed('+3')).toEqual({ numerator: [3], denominator: [1] });
  });

  it('knows the constant pi', () => {
    expect(parsed('pi/s')).toEqual({ numerator: [Math.PI], denominator: [1, 0] });
  });

  it('parses a z-domain expression in the variable z', () => {
    expect(parsed('(z-0.5)/(z^2-z+0.25)', 'z')).toEqual({ numerator: [1, -0.5], denominator: [1, -1, 0.25] });
  });

  it('leaves the denominator as written (not monic): normalisation happens later', () => {
    expect(parsed('1/(2*s+4)')).toEqual({ numerator: [1], denominator: [2, 4] });
  });
});

describe('parseExpression — powers and repeated factors', () => {
  it('expands (s + 1)³ into the binomial coefficients 1, 3, 3, 1', () => {
    expect(parsed('(s+1)^3')).toEqual({ numerator: [1, 3, 3, 1], denominator: [1] });
  });

  it('turns a negative power into a power of the reciprocal', () => {
    expect(parsed('1/(s+1)^-2')).toEqual({ numerator: [1, 2, 1], denominator: [1] });
    expect(parsed('(s+2)^-1')).toEqual({ numerator: [1], denominator: [1, 2] });
  });

  it('evaluates a constant power', () => {
    expect(parsed('2^3/s')).toEqual({ numerator: [8], denominator: [1, 0] });
  });

  it('expands (s + 1)^20 with the exact binomial coefficients (all below 2^53)', () => {
    const { numerator } = parsed('(s+1)^20');
    let c = 1;
    const binomial = [1];
    for (let k = 1; k <= 20; k++) binomial.push((c = (c * (21 - k)) / k));
    expect(numerator).toEqual(binomial);
  });
});

describe('parseExpression — rejected input names the expression field', () => {
  it.each([
    ['x/(s+1)', 'uses "x"'],
    ['e/s', 'uses "e"'],
    ['s/(z+1)', 'uses "z"'],
  ])('rejects the unknown symbol in %s', (text, detail) => {
    const error = rejection(text);
    expect(error.issues[0].pointer).toBe(POINTER);
    expect(error.issues[0].detail).toContain(detail);
  });

  it('rejects the variable of the other domain', () => {
    expect(rejection('s/(s+1)', 'z').issues[0].detail).toContain('uses "s"');
  });

  it.each(['exp(-s)/(s+1)', 'sqrt(2)/s'])('rejects a function call such as %s', (text) => {
    expect(rejection(text).issues[0].detail).toContain('calls');
  });

  it.each(['s+*', '(s+1', '1/(s+1))', '3 % 2', 's == 1', '[1,2]', 's!'])('rejects %s as not a rational function', (text) => {
    expect(rejection(text).issues[0].pointer).toBe(POINTER);
  });

  it('rejects empty and blank expressions', () => {
    expect(rejection('').issues[0].detail).toContain('empty');
    expect(rejection('   ').issues[0].detail).toContain('empty');
  });

  it(`rejects an expression longer than ${MAX_EXPRESSION_LENGTH} characters`, () => {
    expect(rejection(`1/(s+1)${'+0'.repeat(MAX_EXPRESSION_LENGTH)}`).issues[0].detail).toContain('longer');
  });

  it('rejects division by zero, including by a polynomial that cancels to zero', () => {
    expect(rejection('1/0').issues[0].detail).toContain('divides by zero');
    expect(rejection('1/(s-s)').issues[0].detail).toContain('divides by zero');
  });

  it('rejects fractional powers, powers that depend on the variable, and powers beyond ±60', () => {
    expect(rejection('s^0.5').issues[0].detail).toContain('^0.5');
    expect(rejection('s^s').issues[0].detail).toContain('depends on s');
    expect(rejection('(s+1)^61').issues[0].detail).toContain('^61');
    expect(rejection('(s+1)^-61').issues[0].detail).toContain('^-61');
    expect(rejection('s^1e300').issues[0].pointer).toBe(POINTER);
  });

  it('rejects a number that overflows to infinity', () => {
    expect(rejection('1e400/s').issues[0].detail).toContain('not a finite number');
  });
});
