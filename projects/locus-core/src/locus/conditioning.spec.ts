import { describe, expect, it } from 'vitest';
import { fromRoots } from '../polynomial/from-roots';
import { roots } from '../polynomial/roots';
import { conditioningWarnings } from './conditioning';

describe('conditioningWarnings', () => {
  it('stays quiet for a well-separated low-order plant', () => {
    const d = fromRoots([{ re: -1, im: 0 }, { re: -3, im: 2 }, { re: -3, im: -2 }, { re: -10, im: 0 }]);
    expect(conditioningWarnings(d, roots(d), 10)).toEqual([]);
  });

  it('stays quiet for repeated poles, whose sensitivity is expected', () => {
    const d = fromRoots([{ re: 0, im: 0 }, { re: 0, im: 0 }, { re: -2, im: 0 }]);
    expect(conditioningWarnings(d, roots(d), 2)).toEqual([]);
  });

  it('warns for twenty equally spaced real poles (Wilkinson-like sensitivity)', () => {
    // poles −1 … −20: the classic example of hypersensitive roots (J. H. Wilkinson, "Rounding Errors
    // in Algebraic Processes", 1963)
    const d = fromRoots(Array.from({ length: 20 }, (_, k) => ({ re: -(k + 1), im: 0 })));
    const warnings = conditioningWarnings(d, roots(d), 19);
    expect(warnings.map((w) => w.code)).toEqual(['ill-conditioned-polynomial']);
  });

  it('names the numerator when it is the zeros that are hypersensitive', () => {
    // eighteen real zeros packed into [−12, −0.5] (Wilkinson-like clustering of a numerator)
    const n = fromRoots(Array.from({ length: 18 }, (_, k) => ({ re: -0.5 - (11.5 * k) / 17, im: 0 })));
    const warnings = conditioningWarnings(n, roots(n), 12, 'zero');
    expect(warnings).toHaveLength(1);
    expect(warnings[0].message).toContain('numerator');
    expect(warnings[0].message).toContain('open-loop zero');
  });
});
