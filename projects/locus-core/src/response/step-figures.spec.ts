import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../tests/support/tolerance';
import { closedLoop } from './closed-loop';
import { stepFigures } from './step-figures';

/*
 * Reference responses are closed-form unit-step responses (standard results, recalled from memory):
 * first order 1 − e^{−t/τ}; second order with 0 < ζ < 1,
 *   y(t) = 1 − e^{−ζωt}·(cos ω_d t + ζ/√(1 − ζ²)·sin ω_d t),  ω_d = ω√(1 − ζ²),
 * whose peak overshoot is exp(−πζ/√(1 − ζ²)) at t = π/ω_d. Rise time is 10 %→90 % and settling time
 * is the last exit from the ±2 % band (the definitions the function documents). Crossing times of the
 * closed forms are found here by bisection, not taken from the function under test.
 */

function sample(f: (t: number) => number, duration: number, points: number): { time: number[]; output: number[] } {
  const time = Array.from({ length: points }, (_, k) => (k * duration) / (points - 1));
  return { time, output: time.map(f) };
}

/** First t in [a, b] where g changes sign, by bisection (g(a) and g(b) of opposite signs). */
function bisect(g: (t: number) => number, a: number, b: number): number {
  let lo = a;
  let hi = b;
  const below = g(lo) < 0;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (g(mid) < 0 === below) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Last time the response is outside ±band of the final value, on a fine grid refined by bisection. */
function lastExit(f: (t: number) => number, final: number, band: number, duration: number): number {
  const g = (t: number) => Math.abs(f(t) - final) - band * Math.abs(final);
  const steps = 200000;
  for (let k = steps; k > 0; k--) {
    const t1 = (k * duration) / steps;
    const t0 = ((k - 1) * duration) / steps;
    if (g(t0) > 0 && g(t1) <= 0) return bisect(g, t0, t1);
  }
  return 0;
}

const secondOrder = (zeta: number, omega: number) => {
  const wd = omega * Math.sqrt(1 - zeta * zeta);
  return (t: number) => 1 - Math.exp(-zeta * omega * t) * (Math.cos(wd * t) + (zeta / Math.sqrt(1 - zeta * zeta)) * Math.sin(wd * t));
};

describe('stepFigures — low order closed forms', () => {
  it('measures the overshoot exp(−πζ/√(1 − ζ²)) and the peak time π/ω_d of an underdamped second-order response', () => {
    const zeta = 0.3;
    const omega = 2;
    const f = secondOrder(zeta, omega);
    const { time, output } = sample(f, 15, 30001);
    const figures = stepFigures(time, output, 1, true);
    const overshoot = 100 * Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta * zeta));
    expectClose(figures.overshootPct as number, overshoot, 0, 2e-5);
    expectClose(figures.peak.time, Math.PI / (omega * Math.sqrt(1 - zeta * zeta)), 0, 15 / 30000);
    // the sampled peak misses the true one by at most |y″|·Δt²/8 ≈ 4.5·(5e-4)²/8 ≈ 1.4e-7
    expectClose(figures.peak.value, 1 + overshoot / 100, 0, 2e-7);
  });

  it('measures the 2 % settling time of the same response, interpolated between samples', () => {
    const f = secondOrder(0.3, 2);
    const { time, output } = sample(f, 15, 30001);
    const figures = stepFigures(time, output, 1, true);
    expect(figures.isSettled).toBe(true);
    // linear interpolation between samples 5e-4 s apart: error well below one sample
    expectClose(figures.settlingTime as number, lastExit(f, 1, 0.02, 15), 0, 5e-4);
  });

  it('gives a first-order lag the 10–90 % rise time τ·ln 9 and no overshoot', () => {
    // 1 − e^{−t/τ} reaches 10 % at τ·ln(10/9) and 90 % at τ·ln 10
    const tau = 0.5;
    const { time, output } = sample((t) => 1 - Math.exp(-t / tau), 5, 20001);
    const figures = stepFigures(time, output, 1, true);
    expectClose(figures.riseTime as number, tau * Math.log(9), 1e-6);
    expect(figures.overshootPct).toBe(0);
    // settles when e^{−t/τ} = 0.02: t = τ·ln 50
    expectClose(figures.settlingTime as number, tau * Math.log(50), 1e-5);
  });

  it('handles a negative final value by mirroring: −2(1 − e^{−t}) rises in 1·ln 9 with no overshoot', () => {
    const { time, output } = sample((t) => -2 * (1 - Math.exp(-t)), 12, 24001);
    const figures = stepFigures(time, output, -2, true);
    expectClose(figures.riseTime as number, Math.log(9), 1e-6);
    expect(figures.overshootPct).toBe(0);
    // the peak is the extreme in the direction of the final value
    expect(figures.peak.value).toBeLessThan(-1.99);
  });

  it('reads crossing times at the samples, without interpolation, for a sampled-data response', () => {
    // samples every 0.1 s of 1 − e^{−t}: 10 % is first reached at the first sample ≥ ln(10/9) ≈ 0.105 → 0.2,
    // 90 % at the first sample ≥ ln 10 ≈ 2.303 → 2.4
    const { time, output } = sample((t) => 1 - Math.exp(-t), 10, 101);
    const figures = stepFigures(time, output, 1, false);
    expectClose(figures.riseTime as number, 2.4 - 0.2, 1e-12);
  });
});

