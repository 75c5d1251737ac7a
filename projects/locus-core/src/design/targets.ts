import type { Complex } from '../complex/complex';
import { ValidationError } from '../errors';
import { poleFigures } from '../response/pole-figures';
import type { Domain } from '../types/plant';
import type { DesignTargets } from '../types/results';

/** The design targets as a region of the s-plane (z-poles are judged through s = ln(z)/T). */
export interface TargetRegion {
  readonly minDampingRatio: number | null;
  /** Smallest decay rate σ = −Re s in 1/s, from the settling-time target. */
  readonly minDecayRate: number | null;
  readonly naturalFrequency: { readonly min: number | null; readonly max: number | null };
}

/**
 * Turns targets into a region: overshoot into a damping ratio through the second-order relation
 * ζ = −ln(OS)/√(π² + ln²(OS)), settling time into a decay rate through Ts ≈ 4/(ζωn) for the 2 % band
 * (both standard second-order approximations, e.g. Ogata, "Modern Control Engineering", 5th ed.,
 * §5-3 — recalled from memory); the tighter of two damping bounds wins.
 * Example: 5 % overshoot gives ζ ≈ 0.690; Ts = 2 s gives σ ≥ 2 s⁻¹.
 */
export function targetRegion(targets: DesignTargets | undefined): TargetRegion {
  if (targets === undefined) return { minDampingRatio: null, minDecayRate: null, naturalFrequency: { min: null, max: null } };
  if (typeof targets !== 'object' || targets === null || Array.isArray(targets)) throw ValidationError.at('/targets', 'must be an object');
  const { minDampingRatio, maxSettlingTime, maxOvershootPct, naturalFrequency } = targets;
  if (minDampingRatio !== undefined && !(typeof minDampingRatio === 'number' && minDampingRatio > 0 && minDampingRatio < 1)) {
    throw ValidationError.at('/targets/minDampingRatio', 'must be a number between 0 and 1 (exclusive)');
  }
  if (maxSettlingTime !== undefined && !(typeof maxSettlingTime === 'number' && Number.isFinite(maxSettlingTime) && maxSettlingTime > 0)) {
    throw ValidationError.at('/targets/maxSettlingTime', 'must be a positive number of seconds');
  }
  if (maxOvershootPct !== undefined && !(typeof maxOvershootPct === 'number' && maxOvershootPct > 0 && maxOvershootPct < 100)) {
    throw ValidationError.at('/targets/maxOvershootPct', 'must be a percentage above 0 and below 100');
  }
  let band = { min: null as number | null, max: null as number | null };
  if (naturalFrequency !== undefined) {
    if (typeof naturalFrequency !== 'object' || naturalFrequency === null || Array.isArray(naturalFrequency)) throw ValidationError.at('/targets/naturalFrequency', 'must be an object { "min": rad/s, "max": rad/s }');
    const { min, max } = naturalFrequency;
    if (min !== undefined && !(typeof min === 'number' && Number.isFinite(min) && min >= 0)) throw ValidationError.at('/targets/naturalFrequency/min', 'must be a number of rad/s, zero or more');
    if (max !== undefined && !(typeof max === 'number' && Number.isFinite(max) && max > 0)) throw ValidationError.at('/targets/naturalFrequency/max', 'must be a positive number of rad/s');
    if (min !== undefined && max !== undefined && min >= max) throw ValidationError.at('/targets/naturalFrequency/min', 'must be below naturalFrequency.max');
    band = { min: min ?? null, max: max ?? null };
  }
  let zeta: number | null = minDampingRatio ?? null;
  if (maxOvershootPct !== undefined) {
    const l = Math.log(maxOvershootPct / 100);
    const fromOvershoot = -l / Math.sqrt(Math.PI * Math.PI + l * l);
    zeta = zeta === null ? fromOvershoot : Math.max(zeta, fromOvershoot);
  }
  return { minDampingRatio: zeta, minDecayRate: maxSettlingTime !== undefined ? 4 / maxSettlingTime : null, naturalFrequency: band };
}

/** Whether one pole lies in the region (and is stable). */
export function meetsRegion(pole: Complex, region: TargetRegion, domain: Domain, sampleTime: number | null): boolean {
  const f = poleFigures(pole, domain, sampleTime);
  if (!f.isStable) return false;
  const tiny = 1e-12;
  if (region.minDampingRatio !== null && f.dampingRatio < region.minDampingRatio - tiny) return false;
  const decay = f.timeConstant === null ? 0 : f.timeConstant === 0 ? Infinity : 1 / f.timeConstant;
  if (region.minDecayRate !== null && decay < region.minDecayRate * (1 - tiny)) return false;
  const wn = f.naturalFrequency ?? Infinity;
  if (region.naturalFrequency.min !== null && wn < region.naturalFrequency.min * (1 - tiny)) return false;
  if (region.naturalFrequency.max !== null && wn > region.naturalFrequency.max * (1 + tiny)) return false;
  return true;
}

/**
 * The poles that are judged: all of them, or the dominant ones — the slowest pole (largest Re s, or
 * largest |z|) together with its conjugate.
 */
export function judgedPoles(poles: readonly Complex[], domain: Domain, dominantOnly: boolean): Complex[] {
  if (!dominantOnly || poles.length === 0) return [...poles];
  const slowness = (p: Complex): number => (domain === 's' ? p.re : Math.hypot(p.re, p.im));
  const slowest = poles.reduce((best, p) => (slowness(p) > slowness(best) ? p : best), poles[0]);
  return poles.filter((p) => Math.abs(p.re - slowest.re) <= 1e-12 * Math.max(1, Math.abs(p.re)) && Math.abs(Math.abs(p.im) - Math.abs(slowest.im)) <= 1e-12 * Math.max(1, Math.abs(p.im)));
}
