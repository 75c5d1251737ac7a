import type { ClosedLoopPole } from '@polewright/locus-core';
import { poleRows } from './pole-rows';

const pole = (re: number, im: number, timeConstant: number | null, isStable = true): ClosedLoopPole => ({
  re, im, dampingRatio: 0, naturalFrequency: Math.hypot(re, im), timeConstant, isStable,
});

describe('poleRows', () => {
  it('folds each conjugate pair into one row written a ± bj', () => {
    const rows = poleRows([pole(-1, -2, 1), pole(-3, 0, 1 / 3), pole(-1, 2, 1)]);
    expect(rows.map((r) => [r.value, r.isPair])).toEqual([
      ['−1 ± 2j', true],
      ['−3', false],
    ]);
    expect(rows[0].pole.im).toBe(2);
  });

  it('lists unstable poles first, then from the slowest to the fastest decay', () => {
    const rows = poleRows([pole(-10, 0, 0.1), pole(0.5, 0, null, false), pole(-0.2, 0, 5), pole(-2, 0, 0.5)]);
    expect(rows.map((r) => r.value)).toEqual(['0.5', '−0.2', '−2', '−10']);
  });

  it('keeps repeated real poles as separate rows', () => {
    expect(poleRows([pole(-1, 0, 1), pole(-1, 0, 1)]).length).toBe(2);
  });
});
