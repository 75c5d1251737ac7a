import { CAUTION } from '../caution';
import { ValidationError } from '../errors';
import { conditioningWarnings } from '../locus/conditioning';
import { characteristic } from '../locus/stable-ranges';
import { normalizePlant } from '../plant/normalize';
import { evaluate } from '../polynomial/evaluate';
import { scale } from '../polynomial/polynomial';
import { roots } from '../polynomial/roots';
import { stabilityOf } from '../stability/is-stable';
import type { Warning } from '../types/plant';
import type { ClosedLoopRequest, ClosedLoopResult, StepResponse } from '../types/results';
import { poleFigures } from './pole-figures';
import { stepFigures } from './step-figures';
import { MAX_STEP_POINTS, automaticSpan, stepSeries } from './step-response';

/**
 * Closed loop K·N/(D + K·N) at one gain: its poles with damping ratio, natural frequency and time
 * constant, the exact stability verdict, and the unit-step response with its figures.
 * Example: closedLoop({ plant: { expression: "1/(s*(s+2))" }, gain: 2 }) has poles −1 ± j (ζ ≈ 0.707)
 * and about 4.3 % overshoot.
 */
export function closedLoop(request: ClosedLoopRequest): ClosedLoopResult {
  if (typeof request !== 'object' || request === null || Array.isArray(request)) throw ValidationError.at('', 'the request must be an object with "plant" and "gain"');
  if (!('plant' in request)) throw ValidationError.at('/plant', 'is required');
  const gain = request.gain;
  if (typeof gain !== 'number' || !Number.isFinite(gain)) throw ValidationError.at('/gain', 'must be a finite number (the loop gain K)');
  const stepOptions = readStep(request.step);
  const plant = normalizePlant(request.plant);
  const { numerator, denominator, domain, sampleTime } = plant;
  const warnings: Warning[] = [...plant.warnings];
  const a = characteristic(numerator, denominator, gain);
  if (a[0] === 0) throw ValidationError.at('/gain', 'makes the loop ill-posed (1 + K·G(∞) = 0): no closed-loop transfer function exists at this gain');
  const rawPoles = roots(a);
  const poles = rawPoles.map((p) => poleFigures(p, domain, sampleTime));
  warnings.push(...conditioningWarnings(a, rawPoles, Math.max(1e-300, ...rawPoles.map((p) => Math.hypot(p.re, p.im)))));
  const verdict = stabilityOf(a, domain);
  const polesSayStable = poles.every((p) => p.isStable);
  if (verdict.isStable !== polesSayStable) {
    warnings.push({ code: 'stability-test-disagreement', message: `The ${verdict.test} test and the computed poles disagree at this gain (a pole is on or extremely close to the stability boundary); reported as ${verdict.isStable ? 'stable' : 'not stable'}.` });
  }
  const b = scale(numerator, gain);
  let step: StepResponse | null = null;
  if (gain !== 0) {
    const system = { b, a, zeros: roots(numerator), poles: rawPoles };
    const automatic = automaticSpan(poles, domain, sampleTime);
    let duration = stepOptions.duration ?? automatic.duration;
    let points = stepOptions.points ?? automatic.points;
    const finalValue = verdict.isStable ? (domain === 's' ? b[b.length - 1] / a[a.length - 1] : evaluate(b, 1) / evaluate(a, 1)) : null;
    let series = stepSeries(system, domain, sampleTime, duration, domain === 'z' ? Math.round(duration / (sampleTime as number)) + 1 : points);
    let figures = stepFigures(series.time, series.output, finalValue, domain === 's');
    // an automatic span that ends before the response settles is doubled (a few times at most)
    for (let attempt = 0; attempt < 4 && stepOptions.duration === undefined && finalValue !== null && !figures.isSettled; attempt++) {
      duration *= 2;
      points = Math.min(MAX_STEP_POINTS, points * 2);
      series = stepSeries(system, domain, sampleTime, duration, domain === 'z' ? Math.min(MAX_STEP_POINTS, Math.round(duration / (sampleTime as number)) + 1) : points);
      figures = stepFigures(series.time, series.output, finalValue, domain === 's');
    }
    step = { ...series, overshootPct: figures.overshootPct, riseTime: figures.riseTime, settlingTime: figures.settlingTime, finalValue, peak: figures.peak };
  }
  return { gain, stable: verdict.isStable, domain, sampleTime, poles, step, warnings, caution: CAUTION };
}

function readStep(step: ClosedLoopRequest['step']): { duration?: number; points?: number } {
  if (step === undefined) return {};
  if (typeof step !== 'object' || step === null || Array.isArray(step)) throw ValidationError.at('/step', 'must be an object { "duration": seconds, "points": count }');
  if (step.duration !== undefined && (typeof step.duration !== 'number' || !Number.isFinite(step.duration) || step.duration <= 0)) throw ValidationError.at('/step/duration', 'must be a positive number of seconds');
  if (step.points !== undefined && (typeof step.points !== 'number' || !Number.isInteger(step.points) || step.points < 2 || step.points > MAX_STEP_POINTS)) throw ValidationError.at('/step/points', `must be a whole number from 2 to ${MAX_STEP_POINTS}`);
  return { duration: step.duration, points: step.points };
}
