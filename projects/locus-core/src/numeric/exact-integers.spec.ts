import { describe, expect, it } from 'vitest';
import { exactIntegers } from './exact-integers';

describe('exactIntegers', () => {
  it('scales doubles to integers by one common power of two without rounding', () => {
    // 0.5 = 1·2⁻¹ and 3 = 3·2⁰: the common factor is 2¹
    expect(exactIntegers([0.5, 3])).toEqual([1n, 6n]);
  });

  it('keeps every value exactly: each integer divided by the same power of two gives back the double', () => {
    const values = [-0.1, 0, 0.375, 12345.678, -3, 1e-20];
    const ints = exactIntegers(values);
    // the common scale 2^s is set by 1e-20, the finest value; find s from that element exactly
    let s = 0;
    while (Number(ints[5]) / 2 ** s !== 1e-20 && s < 1100) s++;
    expect(s).toBeLessThan(1100);
    values.forEach((v, i) => expect(Number(ints[i]) / 2 ** s).toBe(v));
    expect(ints.every((n) => typeof n === 'bigint')).toBe(true);
  });

  it('turns an all-zero list into zeros', () => {
    expect(exactIntegers([0, 0])).toEqual([0n, 0n]);
  });
});
