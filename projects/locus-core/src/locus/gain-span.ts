import type { Complex } from '../complex/complex';
import type { Polynomial } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';
import type { Region } from './region';
import { characteristic } from './stable-ranges';

/**
 * Smallest gain (of the given sign, in steps of ×4 from `start`) at which every branch is visibly
 * home: one closed-loop pole within 3 % of the region size of each finite zero, and every other pole
 * at least three region sizes from the centre, i.e. well out along its asymptote. Capped at 10¹² K₀.
 */
export function automaticEndGain(
  numerator: Polynomial,
  denominator: Polynomial,
  zeros: readonly Complex[],
  region: Region,
  gainScale: number,
  start: number,
  sign: 1 | -1,
): number {
  const cap = gainScale * 1e12;
  let k = Math.max(start, gainScale);
  for (let i = 0; i < 80 && k < cap; i++) {
    if (isHome(roots(characteristic(numerator, denominator, sign * k)), zeros, region)) return sign * k;
    k *= 4;
  }
  return sign * Math.min(k, cap);
}

function isHome(poles: readonly Complex[], zeros: readonly Complex[], region: Region): boolean {
  const free = poles.slice();
  for (const z of zeros) {
    let best = -1;
    let bestDistance = Infinity;
    free.forEach((p, j) => {
      const d = Math.hypot(p.re - z.re, p.im - z.im);
      if (d < bestDistance) {
        bestDistance = d;
        best = j;
      }
    });
    if (best < 0 || bestDistance > 0.03 * region.scale) return false;
    free.splice(best, 1);
  }
  return free.every((p) => Math.hypot(p.re - region.center, p.im) >= 3 * region.scale);
}
