import { locus } from '@polewright/locus-core';
import { crossingItems } from './crossing-list';

describe('crossingItems', () => {
  it('lists a conjugate pair of axis crossings once, at its gain and frequency', () => {
    // 1/(s(s+1)(s+2)): Routh gives K = 6 and ω = √2 at the crossing (by hand)
    const result = locus({ plant: { expression: '1/(s*(s+1)*(s+2))' } });
    const items = crossingItems(result.crossings, 's');
    expect(items.length).toBe(1);
    expect(items[0].gain).toBeCloseTo(6, 9);
    expect(items[0].text).toBe('K = 6: imaginary axis at ±1.414j (ω = 1.414 rad/s)');
  });

  it('orders several crossing gains of a conditionally stable loop and drops gains that are not positive', () => {
    const items = crossingItems(
      [
        { gain: 40, point: { re: 0, im: 3 } },
        { gain: -2, point: { re: 0, im: 0 } },
        { gain: 0.5, point: { re: 0, im: -1 } },
        { gain: 0.5, point: { re: 0, im: 1 } },
      ],
      's',
    );
    expect(items.map((i) => i.gain)).toEqual([0.5, 40]);
  });

  it('gives the angle on the unit circle for a sampled loop', () => {
    const items = crossingItems([{ gain: 2, point: { re: 0, im: 1 } }, { gain: 2, point: { re: 0, im: -1 } }, { gain: 3, point: { re: -1, im: 0 } }], 'z');
    expect(items.map((i) => i.text)).toEqual(['K = 2: unit circle at angle ±90°', 'K = 3: unit circle at z = −1']);
  });
});
