import { describe, expect, it } from 'vitest';
import { canonicalJson, contentHash } from './content-hash.js';

describe('contentHash', () => {
  it('writes object keys in sorted order at every level', () => {
    expect(canonicalJson({ b: 1, a: [2, { d: 3, c: 4 }] })).toBe('{"a":[2,{"c":4,"d":3}],"b":1}');
  });

  it('does not depend on key order, and changes when a coefficient changes', () => {
    const a = contentHash({ plant: { numerator: [1], denominator: [1, 2] }, compensator: null });
    const b = contentHash({ plant: { denominator: [1, 2], numerator: [1] }, compensator: null });
    const c = contentHash({ plant: { numerator: [1], denominator: [1, 2.0001] }, compensator: null });
    expect(a).toBe(b);
    expect(a).not.toBe(c);
    expect(a).toMatch(/^[0-9a-f]{64}$/);
  });

  it('tells a loop with a compensator from the bare plant', () => {
    const plant = { expression: '1/(s+1)' };
    expect(contentHash({ plant, compensator: null })).not.toBe(contentHash({ plant, compensator: { zeros: [], poles: [], gain: 2 } }));
  });
});
