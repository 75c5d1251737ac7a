import { nearestLimit } from './gain-standing';

describe('nearestLimit', () => {
  it('gives the usual gain margin for a loop stable below a limit', () => {
    const limit = nearestLimit([{ from: 0, to: 20 }], 2);
    expect(limit?.gain).toBe(20);
    expect(limit?.direction).toBe('up');
    expect(limit?.ratio).toBeCloseTo(10, 12);
    expect(limit?.decibels).toBeCloseTo(20, 12);
  });

  it('picks the nearer end of a conditionally stable range', () => {
    // the hoist loop of the demo is stable for 23.68 < K < 481.2 (values from the engine)
    const ranges = [{ from: 23.68, to: 481.2 }];
    expect(nearestLimit(ranges, 99.89)).toMatchObject({ gain: 23.68, direction: 'down' });
    expect(nearestLimit(ranges, 300)).toMatchObject({ gain: 481.2, direction: 'up' });
  });

  it('for an unstable gain, names the nearest stable range end', () => {
    expect(nearestLimit([{ from: 23.68, to: 481.2 }], 10)).toMatchObject({ gain: 23.68, direction: 'up' });
    expect(nearestLimit([{ from: 0, to: 16.7 }], 40)).toMatchObject({ gain: 16.7, direction: 'down' });
  });

  it('has nothing to say when no limit exists or the gain is not positive', () => {
    expect(nearestLimit([{ from: 0, to: null }], 5)).toBeNull();
    expect(nearestLimit([], 5)).toBeNull();
    expect(nearestLimit([{ from: 0, to: 10 }], 0)).toBeNull();
  });
});
