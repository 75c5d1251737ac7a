import type { Complex } from '../complex/complex';
import { padTo, type Polynomial } from '../polynomial/polynomial';
import { refineRoots, roots } from '../polynomial/roots';

/** Roots of D + K·N traced along a gain path: `re[k][i]`, `im[k][i]` is branch i at `gains[k]`. */
export interface Trace {
  readonly gains: number[];
  readonly re: Float64Array[];
  readonly im: Float64Array[];
  /** Steps at which tracking had to fall back to a cold solve. */
  readonly fallbacks: number;
  /** Whether the work budget ran out and the rest of the path was covered by cold solves at coarse steps. */
  readonly isCoarse: boolean;
}

/** How finely to trace. */
export interface TraceOptions {
  /** Size of the region of interest in the plane (sets the finest spacing of points). */
  readonly scale: number;
  /** Real centre of the region of interest. */
  readonly center: number;
  /** Gain scale K₀: the path is uniform in u = asinh(|K|/K₀), linear near 0 and logarithmic far out. */
  readonly gainScale: number;
  /** Largest move of a pole in one step, as a fraction of max(scale, 2·distance from the centre). */
  readonly moveFraction?: number;
}

/**
 * Traces every root of D + K·N from K = 0 to `endGain` (either sign), landing exactly on each gain
 * in `waypoints`. Each step warm-starts the Aberth–Ehrlich iteration from the previous roots
 * (extrapolated along the path), accepts it only when it converged, no pole moved more than the
 * resolution allows and each new root is the nearest to its own predecessor (so no branch can swap
 * with another), and otherwise halves the step. A step that cannot be resolved falls back to a cold
 * solve matched to the previous roots.
 */
export function trace(
  numerator: Polynomial,
  denominator: Polynomial,
  startRoots: readonly Complex[],
  endGain: number,
  waypoints: readonly number[],
  options: TraceOptions,
): Trace {
  const n = denominator.length - 1;
  const sign = endGain < 0 ? -1 : 1;
  const paddedN = Float64Array.from(padTo(numerator, n + 1));
  const d = Float64Array.from(denominator);
  const c = new Float64Array(n + 1);
  const k0 = options.gainScale;
  const moveFraction = options.moveFraction ?? 0.02;
  const uOf = (g: number): number => Math.asinh(Math.abs(g) / k0);
  const gainOf = (u: number): number => sign * k0 * Math.sinh(u);
  const uEnd = uOf(endGain);
  const stops = [...new Set(waypoints.map((w) => Math.abs(w)))]
    .filter((w) => w > 0 && w < Math.abs(endGain))
    .sort((a, b) => a - b)
    .map((w) => ({ u: uOf(w), gain: sign * w }))
    // gains that land on the same path position (e.g. the two refined gains of a conjugate crossing
    // pair, one rounding step apart) are one stop
    .filter((stop, i, all) => i === 0 || stop.u - all[i - 1].u > 1e-12 * Math.max(1, stop.u));
  if (stops.length > 0 && uEnd - stops[stops.length - 1].u <= 1e-12 * Math.max(1, uEnd)) stops.pop();
  stops.push({ u: uEnd, gain: endGain });

  let curRe = Float64Array.from(startRoots.map((r) => r.re));
  let curIm = Float64Array.from(startRoots.map((r) => r.im));
  let prevRe: Float64Array | null = null;
  let prevIm: Float64Array | null = null;
  let prevH = 0;
  const gains = [0];
  const outRe = [curRe];
  const outIm = [curIm];
  let u = 0;
  let h = 0.01;
  const hMax = 0.25;
  let fallbacks = 0;
  const newRe = new Float64Array(n);
  const newIm = new Float64Array(n);
  let stopIndex = 0;
  let halvings = 0;
  let attempts = 0;
  let exhausted = false;
  let planned = h;
  const maxAttempts = Math.max(1000, Math.round(WORK_BUDGET / Math.max(1, n * n)));
  let force = false;
  while (stopIndex < stops.length && n > 0) {
    attempts++;
    // a bounded amount of work: a loop whose roots are hypersensitive (very high order, spread roots)
    // could otherwise halve its steps without end
    if (attempts > maxAttempts) exhausted = true;
    if (halvings === 0) planned = h;
    const stop = stops[stopIndex];
    const landing = u + h >= stop.u - 1e-12 * Math.max(1, stop.u);
    const uNext = landing ? stop.u : u + h;
    const step = uNext - u;
    const gain = landing ? stop.gain : gainOf(uNext);
    for (let i = 0; i <= n; i++) c[i] = d[i] + gain * paddedN[i];
    // predictor: straight-line extrapolation of the last step, scaled to this one
    const ratio = prevRe && prevH > 0 ? Math.min(step / prevH, 2) : 0;
    for (let i = 0; i < n; i++) {
      newRe[i] = curRe[i] + (prevRe ? (curRe[i] - prevRe[i]) * ratio : 0);
      newIm[i] = curIm[i] + (prevIm ? (curIm[i] - prevIm[i]) * ratio : 0);
    }
    let refinement = { converged: true, iterations: 0 };
    let accepted: boolean;
    if (hasCluster(curRe, curIm, 1e-6 * options.scale)) {
      // leaving a multiple root (a multiple open-loop pole, or a break point just landed on): the
      // roots fan out like K^(1/q), which a warm start from one point cannot follow; solve cold and
      // pair by distance — any pairing is continuous, the branches share the point they leave
      pairNearest(curRe, curIm, roots(Array.from(c)), newRe, newIm);
      accepted = isFaithful(curRe, curIm, newRe, newIm, options.scale, options.center, moveFraction) || force || exhausted;
    } else {
      refinement = refineRoots(c, newRe, newIm, 40);
      accepted = refinement.converged && isFaithful(curRe, curIm, newRe, newIm, options.scale, options.center, moveFraction);
    }
    if (!accepted && (force || exhausted)) {
      // the path cannot be resolved any finer: solve cold and pair by nearest distance
      fallbacks++;
      pairNearest(curRe, curIm, roots(Array.from(c)), newRe, newIm);
      accepted = true;
    }
    if (!accepted) {
      halvings++;
      if (halvings >= MAX_HALVINGS) {
        // halving did not help (the roots are hypersensitive here): take the planned step with a
        // cold solve instead of crawling
        force = true;
        h = planned;
      } else h = step / 2;
      continue;
    }
    halvings = 0;
    force = false;
    prevRe = curRe;
    prevIm = curIm;
    prevH = step;
    curRe = Float64Array.from(newRe);
    curIm = Float64Array.from(newIm);
    symmetrizeInPlace(curRe, curIm, options.scale);
    gains.push(gain);
    outRe.push(curRe);
    outIm.push(curIm);
    u = uNext;
    if (landing) stopIndex++;
    h = Math.max(1e-9, Math.min(hMax, refinement.iterations <= 4 ? step * 1.6 : step * 1.15));
    if (landing && stopIndex < stops.length) h = Math.min(h, 0.01 + (stops[stopIndex].u - u) / 4);
  }
  return { gains, re: outRe, im: outIm, fallbacks, isCoarse: exhausted };
}

