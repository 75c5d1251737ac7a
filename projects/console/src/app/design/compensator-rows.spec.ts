import { compensatorToSave, formatFigure, isIdentity, loopCompensatorOf, rootsOf, rootText, rowOfRoot, rowsOf, sameCompensator } from './compensator-rows';

describe('compensator rows', () => {
  it('puts a conjugate pair on one row and keeps real roots on their own', () => {
    const roots = [{ re: -5, im: 0 }, { re: -1, im: 2 }, { re: -1, im: -2 }, { re: -0.5, im: 0 }];
    expect(rowsOf(roots)).toEqual([{ re: -5, im: 0 }, { re: -1, im: 2 }, { re: -0.5, im: 0 }]);
    expect(rootsOf(rowsOf(roots))).toEqual([{ re: -5, im: 0 }, { re: -1, im: 2 }, { re: -1, im: -2 }, { re: -0.5, im: 0 }]);
  });

  it('accepts a pair listed lower member first, and a negative imaginary part typed in a row', () => {
    expect(rowsOf([{ re: -3, im: -4 }, { re: -3, im: 4 }])).toEqual([{ re: -3, im: 4 }]);
    expect(rootsOf([{ re: -3, im: -4 }])).toEqual([{ re: -3, im: 4 }, { re: -3, im: -4 }]);
  });

  it('finds the row of a root the API names by its index', () => {
    const roots = [{ re: -5, im: 0 }, { re: -1, im: 2 }, { re: -1, im: -2 }, { re: -0.5, im: 0 }];
    expect([0, 1, 2, 3].map((i) => rowOfRoot(roots, i))).toEqual([0, 1, 1, 2]);
    expect(rowOfRoot(roots, 9)).toBe(-1);
  });

  it('fills the API’s optional fields and saves a compensator that does nothing as null', () => {
    expect(loopCompensatorOf({ zeros: [{ re: -2 }] })).toEqual({ zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 });
    expect(loopCompensatorOf(null)).toBeNull();
    expect(isIdentity({ zeros: [], poles: [], gain: 1 })).toBe(true);
    expect(compensatorToSave({ zeros: [], poles: [], gain: 1 })).toBeNull();
    expect(compensatorToSave({ zeros: [{ re: -2, im: 0 }], poles: [], gain: 3 })).toEqual({ zeros: [{ re: -2, im: 0 }], poles: [], gain: 3 });
  });

  it('compares compensators as transfer functions: order of roots aside, null like no compensator', () => {
    const a = { zeros: [{ re: -1, im: 2 }, { re: -1, im: -2 }, { re: -4, im: 0 }], poles: [], gain: 2 };
    const b = { zeros: [{ re: -4, im: 0 }, { re: -1, im: -2 }, { re: -1, im: 2 }], poles: [], gain: 2 };
    expect(sameCompensator(a, b)).toBe(true);
    expect(sameCompensator(a, { ...b, gain: 2.5 })).toBe(false);
    expect(sameCompensator(null, { zeros: [], poles: [], gain: 1 })).toBe(true);
    expect(sameCompensator(null, a)).toBe(false);
  });

  it('writes roots and figures as engineers read them', () => {
    expect(rootText({ re: -1, im: 3 })).toBe('−1 ± 3j');
    expect(rootText({ re: -2.5, im: 0 })).toBe('−2.5');
    expect(formatFigure(99.88838285)).toBe('99.89');
    expect(formatFigure(0.00004)).toBe('4e−5');
    expect(formatFigure(Infinity)).toBe('∞');
  });
});
