import { arg, type Complex } from '../complex/complex';
import type { Polynomial } from '../polynomial/polynomial';
import { normalizeDegrees } from './asymptotes';

/**
 * Angles at which branches leave complex open-loop poles (departure) or reach complex zeros
 * (arrival), from the angle condition ∠(K·N(x)/D(x)) = 180° for K > 0 (0° for K < 0) applied next to
 * the pole or zero. A point of multiplicity q gets q angles, 360°/q apart. Degrees in (−180°, 180°].
 * Example: poles −1 ± j and no zeros (c = 1): departure +90° at −1 + j and −90° at −1 − j
 * (the roots −1 ± j√(1 + K) of s² + 2s + 2 + K move straight apart).
 */
export function departureAndArrivalAngles(
  numerator: Polynomial,
  denominator: Polynomial,
  poles: readonly Complex[],
  zeros: readonly Complex[],
  negativeGain = false,
): { departureAngles: { pole: Complex; angleDeg: number }[]; arrivalAngles: { zero: Complex; angleDeg: number }[] } {
  const leadAngle = numerator[0] / denominator[0] > 0 ? 0 : 180;
  const target = negativeGain ? 0 : 180;
  const departureAngles: { pole: Complex; angleDeg: number }[] = [];
  for (const group of groups(poles)) {
    const p = group.value;
    if (Math.abs(p.im) <= 1e-12 * Math.max(1, Math.abs(p.re))) continue;
    const fromZeros = sumAngles(p, zeros, null);
    const fromPoles = sumAngles(p, poles, group.members);
    for (let l = 0; l < group.members.length; l++) {
      const angle = (leadAngle + fromZeros - fromPoles - target + 360 * l) / group.members.length;
      departureAngles.push({ pole: p, angleDeg: normalizeDegrees(angle) });
    }
  }
  const arrivalAngles: { zero: Complex; angleDeg: number }[] = [];
  for (const group of groups(zeros)) {
    const z = group.value;
    if (Math.abs(z.im) <= 1e-12 * Math.max(1, Math.abs(z.re))) continue;
    const fromZeros = sumAngles(z, zeros, group.members);
    const fromPoles = sumAngles(z, poles, null);
    for (let l = 0; l < group.members.length; l++) {
      const angle = (target - leadAngle - fromZeros + fromPoles + 360 * l) / group.members.length;
      arrivalAngles.push({ zero: z, angleDeg: normalizeDegrees(angle) });
    }
  }
  return { departureAngles, arrivalAngles };
}

function sumAngles(at: Complex, points: readonly Complex[], skip: readonly number[] | null): number {
  let sum = 0;
  points.forEach((q, i) => {
    if (skip?.includes(i)) return;
    const d = { re: at.re - q.re, im: at.im - q.im };
    if (d.re === 0 && d.im === 0) return;
    sum += (arg(d) * 180) / Math.PI;
  });
  return sum;
}

function groups(points: readonly Complex[]): { value: Complex; members: number[] }[] {
  const out: { value: Complex; members: number[] }[] = [];
  points.forEach((p, i) => {
    const scale = Math.max(1, Math.hypot(p.re, p.im));
    const found = out.find((g) => Math.hypot(g.value.re - p.re, g.value.im - p.im) <= 1e-6 * scale);
    if (found) found.members.push(i);
    else out.push({ value: p, members: [i] });
  });
  return out;
}
