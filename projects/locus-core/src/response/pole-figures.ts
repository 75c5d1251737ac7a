import type { Complex } from '../complex/complex';
import type { Domain } from '../types/plant';
import type { ClosedLoopPole } from '../types/results';

/**
 * Damping ratio, natural frequency and time constant of a closed-loop pole. z-poles are mapped to the
 * s-plane through s = ln(z)/T (principal branch). A pole at the s-plane origin gets ζ = 0 (it does not
 * decay); a z-pole at the origin settles in one sample: ζ = 1, ωn = null (unbounded), τ = 0.
 * Example: s = −3 + 4j gives ζ = 0.6, ωn = 5 rad/s, τ = 1/3 s.
 */
export function poleFigures(pole: Complex, domain: Domain, sampleTime: number | null): ClosedLoopPole {
  let s = pole;
  if (domain === 'z') {
    const modulus = Math.hypot(pole.re, pole.im);
    if (modulus === 0) return { re: pole.re, im: pole.im, dampingRatio: 1, naturalFrequency: null, timeConstant: 0, isStable: true };
    const t = sampleTime as number;
    s = { re: Math.log(modulus) / t, im: Math.atan2(pole.im, pole.re) / t };
  }
  const wn = Math.hypot(s.re, s.im);
  const zeta = wn === 0 ? 0 : -s.re / wn;
  const isStable = domain === 's' ? pole.re < 0 : Math.hypot(pole.re, pole.im) < 1;
  return {
    re: pole.re,
    im: pole.im,
    dampingRatio: zeta,
    naturalFrequency: wn,
    timeConstant: s.re < 0 ? -1 / s.re : null,
    isStable,
  };
}
