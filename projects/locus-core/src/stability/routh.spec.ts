import { describe, expect, it } from 'vitest';
import { fromRoots } from '../polynomial/from-roots';
import { routh } from './routh';

describe('routh', () => {
  it('accepts a cubic exactly when a1·a2 > a0·a3 (closed-form Hurwitz condition for cubics)', () => {
    // s³ + 2s² + 3s + 4: 2·3 = 6 > 4 → stable; s³ + s² + 2s + 8: 1·2 < 8 → two right-half-plane roots
    expect(routh([1, 2, 3, 4])).toEqual({ isStable: true, unstableCount: 0 });
    expect(routh([1, 1, 2, 8])).toEqual({ isStable: false, unstableCount: 2 });
  });

  it('counts right-half-plane roots of a polynomial built from known roots', () => {
    const p = fromRoots([{ re: 1, im: 2 }, { re: 1, im: -2 }, { re: -3, im: 0 }, { re: 0.5, im: 0 }]);
    expect(routh(p).unstableCount).toBe(3);
  });

  it('reports a root on the imaginary axis as not stable with no count', () => {
    expect(routh([1, 0, 4])).toEqual({ isStable: false, unstableCount: null });
  });
});
