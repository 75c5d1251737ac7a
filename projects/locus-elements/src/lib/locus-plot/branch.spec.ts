import { clipSegment, pixelPieces, pointAtGain } from './branch';
import { frameOf } from './plot-frame';

describe('branch geometry', () => {
  const box = { x0: 0, x1: 100, y0: 0, y1: 50 };

  it('keeps a segment inside the box whole', () => {
    expect(clipSegment([10, 10], [90, 40], box)).toEqual([[10, 10], [90, 40], false]);
  });

  it('cuts a segment leaving the box at the edge and says its end was cut', () => {
    const clipped = clipSegment([50, 25], [150, 25], box);
    expect(clipped?.[1]).toEqual([100, 25]);
    expect(clipped?.[2]).toBe(true);
  });

  it('drops a segment entirely outside the box', () => {
    expect(clipSegment([200, 10], [300, 40], box)).toBeNull();
    expect(clipSegment([Infinity, 10], [30, 40], box)).toBeNull();
  });

  it('splits a branch that leaves the kept box and comes back into two pieces', () => {
    const frame = frameOf({ width: 200, height: 200 }, { minRe: -1, maxRe: 1, minIm: -1, maxIm: 1 });
    const far = 1e6;
    const pieces = pixelPieces(
      [
        { re: 0, im: 0 },
        { re: 0.5, im: 0 },
        { re: far, im: 0 },
        { re: far, im: 1 },
        { re: 0.5, im: 0.5 },
        { re: 0, im: 0.5 },
      ],
      frame,
    );
    expect(pieces.length).toBe(2);
    // no coordinate grows far beyond the drawing, however far the plane point
    expect(Math.max(...pieces.flat().map(([x]) => x))).toBeLessThan(2000);
  });

  it('interpolates a branch point between the traced gains around it', () => {
    const points = [
      { gain: 0, re: -2, im: 0 },
      { gain: 1, re: -1, im: 0 },
      { gain: 3, re: -1, im: 2 },
    ];
    expect(pointAtGain(points, 2)).toEqual({ re: -1, im: 1 });
    expect(pointAtGain(points, 0.5)).toEqual({ re: -1.5, im: 0 });
    expect(pointAtGain(points, 4)).toBeNull();
  });
});