/** Halvings of one step before it is forced through a cold solve. */
const MAX_HALVINGS = 16;
/**
 * Work allowed for one trace, in units of n² (one step attempt costs a few sweeps of n² each): about
 * 40 000 attempts at degree 10, 2 500 at degree 40. Past it, the rest of the path is covered by cold
 * solves at the planned steps.
 */
const WORK_BUDGET = 4e6;

/**
 * Whether the step kept every branch on its own root: each new root moved at most the allowed
 * distance, and no other new root is closer to a branch's previous position than its own new root
 * (up to a coincidence tolerance for roots that meet at a break point).
 */
function isFaithful(oldRe: Float64Array, oldIm: Float64Array, newRe: Float64Array, newIm: Float64Array, scale: number, center: number, fraction: number): boolean {
  const n = oldRe.length;
  const coincide = 1e-7 * scale;
  // squared distances throughout: the comparisons need no square roots
  for (let i = 0; i < n; i++) {
    const ore = oldRe[i];
    const oim = oldIm[i];
    const dr = newRe[i] - ore;
    const di = newIm[i] - oim;
    const move2 = dr * dr + di * di;
    const fr = ore - center;
    const far2 = fr * fr + oim * oim;
    const limit = fraction * Math.max(scale, 2 * Math.sqrt(far2));
    if (!(move2 <= limit * limit)) return false;
    const move = Math.sqrt(move2);
    const bound = move - coincide;
    if (bound <= 0) continue;
    const bound2 = bound * bound;
    for (let j = 0; j < n; j++) {
      if (j === i) continue;
      const er = newRe[j] - ore;
      const ei = newIm[j] - oim;
      if (er * er + ei * ei < bound2) return false;
    }
  }
  return true;
}

/** Whether two roots are closer than `tolerance` (a multiple root, to working precision). */
function hasCluster(re: Float64Array, im: Float64Array, tolerance: number): boolean {
  const t2 = tolerance * tolerance;
  for (let i = 1; i < re.length; i++) {
    for (let j = 0; j < i; j++) {
      const dr = re[i] - re[j];
      const di = im[i] - im[j];
      if (dr * dr + di * di < t2) return true;
    }
  }
  return false;
}

/** Assigns freshly solved roots to branches, nearest pairs first (global greedy matching). */
function pairNearest(oldRe: Float64Array, oldIm: Float64Array, fresh: Complex[], outRe: Float64Array, outIm: Float64Array): void {
  const n = oldRe.length;
  const m = fresh.length;
  const distance = new Float64Array(n * m);
  const order = new Uint32Array(n * m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < m; j++) {
      const dr = fresh[j].re - oldRe[i];
      const di = fresh[j].im - oldIm[i];
      distance[i * m + j] = dr * dr + di * di;
      order[i * m + j] = i * m + j;
    }
  }
  order.sort((a, b) => distance[a] - distance[b]);
  const branchDone = new Uint8Array(n);
  const rootDone = new Uint8Array(m);
  let left = Math.min(n, m);
  for (let k = 0; k < order.length && left > 0; k++) {
    const i = Math.floor(order[k] / m);
    const j = order[k] - i * m;
    if (branchDone[i] || rootDone[j]) continue;
    branchDone[i] = 1;
    rootDone[j] = 1;
    outRe[i] = fresh[j].re;
    outIm[i] = fresh[j].im;
    left--;
  }
}

/** Snaps near-real roots onto the real axis so that real segments of the locus are drawn exactly real. */
function symmetrizeInPlace(re: Float64Array, im: Float64Array, scale: number): void {
  for (let i = 0; i < re.length; i++) {
    if (Math.abs(im[i]) <= 1e-11 * Math.max(scale, Math.abs(re[i]))) im[i] = 0;
  }
}
