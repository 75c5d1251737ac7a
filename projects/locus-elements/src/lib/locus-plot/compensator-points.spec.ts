import { addPoint, handlesOf, movePoint, removePoint } from './compensator-points';

describe('compensator points', () => {
  it('adds a real point near the real axis and a conjugate pair off it', () => {
    const real = addPoint(null, 'zero', { re: -2, im: 0.01 }, 0.05);
    expect(real).toEqual({ zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 });
    const pair = addPoint(real, 'pole', { re: -3, im: -4 }, 0.05);
    expect(pair.poles).toEqual([
      { re: -3, im: 4 },
      { re: -3, im: -4 },
    ]);
    expect(pair.zeros).toEqual(real.zeros);
  });

  it('offers one handle per real point and per conjugate pair (the upper member)', () => {
    const c = { zeros: [{ re: -1, im: -2 }, { re: -5, im: 0 }, { re: -1, im: 2 }], poles: [{ re: -8, im: 0 }], gain: 2 };
    const handles = handlesOf(c);
    expect(handles.map((h) => [h.kind, h.point.re, h.point.im])).toEqual([
      ['zero', -1, 2],
      ['zero', -5, 0],
      ['pole', -8, 0],
    ]);
    expect(handles[0].partner).toBe(0);
    expect(handles[0].index).toBe(2);
  });

  it('moves a pair mirrored and a real point along the real axis', () => {
    const c = { zeros: [{ re: -1, im: 2 }, { re: -1, im: -2 }], poles: [{ re: -8, im: 0 }], gain: 1 };
    const [pair, real] = handlesOf(c);
    const moved = movePoint(c, pair, { re: -3, im: -1 }, 0.01);
    expect(moved.zeros).toEqual([
      { re: -3, im: 1 },
      { re: -3, im: -1 },
    ]);
    expect(movePoint(c, real, { re: -6, im: 3 }, 0.01).poles).toEqual([{ re: -6, im: 0 }]);
    // a pair dragged onto the axis stays a pair, just above it
    expect(movePoint(c, pair, { re: -2, im: 0 }, 0.01).zeros[0].im).toBe(0.01);
  });

  it('removes a pair with its partner and gives null once the compensator is empty', () => {
    const c = { zeros: [{ re: -1, im: 2 }, { re: -1, im: -2 }], poles: [], gain: 1 };
    expect(removePoint(c, handlesOf(c)[0])).toBeNull();
    const withGain = { ...c, gain: 3 };
    expect(removePoint(withGain, handlesOf(withGain)[0])).toEqual({ zeros: [], poles: [], gain: 3 });
  });
});
