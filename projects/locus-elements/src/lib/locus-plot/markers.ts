import { characteristic, roots, type Complex, type LocusResult } from '@polewright/locus-core';
import { pointAtGain } from './branch';

/** Open-loop poles or zeros at one place, with how many coincide there. */
export interface MarkGroup {
  readonly point: Complex;
  readonly count: number;
}

/** A closed-loop pole at the current gain and the branch it sits on. */
export interface GainMarker {
  readonly pole: Complex;
  readonly branch: number;
}

/**
 * The pole mark (our own design): two crossed strokes that stop short of the centre, so that a branch
 * leaving the pole stays visible through it. Centred on (0, 0), arms `size` px long.
 */
export function poleMarkPath(size = 6): string {
  const g = size * 0.32;
  return `M${-size},${-size}L${-g},${-g}M${g},${g}L${size},${size}M${-size},${size}L${-g},${g}M${g},${-g}L${size},${-size}`;
}

/** The compensator-pole mark: the pole mark with a short bar across each arm tip, so it reads apart from the plant's. */
export function compensatorPoleMarkPath(size = 7): string {
  const t = size * 0.3;
  const bars = [
    [size, size],
    [-size, size],
    [size, -size],
    [-size, -size],
  ]
    .map(([a, b]) => `M${a - (b * t) / size},${b + (a * t) / size}L${a + (b * t) / size},${b - (a * t) / size}`)
    .join('');
  return poleMarkPath(size) + bars;
}

/**
 * Coincident points merged into one group with its count (a double pole at the origin is drawn once,
 * labelled ×2). Points closer than `tolerance` (relative to the larger modulus, absolute near the origin)
 * count as one place.
 * Example: groupCoincident([{re:0,im:0},{re:0,im:0},{re:-4.5,im:0}]) → (0, ×2) and (−4.5, ×1).
 */
export function groupCoincident(points: readonly Complex[], tolerance = 1e-6): MarkGroup[] {
  const groups: { point: Complex; count: number }[] = [];
  for (const p of points) {
    const scale = Math.max(1, Math.hypot(p.re, p.im));
    const found = groups.find((g) => Math.hypot(g.point.re - p.re, g.point.im - p.im) <= tolerance * scale);
    if (found) found.count++;
    else groups.push({ point: p, count: 1 });
  }
  return groups;
}

/**
 * The closed-loop poles at `gain`: the roots of D + K·N (the core's `roots`), each assigned to the
 * branch passing nearest to it at that gain (greedy, nearest pairs first), so that every branch carries
 * one marker. Empty when the gain cannot form a closed loop (e.g. the ill-posed gain of a biproper loop).
 */
export function gainMarkers(result: LocusResult, gain: number): GainMarker[] {
  if (!Number.isFinite(gain)) return [];
  const { numerator, denominator } = result.normalizedPlant;
  let poles: Complex[];
  try {
    poles = roots(characteristic(numerator, denominator, gain));
  } catch {
    return [];
  }
  if (!poles.every((p) => Number.isFinite(p.re) && Number.isFinite(p.im))) return [];
  const anchors = result.branches.map((b) => pointAtGain(b.points, gain) ?? nearestEnd(b.points, gain));
  const pairs: { pole: number; branch: number; distance: number }[] = [];
  poles.forEach((p, i) =>
    anchors.forEach((a, j) => {
      if (a) pairs.push({ pole: i, branch: j, distance: Math.hypot(a.re - p.re, a.im - p.im) });
    }),
  );
  pairs.sort((a, b) => a.distance - b.distance);
  const poleUsed = new Set<number>();
  const branchUsed = new Set<number>();
  const out: GainMarker[] = [];
  for (const pair of pairs) {
    if (poleUsed.has(pair.pole) || branchUsed.has(pair.branch)) continue;
    poleUsed.add(pair.pole);
    branchUsed.add(pair.branch);
    out.push({ pole: poles[pair.pole], branch: pair.branch });
  }
  // poles without a traced branch (none in practice: the engine traces one branch per pole)
  poles.forEach((pole, i) => {
    if (!poleUsed.has(i)) out.push({ pole, branch: -1 });
  });
  return out.sort((a, b) => a.branch - b.branch);
}

function nearestEnd(points: readonly { gain: number; re: number; im: number }[], gain: number): Complex | null {
  if (points.length === 0) return null;
  return gain < points[0].gain ? points[0] : points[points.length - 1];
}
