import type { Polynomial } from '../polynomial/polynomial';
import type { Domain } from '../types/plant';
import { jury } from './jury';
import { routh, type StabilityVerdict } from './routh';

/**
 * Exact stability verdict for a characteristic polynomial: Routh–Hurwitz in the s-plane, Jury in the
 * z-plane.
 */
export function stabilityOf(characteristic: Polynomial, domain: Domain): StabilityVerdict & { test: 'routh-hurwitz' | 'jury' } {
  return domain === 's' ? { ...routh(characteristic), test: 'routh-hurwitz' } : { ...jury(characteristic), test: 'jury' };
}
