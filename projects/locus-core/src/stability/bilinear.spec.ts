import { describe, expect, it } from 'vitest';
import { fromRoots } from '../polynomial/from-roots';
import { bilinear, bilinearStability } from './bilinear';
import { jury } from './jury';

describe('bilinear map and exact Schur test', () => {
  it('maps a root z inside the unit circle to w = (z − 1)/(z + 1) in the left half-plane', () => {
    // z = 0.5 ↦ w = (0.5 − 1)/(0.5 + 1) = −1/3; the map's own inverse, so this is a direct check
    const w = bilinear([1, -0.5]);
    expect(-w[1] / w[0]).toBeCloseTo(-1 / 3, 14);
  });

  it('agrees with the Jury test on polynomials built from known roots', () => {
    const inside = fromRoots([{ re: 0.9, im: 0.3 }, { re: 0.9, im: -0.3 }, { re: -0.95, im: 0 }, { re: 0.2, im: 0 }]);
    const outside = fromRoots([{ re: 0.9, im: 0.5 }, { re: 0.9, im: -0.5 }, { re: -0.5, im: 0 }]); // |0.9 ± 0.5j| > 1
    expect(bilinearStability(inside).isStable).toBe(true);
    expect(jury(inside).isStable).toBe(true);
    expect(bilinearStability(outside).isStable).toBe(false);
    expect(jury(outside).isStable).toBe(false);
  });

  it('reports a root on the unit circle as not stable, including z = −1 where the degree drops', () => {
    expect(bilinearStability(fromRoots([{ re: -1, im: 0 }, { re: 0.5, im: 0 }])).isStable).toBe(false);
    expect(bilinearStability(fromRoots([{ re: 0, im: 1 }, { re: 0, im: -1 }])).isStable).toBe(false);
    expect(bilinearStability(fromRoots([{ re: 1, im: 0 }])).isStable).toBe(false);
  });

  it('stays exact at degree 40 where a floating-point table would be noise', () => {
    // forty roots on a circle of radius 0.99 (inside) and the same with one pair pushed to radius 1.01
    const ring = (r: number, bump: boolean): { re: number; im: number }[] =>
      Array.from({ length: 20 }, (_, k) => {
        const a = (Math.PI * (k + 0.5)) / 20;
        const radius = bump && k === 3 ? 1.01 : r;
        return [{ re: radius * Math.cos(a), im: radius * Math.sin(a) }, { re: radius * Math.cos(a), im: -radius * Math.sin(a) }];
      }).flat();
    expect(bilinearStability(fromRoots(ring(0.99, false))).isStable).toBe(true);
    expect(bilinearStability(fromRoots(ring(0.99, true))).isStable).toBe(false);
  });
});
