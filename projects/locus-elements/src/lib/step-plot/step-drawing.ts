import type { DesignTargets, StepResponse } from '@polewright/locus-core';
import { scaleLinear } from 'd3-scale';
import { curveLinear, curveStepAfter, line } from 'd3-shape';
import { formatFigure } from '../figures/figure-format';
import type { HostSize } from '../figures/host-size';

/** Room for the tick labels around the plotting area (px). */
export const STEP_MARGIN = { top: 14, right: 14, bottom: 30, left: 46 } as const;

/** A tick of an axis: its pixel position and label. */
export interface Tick {
  readonly at: number;
  readonly label: string;
}

/** A figure marked on the response: where, and what its label says. */
export interface Mark {
  readonly x: number;
  readonly y: number;
  readonly label: string;
}

/** Everything the step plot's template draws, in pixels. */
export interface StepDrawing {
  readonly width: number;
  readonly height: number;
  readonly inner: { readonly left: number; readonly top: number; readonly right: number; readonly bottom: number };
  readonly response: string;
  readonly xTicks: readonly Tick[];
  readonly yTicks: readonly Tick[];
  /** y of the final value, when the loop settles to one. */
  readonly finalY: number | null;
  /** The ±2 % band after the settling time. */
  readonly band: { readonly x: number; readonly y: number; readonly width: number; readonly height: number } | null;
  readonly peak: Mark | null;
  /** The 10–90 % rise, drawn as a bracket at the 90 % level ending where the response first reaches it. */
  readonly rise: { readonly x0: number; readonly x1: number; readonly y: number; readonly label: string } | null;
  readonly settling: Mark | null;
  /** Areas the targets forbid (overshoot ceiling; outside the 2 % band after the settling target). */
  readonly forbidden: readonly string[];
  /** Outline of the target envelope. */
  readonly envelope: string | null;
}

/**
 * Lays out a step response for drawing: d3 scales fitted to the record (and to the target envelope), the
 * response as a d3-shape path (steps for a sampled loop), and the overshoot, rise and settling marks
 * taken from the core's figures.
 */
export function stepDrawing(step: StepResponse, sampled: boolean, targets: DesignTargets | null, size: HostSize): StepDrawing {
  const width = Math.max(size.width, 160);
  const height = Math.max(size.height, 120);
  const inner = { left: STEP_MARGIN.left, top: STEP_MARGIN.top, right: width - STEP_MARGIN.right, bottom: height - STEP_MARGIN.bottom };
  const { time, output, finalValue: final } = step;
  const end = time[time.length - 1] || 1;
  const ceiling = final !== null && targets?.maxOvershootPct !== undefined ? final * (1 + targets.maxOvershootPct / 100) : null;
  const low = Math.min(0, ...output, final ?? 0);
  const high = Math.max(...output, ceiling ?? -Infinity, final !== null ? final * 1.05 : -Infinity);
  const x = scaleLinear().domain([0, end]).range([inner.left, inner.right]);
  const y = scaleLinear().domain([low, high === low ? low + 1 : high]).nice(5).range([inner.bottom, inner.top]);
  const path = line<number>()
    .x((_, k) => x(time[k]))
    .y((v) => y(v))
    .curve(sampled ? curveStepAfter : curveLinear)(output) ?? '';
  const xTicks = x.ticks(6).map((t) => ({ at: x(t), label: formatFigure(t) }));
  const yTicks = y.ticks(5).map((v) => ({ at: y(v), label: formatFigure(v) }));

  let band: StepDrawing['band'] = null;
  let settling: Mark | null = null;
  if (final !== null && step.settlingTime !== null) {
    const x0 = x(step.settlingTime);
    const top = y(final + 0.02 * Math.abs(final));
    band = { x: x0, y: top, width: inner.right - x0, height: Math.max(1, y(final - 0.02 * Math.abs(final)) - top) };
    settling = { x: x0, y: y(final), label: `settling ${formatFigure(step.settlingTime)} s` };
  }
  const peak = step.overshootPct !== null && step.overshootPct > 0 ? { x: x(step.peak.time), y: y(step.peak.value), label: `overshoot ${formatFigure(step.overshootPct)} %` } : null;
  let rise: StepDrawing['rise'] = null;
  if (final !== null && step.riseTime !== null) {
    const k = output.findIndex((v) => Math.sign(final) * v >= 0.9 * Math.abs(final));
    if (k >= 0) rise = { x0: x(Math.max(0, time[k] - step.riseTime)), x1: x(time[k]), y: y(0.9 * final), label: `rise ${formatFigure(step.riseTime)} s` };
  }

  const forbidden: string[] = [];
  const outline: string[] = [];
  const settleBy = final !== null && targets?.maxSettlingTime !== undefined ? Math.min(targets.maxSettlingTime, end) : null;
  if (final !== null && (ceiling !== null || settleBy !== null)) {
    const xs = settleBy !== null ? x(settleBy) : inner.right;
    const yTop = (v: number) => Math.max(inner.top, Math.min(inner.bottom, y(v)));
    if (ceiling !== null) {
      forbidden.push(rect(inner.left, inner.top, xs, yTop(ceiling)));
      outline.push(`M${inner.left},${yTop(ceiling)}H${xs}`);
    }
    if (settleBy !== null) {
      const upper = yTop(final + 0.02 * Math.abs(final));
      const lower = yTop(final - 0.02 * Math.abs(final));
      forbidden.push(rect(xs, inner.top, inner.right, upper), rect(xs, lower, inner.right, inner.bottom));
      outline.push(`M${xs},${inner.top}V${upper}H${inner.right}M${xs},${inner.bottom}V${lower}H${inner.right}`);
    }
  }
  return {
    width,
    height,
    inner,
    response: path,
    xTicks,
    yTicks,
    finalY: final !== null ? y(final) : null,
    band,
    peak,
    rise,
    settling,
    forbidden,
    envelope: outline.length ? outline.join('') : null,
  };
}

function rect(x0: number, y0: number, x1: number, y1: number): string {
  return `M${x0},${y0}H${x1}V${y1}H${x0}Z`;
}
