import { loopPlant, type LoopModel } from '@polewright/elements';
import type { DesignTargets, Plant, Schemas } from '../api/api-types';
import { dampingFromOvershoot } from './targets-form';

/** Damping lines asked for when no target names a damping ratio (common practice, no source). */
export const DEFAULT_DAMPING_LINES: readonly number[] = [0.5, 0.707];

/**
 * The damping ratios whose constant-damping lines the design request intersects with the locus: the ζ
 * target and the ζ the overshoot target stands for (4 decimals), or the usual 0.5 and 0.707 without them.
 */
export function dampingLinesFor(targets: DesignTargets | null): number[] {
  const lines = new Set<number>();
  if (targets?.minDampingRatio !== undefined) lines.add(targets.minDampingRatio);
  if (targets?.maxOvershootPct !== undefined) lines.add(Number(dampingFromOvershoot(targets.maxOvershootPct).toFixed(4)));
  return lines.size ? [...lines].sort((a, b) => a - b) : [...DEFAULT_DAMPING_LINES];
}

/**
 * `POST /design` for the loop on screen: the plant the engine sees for plant × compensator — the very
 * `loopPlant` the server applies to a saved model (the plant itself without a compensator) — with the
 * targets, the dominant-pair switch and the damping lines. Throws the core's `ValidationError` when the
 * compensator makes the loop improper.
 */
export function designRequestOf(model: LoopModel, targets: DesignTargets | null, dominantOnly: boolean): Schemas['DesignRequest'] {
  const request: Schemas['DesignRequest'] = { plant: loopPlant(model) as Plant, dominantOnly, dampingLines: dampingLinesFor(targets) };
  if (targets) request.targets = targets;
  return request;
}
