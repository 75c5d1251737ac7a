import type { Polynomial } from '../polynomial/polynomial';
import type { Domain } from '../types/plant';
import { bilinearStability } from './bilinear';
import { routh, type StabilityVerdict } from './routh';

/** Which exact test certified a verdict. */
export type StabilityTest = 'routh-hurwitz' | 'bilinear-routh-hurwitz';

/**
 * Exact stability verdict for a characteristic polynomial: Routh–Hurwitz in the s-plane; in the
 * z-plane the bilinear map followed by Routh–Hurwitz, both in exact integer arithmetic.
 */
export function stabilityOf(characteristic: Polynomial, domain: Domain): StabilityVerdict & { test: StabilityTest } {
  return domain === 's' ? { ...routh(characteristic), test: 'routh-hurwitz' } : { ...bilinearStability(characteristic), test: 'bilinear-routh-hurwitz' };
}
