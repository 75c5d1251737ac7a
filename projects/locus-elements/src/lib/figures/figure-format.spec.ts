import { decibels, formatComplex, formatFigure } from './figure-format';

describe('formatFigure', () => {
  it('keeps four significant digits in the ordinary range', () => {
    expect(formatFigure(14269.963)).toBe('14,270');
    expect(formatFigure(0.0123456)).toBe('0.01235');
    expect(formatFigure(-2.5)).toBe('−2.5');
  });

  it('switches to scientific notation for very large and very small figures', () => {
    expect(formatFigure(3.2e-5)).toBe('3.2×10⁻⁵');
    expect(formatFigure(-4.5e9)).toBe('−4.5×10⁹');
    expect(formatFigure(1.23456e12)).toBe('1.23×10¹²');
  });

  it('shows a dash for what does not exist', () => {
    expect(formatFigure(null)).toBe('—');
    expect(formatFigure(Number.NaN)).toBe('—');
    expect(formatFigure(0)).toBe('0');
  });
});

describe('formatComplex', () => {
  it('writes conjugate pairs with ± and single values with their sign', () => {
    expect(formatComplex({ re: -1, im: 2 }, true)).toBe('−1 ± 2j');
    expect(formatComplex({ re: -1, im: -2 })).toBe('−1 − 2j');
    expect(formatComplex({ re: 0.5, im: 0 })).toBe('0.5');
  });
});

describe('decibels', () => {
  it('is 20·log10 of an amplitude ratio', () => {
    expect(decibels(10)).toBeCloseTo(20, 12);
    expect(decibels(2)).toBeCloseTo(6.0206, 4);
  });
});
