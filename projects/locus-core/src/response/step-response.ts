import type { Complex } from '../complex/complex';
import { realizeCascade } from '../plant/cascade';
import { heldStep, multiplyVector } from '../plant/zero-order-hold';
import { padTo, type Polynomial } from '../polynomial/polynomial';
import type { Domain } from '../types/plant';

/** Largest number of samples a step response may have. */
export const MAX_STEP_POINTS = 20000;

/** A closed loop b/a with its zeros (roots of b) and poles (roots of a), already computed. */
export interface ClosedLoopSystem {
  readonly b: Polynomial;
  readonly a: Polynomial;
  readonly zeros: readonly Complex[];
  readonly poles: readonly Complex[];
}

/**
 * Unit-step response of the closed loop b/a, exact at the samples: for s-loops by the exact
 * discretisation of a cascade state-space realisation over the sample interval (a step input is constant,
 * so a zero-order hold represents it without error), for z-loops by the difference equation itself.
 */
export function stepSeries(system: ClosedLoopSystem, domain: Domain, sampleTime: number | null, duration: number, points: number): { time: number[]; output: number[] } {
  const { b, a } = system;
  if (domain === 'z') {
    const t = sampleTime as number;
    const count = Math.max(2, Math.min(MAX_STEP_POINTS, points));
    const n = a.length - 1;
    const bb = padTo(b, n + 1);
    const output: number[] = [];
    const time: number[] = [];
    // a₀y[k] + a₁y[k−1] + … = b₀u[k] + b₁u[k−1] + …, u[k] = 1 for k ≥ 0
    for (let k = 0; k < count; k++) {
      let acc = 0;
      for (let i = 0; i <= n && i <= k; i++) acc += bb[i];
      for (let i = 1; i <= n && i <= k; i++) acc -= a[i] * output[k - i];
      output.push(acc / a[0]);
      time.push(k * t);
    }
    return { time, output };
  }
  const model = realizeCascade(b[0] / a[0], system.zeros, system.poles);
  const h = duration / (points - 1);
  const { phi, gamma } = heldStep(model, h);
  let x = new Array<number>(model.a.length).fill(0);
  const time: number[] = [];
  const output: number[] = [];
  for (let k = 0; k < points; k++) {
    time.push(k * h);
    output.push(model.c.reduce((acc, c, i) => acc + c * x[i], model.d));
    const next = multiplyVector(phi, x);
    x = next.map((v, i) => v + gamma[i]);
  }
  return { time, output };
}

/**
 * A record length that shows the response settle (about 1.5 × the 2 % settling estimate 4/σ of the
 * slowest pole), or a few growth times or periods for loops that do not settle, and a sample count
 * that resolves the fastest oscillation (about 20 samples a period, within 200…4000).
 */
export function automaticSpan(poles: readonly Complex[], domain: Domain, sampleTime: number | null): { duration: number; points: number } {
  const sPoles = domain === 's' ? poles : poles.filter((p) => Math.hypot(p.re, p.im) > 0).map((p) => ({ re: Math.log(Math.hypot(p.re, p.im)) / (sampleTime as number), im: Math.atan2(p.im, p.re) / (sampleTime as number) }));
  const fastest = Math.max(0, ...sPoles.map((p) => Math.hypot(p.re, p.im)));
  const scale = fastest > 0 ? fastest : 1;
  const unstable = sPoles.filter((p) => p.re > 1e-9 * scale);
  const marginal = sPoles.filter((p) => Math.abs(p.re) <= 1e-9 * scale);
  let duration: number;
  if (unstable.length > 0) duration = 6 / Math.max(...unstable.map((p) => p.re));
  else if (marginal.length > 0) {
    const w = Math.max(0, ...marginal.map((p) => Math.abs(p.im)));
    duration = w > 0 ? (10 * 2 * Math.PI) / w : 10 / scale;
  } else {
    const slowest = Math.min(...sPoles.map((p) => -p.re));
    duration = sPoles.length > 0 ? 6 / slowest : 10 * (sampleTime ?? 1);
  }
  if (domain === 'z') {
    const t = sampleTime as number;
    const samples = Math.ceil(duration / t) + 1;
    return { duration: (Math.min(MAX_STEP_POINTS, Math.max(20, samples)) - 1) * t, points: Math.min(MAX_STEP_POINTS, Math.max(20, samples)) };
  }
  const wmax = Math.max(0, ...sPoles.map((p) => Math.abs(p.im)), ...sPoles.map((p) => Math.abs(p.re) / 4));
  const points = Math.min(4000, Math.max(200, Math.ceil((duration * wmax * 20) / (2 * Math.PI))));
  return { duration, points };
}