describe('stepFigures — repeated roots', () => {
  it('finds no overshoot and the bisected rise time of the critically damped response 1 − e^{−t}(1 + t)', () => {
    const f = (t: number) => 1 - Math.exp(-t) * (1 + t);
    const { time, output } = sample(f, 15, 30001);
    const figures = stepFigures(time, output, 1, true);
    expect(figures.overshootPct).toBe(0);
    const rise = bisect((t) => f(t) - 0.9, 0, 15) - bisect((t) => f(t) - 0.1, 0, 15);
    expectClose(figures.riseTime as number, rise, 1e-6);
  });
});

describe('stepFigures — ill-conditioned records', () => {
  it('reports a lightly damped response that has not settled by the end of the record as unsettled', () => {
    // ζ = 0.01: the envelope e^{−0.01t} needs t ≈ 390 s to shrink to 2 %; the record ends at 50 s
    const { time, output } = sample(secondOrder(0.01, 1), 50, 5001);
    const figures = stepFigures(time, output, 1, true);
    expect(figures.isSettled).toBe(false);
    expect(figures.settlingTime).toBeNull();
    expectClose(figures.overshootPct as number, 100 * Math.exp((-Math.PI * 0.01) / Math.sqrt(1 - 1e-4)), 1e-4);
  });

  it('reports no figures, only the peak, when there is no final value (an unstable loop)', () => {
    const { time, output } = sample((t) => Math.exp(t) - 1, 3, 301);
    const figures = stepFigures(time, output, null, true);
    expect(figures.overshootPct).toBeNull();
    expect(figures.riseTime).toBeNull();
    expect(figures.settlingTime).toBeNull();
    expect(figures.isSettled).toBe(false);
    expectClose(figures.peak.value, Math.exp(3) - 1, 1e-12);
  });

  it('reports no rise or overshoot for a zero final value, where percentages are undefined', () => {
    const { time, output } = sample((t) => t * Math.exp(-t), 20, 2001);
    const figures = stepFigures(time, output, 0, true);
    expect(figures.overshootPct).toBeNull();
    expect(figures.riseTime).toBeNull();
    expect(figures.isSettled).toBe(true);
  });
});

describe('step figures of a closed loop (through closedLoop)', () => {
  it('gives K/(s(s + 2)) at K = 2 the poles −1 ± j, ζ = 1/√2, and about 4.32 % overshoot', () => {
    // s² + 2s + 2: ω = √2, ζ = 1/√2 → overshoot e^{−π} ≈ 4.321 %
    const result = closedLoop({ plant: { expression: '1/(s*(s+2))' }, gain: 2, step: { duration: 10, points: 4001 } });
    expect(result.stable).toBe(true);
    for (const p of result.poles) {
      expectClose(p.re, -1, 1e-14);
      expectClose(Math.abs(p.im), 1, 1e-14);
      expectClose(p.dampingRatio, Math.SQRT1_2, 1e-14);
    }
    expectClose(result.step!.overshootPct as number, 100 * Math.exp(-Math.PI), 1e-5);
    expectClose(result.step!.finalValue as number, 1, 1e-15);
  });

  it('settles a tenth-order loop 0.5/((s + 1)¹⁰ + 0.5) at its final value 1/3', () => {
    // (s + 1)¹⁰ = −0.5 puts the slowest poles at −1 + 0.5^(1/10)·cos 18° ≈ −0.113: stable
    const result = closedLoop({ plant: { expression: '1/(s+1)^10' }, gain: 0.5 });
    expect(result.stable).toBe(true);
    expect(result.poles).toHaveLength(10);
    const slowest = Math.max(...result.poles.map((p) => p.re));
    expectClose(slowest, -1 + 0.5 ** 0.1 * Math.cos(Math.PI / 10), 1e-9);
    expectClose(result.step!.finalValue as number, 1 / 3, 1e-12);
    const output = result.step!.output;
    expectClose(output[output.length - 1], 1 / 3, 0.02);
  });
});
