import { characteristic, normalizePlant, poleFigures, roots, type Complex, type Domain, type NormalizedPlant, type Plant } from '@polewright/locus-core';
import type { DesignTargets, Schemas } from '../api/api-types';
import { formatFigure } from './compensator-rows';
import { dampingFromOvershoot } from './targets-form';

/** What limits a feasible gain range at one end. */
export type Limit = 'stability' | 'damping' | 'overshoot' | 'settling' | 'frequency-min' | 'frequency-max';

/** One target (or stability) that binds at a range end, in words. */
export interface Binding {
  readonly limit: Limit;
  readonly text: string;
}

/** The region the engine applied (`DesignResult.region`). */
export type AppliedRegion = Schemas['DesignResult']['region'];

/** Relative step past a range end at which the targets are judged: far above rounding, far below any range width. */
const STEP = 1e-6;

/**
 * Which targets bind at one end of a feasible gain range: the closed-loop poles are judged just outside
 * the end (gain × (1 ± 10⁻⁶)) against each target alone, and every target they miss there is named —
 * the damping bound as the ζ target or the overshoot target, whichever set it (the engine applies the
 * tighter), decay rate as the settling-time target. An end at K = 0 or ∞ binds nothing.
 */
export function bindingTargets(
  loop: NormalizedPlant,
  region: AppliedRegion,
  targets: DesignTargets | null,
  dominantOnly: boolean,
  edge: number | null,
  side: 'lower' | 'upper',
): Binding[] {
  if (edge === null || !(edge > 0) || !Number.isFinite(edge)) return [];
  const gain = side === 'lower' ? edge * (1 - STEP) : edge * (1 + STEP);
  const poles = roots(characteristic(loop.numerator, loop.denominator, gain));
  const figures = poles.map((p) => poleFigures(p, loop.domain, loop.sampleTime));
  const judged = judgedPoles(poles, loop.domain, dominantOnly).map((p) => poleFigures(p, loop.domain, loop.sampleTime));
  const tiny = 1e-12;
  const out: Binding[] = [];
  if (figures.some((f) => !f.isStable)) out.push({ limit: 'stability', text: 'stability limit' });
  const zeta = region.minDampingRatio;
  if (zeta !== null && judged.some((f) => f.dampingRatio < zeta - tiny)) out.push(...dampingBindings(zeta, targets));
  const decay = region.minDecayRate;
  if (decay !== null && judged.some((f) => decayRate(f.timeConstant) < decay * (1 - tiny))) {
    out.push({ limit: 'settling', text: `settling ≤ ${formatFigure(targets?.maxSettlingTime ?? 4 / decay)} s` });
  }
  const { min, max } = region.naturalFrequency;
  if (min !== null && judged.some((f) => (f.naturalFrequency ?? Infinity) < min * (1 - tiny))) out.push({ limit: 'frequency-min', text: `ωn ≥ ${formatFigure(min)} rad/s` });
  if (max !== null && judged.some((f) => (f.naturalFrequency ?? Infinity) > max * (1 + tiny))) out.push({ limit: 'frequency-max', text: `ωn ≤ ${formatFigure(max)} rad/s` });
  return out;
}

/** The loop of a design request in the engine's normalised form (Padé, zero-order hold, parsing applied). */
export function normalizedLoop(plant: Schemas['Plant']): NormalizedPlant {
  return normalizePlant(plant as Plant);
}

// the damping bound came from the ζ target, the overshoot target, or both (equal)
function dampingBindings(zeta: number, targets: DesignTargets | null): Binding[] {
  const out: Binding[] = [];
  const fromTarget = targets?.minDampingRatio;
  const overshoot = targets?.maxOvershootPct;
  const close = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));
  if (fromTarget !== undefined && close(fromTarget, zeta)) out.push({ limit: 'damping', text: `ζ ≥ ${formatFigure(fromTarget)}` });
  if (overshoot !== undefined && close(dampingFromOvershoot(overshoot), zeta)) out.push({ limit: 'overshoot', text: `overshoot ≤ ${formatFigure(overshoot)} %` });
  return out.length ? out : [{ limit: 'damping', text: `ζ ≥ ${formatFigure(zeta)}` }];
}

function decayRate(timeConstant: number | null): number {
  return timeConstant === null ? 0 : timeConstant === 0 ? Infinity : 1 / timeConstant;
}

/**
 * The poles the targets are judged on, as the engine picks them (projects/locus-core design/targets.ts
 * `judgedPoles`, not exported): all, or the slowest pole (largest Re s, or largest |z|) with its conjugate.
 */
function judgedPoles(poles: readonly Complex[], domain: Domain, dominantOnly: boolean): Complex[] {
  if (!dominantOnly || poles.length === 0) return [...poles];
  const slowness = (p: Complex): number => (domain === 's' ? p.re : Math.hypot(p.re, p.im));
  const slowest = poles.reduce((best, p) => (slowness(p) > slowness(best) ? p : best), poles[0]);
  const near = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-12 * Math.max(1, Math.abs(a));
  return poles.filter((p) => near(p.re, slowest.re) && near(Math.abs(p.im), Math.abs(slowest.im)));
}
