import { gainMargins } from './gain-margins';

// the gain margin as the factor (and its 20·log10 in dB) by which K may rise before instability:
// common practice in control engineering, stated here without a particular source
describe('gainMargins', () => {
  it('gives the usual gain margin of a loop stable from zero up to a limit', () => {
    const m = gainMargins([{ from: 0, to: 20 }], 2);
    expect(m.isStable).toBe(true);
    expect(m.limits).toEqual([{ gain: 20, ratio: 10, decibels: 20, direction: 'up' }]);
    expect(m.nearest?.gain).toBe(20);
  });

  it('gives both limits of a conditionally stable loop and picks the nearer one', () => {
    // stable only for 0.5 < K < 40: at K = 2 the lower limit (×4) is nearer than the upper (×20)
    const m = gainMargins([{ from: 0.5, to: 40 }], 2);
    expect(m.isStable).toBe(true);
    expect(m.limits.map((l) => [l.gain, l.ratio, l.direction])).toEqual([
      [40, 20, 'up'],
      [0.5, 4, 'down'],
    ]);
    expect(m.nearest).toMatchObject({ gain: 0.5, ratio: 4, direction: 'down' });
    expect(m.nearest!.decibels).toBeCloseTo(12.0412, 4);
  });

  it('has no limit when the loop is stable for every positive gain', () => {
    const m = gainMargins([{ from: 0, to: null }], 1e3);
    expect(m.isStable).toBe(true);
    expect(m.limits).toEqual([]);
    expect(m.nearest).toBeNull();
  });

  it('points an unstable gain to the nearest stable range in either direction', () => {
    const ranges = [{ from: 0, to: 1 }, { from: 10, to: 30 }];
    const between = gainMargins(ranges, 4);
    expect(between.isStable).toBe(false);
    expect(between.limits.map((l) => [l.gain, l.direction])).toEqual([
      [10, 'up'],
      [1, 'down'],
    ]);
    expect(between.nearest).toMatchObject({ gain: 10, ratio: 2.5, direction: 'up' });
    expect(gainMargins(ranges, 90).nearest).toMatchObject({ gain: 30, ratio: 3, direction: 'down' });
  });

  it('treats a gain exactly on a limit as not stable (the ranges are open)', () => {
    const m = gainMargins([{ from: 0, to: 20 }], 20);
    expect(m.isStable).toBe(false);
    expect(m.nearest).toMatchObject({ gain: 20, ratio: 1, decibels: 0 });
  });

  it('has nothing to say about a gain that is not positive', () => {
    expect(gainMargins([{ from: 0, to: 20 }], 0)).toEqual({ isStable: false, range: null, limits: [], nearest: null });
    expect(gainMargins([{ from: 0, to: 20 }], -3).nearest).toBeNull();
  });

  it('knows no stable gain when there is no stable range', () => {
    const m = gainMargins([], 5);
    expect(m.isStable).toBe(false);
    expect(m.limits).toEqual([]);
  });
});
