import { CAUTION } from '../caution';
import type { Complex } from '../complex/complex';
import { ValidationError } from '../errors';
import { circle, dampingRay, verticalLine } from '../locus/curve';
import { curveCrossings } from '../locus/curve-crossings';
import { locus } from '../locus/locus';
import { characteristic } from '../locus/stable-ranges';
import { roots } from '../polynomial/roots';
import { poleFigures } from '../response/pole-figures';
import type { DesignRequest, DesignResult, GainRange } from '../types/results';
import { branchSignChanges, sampledChanges } from '../locus/gain-boundaries';
import { judgedPoles, meetsRegion, targetRegion } from './targets';

/** Most damping lines one request may ask for. */
export const MAX_DAMPING_LINES = 24;

/**
 * Gain ranges K > 0 for which the loop is stable and the judged closed-loop poles meet the targets,
 * and for each requested damping ratio every gain at which the locus crosses that constant-damping
 * line. In the s-plane every boundary (damping ray, decay-rate line, frequency circles) is found
 * algebraically and exactly (see `curveCrossings`); in the z-plane the decay-rate circle is exact and
 * the damping and frequency curves (not algebraic there) are found from sign changes along the traced
 * locus, refined by bisection. Each resulting range is checked at an interior gain.
 */
export function designGains(request: DesignRequest): DesignResult {
  if (typeof request !== 'object' || request === null || Array.isArray(request)) throw ValidationError.at('', 'the request must be an object with a "plant"');
  if (!('plant' in request)) throw ValidationError.at('/plant', 'is required');
  const region = targetRegion(request.targets);
  const lines = readDampingLines(request.dampingLines);
  const dominantOnly = request.dominantOnly ?? false;
  if (typeof dominantOnly !== 'boolean') throw ValidationError.at('/dominantOnly', 'must be true or false');
  // locus validates and normalises the plant; its result carries the normalised form
  const traced = locus({ plant: request.plant, gainRange: request.gainRange });
  const { numerator, denominator } = traced.normalizedPlant;
  const { domain, sampleTime } = traced;

  const gains = traced.branches[0]?.points.map((p) => p.gain) ?? [0, traced.gainSpan.max];
  const polesAt = (k: number): Complex[] => traced.branches.map((b) => ({ re: b.points[k].re, im: b.points[k].im }));
  const judge = (poles: Complex[]): boolean => judgedPoles(poles, domain, dominantOnly).every((p) => meetsRegion(p, region, domain, sampleTime)) && poles.every((p) => poleFigures(p, domain, sampleTime).isStable);

  const candidates: number[] = [];
  for (const r of traced.stableGainRanges) {
    candidates.push(r.from);
    if (r.to !== null) candidates.push(r.to);
  }
  const exact = (curve: Parameters<typeof curveCrossings>[2]): void => {
    for (const c of curveCrossings(numerator, denominator, curve)) if (c.gain > 0) candidates.push(c.gain);
  };
  if (domain === 's') {
    if (region.minDampingRatio !== null) exact(dampingRay(region.minDampingRatio));
    if (region.minDecayRate !== null) exact(verticalLine(-region.minDecayRate));
    if (region.naturalFrequency.min !== null && region.naturalFrequency.min > 0) exact(circle(0, region.naturalFrequency.min));
    if (region.naturalFrequency.max !== null) exact(circle(0, region.naturalFrequency.max));
  } else if (region.minDecayRate !== null) {
    exact(circle(0, Math.exp(-region.minDecayRate * (sampleTime as number))));
  }
  if (domain === 'z' || dominantOnly) candidates.push(...sampledChanges(numerator, denominator, gains, polesAt, judge));

  const gainRanges = rangesWhere(candidates, (g) => judge(roots(characteristic(numerator, denominator, g))), traced.gainSpan.max);
  const dampingLineGains = lines.map((zeta) => ({ dampingRatio: zeta, gains: lineGains(zeta) }));

  function lineGains(zeta: number): number[] {
    if (domain === 's') {
      const scale = Math.max(1e-300, ...traced.openLoop.poles.map((p) => Math.hypot(p.re, p.im)));
      return unique(curveCrossings(numerator, denominator, dampingRay(zeta)).filter((c) => c.gain > 0 && Math.hypot(c.point.re, c.point.im) > 1e-9 * scale).map((c) => c.gain));
    }
    // z-plane: the constant-ζ curve is a spiral from z = 1 to the negative real axis at radius
    // e^{−πζ/√(1−ζ²)}; a complex pole crosses it where ζ(z) − ζ changes sign in the upper half-plane, a
    // real pole where it passes that end point
    const end = Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta * zeta));
    const measure = (p: Complex): number | null => {
      if (p.im > 0) return poleFigures(p, domain, sampleTime).dampingRatio - zeta;
      if (p.im === 0 && p.re < 0) return end - Math.abs(p.re);
      return null;
    };
    const branches = traced.branches.map((b) => b.points.map((q) => ({ re: q.re, im: q.im })));
    return unique(branchSignChanges(numerator, denominator, gains, branches, measure).filter((g) => g > 0));
  }

  return {
    gainRanges,
    dampingLineGains,
    region: { minDampingRatio: region.minDampingRatio, minDecayRate: region.minDecayRate, naturalFrequency: region.naturalFrequency },
    stableGainRanges: traced.stableGainRanges,
    warnings: traced.warnings,
    caution: CAUTION,
  };
}

/**
 * Open intervals of K > 0 on which `holds` is true, from candidate boundaries: each gap between
 * neighbouring candidates is judged at an interior gain, and neighbouring gaps are joined when
 * `holds` is also true at the boundary between them.
 */
function rangesWhere(candidates: readonly number[], holds: (gain: number) => boolean, tracedMax: number): GainRange[] {
  const edges = unique(candidates.filter((c) => c > 0 && Number.isFinite(c)));
  const bounds = [0, ...edges, Infinity];
  const out: GainRange[] = [];
  for (let i = 0; i + 1 < bounds.length; i++) {
    const a = bounds[i];
    const b = bounds[i + 1];
    const probe = b === Infinity ? Math.max(2 * a, a === 0 ? tracedMax / 2 : 0) : a === 0 ? b / 2 : Math.sqrt(a * b);
    if (!holds(probe)) continue;
    const last = out[out.length - 1];
    if (last && last.to === a && holds(a)) out[out.length - 1] = { from: last.from, to: b === Infinity ? null : b, checkedAt: last.checkedAt };
    else out.push({ from: a, to: b === Infinity ? null : b, checkedAt: probe });
  }
  return out;
}

function unique(values: readonly number[]): number[] {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted.filter((v, i) => i === 0 || v - sorted[i - 1] > 1e-12 * Math.max(1, Math.abs(v)));
}

function readDampingLines(value: unknown): number[] {
  if (value === undefined) return [];
  if (!Array.isArray(value)) throw ValidationError.at('/dampingLines', 'must be an array of damping ratios between 0 and 1');
  if (value.length > MAX_DAMPING_LINES) throw ValidationError.at('/dampingLines', `lists ${value.length} lines; at most ${MAX_DAMPING_LINES}`);
  value.forEach((v, i) => {
    if (typeof v !== 'number' || !(v > 0 && v < 1)) throw ValidationError.at(`/dampingLines/${i}`, 'must be a damping ratio between 0 and 1 (exclusive)');
  });
  return value as number[];
}
