import { describe, expect, it } from 'vitest';
import { isWithin } from './tolerance';

describe('the shared tolerance helper', () => {
  it('accepts a value inside the relative band and rejects one just outside it', () => {
    expect(isWithin(1 + 0.9e-9, 1, 1e-9)).toBe(true);
    expect(isWithin(1 + 1.1e-9, 1, 1e-9)).toBe(false);
  });

  it('demands an exact zero when the reference is zero and no absolute floor is given', () => {
    expect(isWithin(0, 0, 1e-9)).toBe(true);
    expect(isWithin(1e-300, 0, 1e-9)).toBe(false);
    expect(isWithin(1e-13, 0, 1e-9, 1e-12)).toBe(true);
  });

  it('lets NaN match only NaN and infinities match only the same infinity', () => {
    expect(isWithin(NaN, NaN, 1e-9)).toBe(true);
    expect(isWithin(NaN, 1, 1)).toBe(false);
    expect(isWithin(1, NaN, 1)).toBe(false);
    expect(isWithin(Infinity, Infinity, 1e-9)).toBe(true);
    expect(isWithin(-Infinity, Infinity, 1e-9)).toBe(false);
    expect(isWithin(1e308, Infinity, 1)).toBe(false);
  });
});
