import type { Complex } from '../complex/complex';
import { symmetrize } from '../complex/conjugate-pairs';
import type { Polynomial } from './polynomial';

/** Outcome of a simultaneous root refinement. */
export interface Refinement {
  /** Whether every approximation reached the backward-error stop. */
  readonly converged: boolean;
  /** Sweeps used. */
  readonly iterations: number;
}

/** Coefficient list accepted by the hot loops: a plain array or a Float64Array, highest power first. */
export type Coefficients = ArrayLike<number>;

/**
 * Refines root approximations `re[i] + j·im[i]` of p in place by the Aberth–Ehrlich iteration
 * (Gauss–Seidel sweeps), until each one meets the backward-error stop
 * |p(z)| ≤ c·n·ε·Σ|a_k||z|^k or `maxIterations` sweeps are spent.
 *
 * Reference: O. Aberth, "Iteration methods for finding all zeros of a polynomial simultaneously",
 * Math. Comp. 27 (1973); D. A. Bini, "Numerical computation of polynomial zeros by means of Aberth's
 * method", Numer. Algorithms 13 (1996) — including the evaluation through the reversed polynomial for
 * |z| > 1, which keeps Horner's rule from overflowing on large roots.
 * The leading coefficient must be non-zero and `re`/`im` must hold exactly n = degree values.
 */
export function refineRoots(coefficients: Coefficients, re: Float64Array, im: Float64Array, maxIterations = 60): Refinement {
  const n = coefficients.length - 1;
  // far from 1, scale to a largest coefficient of 1: roots do not move, and p, p′ and the Aberth sums
  // stay in range (within range, the copy is skipped — this runs at every gain step)
  let largest = 0;
  for (let k = 0; k <= n; k++) largest = Math.max(largest, Math.abs(coefficients[k]));
  let p: Coefficients = coefficients;
  if (!(largest > 1e-100 && largest < 1e100)) {
    const scaled = new Float64Array(n + 1);
    for (let k = 0; k <= n; k++) scaled[k] = coefficients[k] / largest;
    p = scaled;
  }
  const tolerance = Math.max(8, 4 * n) * Number.EPSILON;
  separateCoincident(re, im);
  const done = new Uint8Array(n);
  let remaining = n;
  let iterations = 0;
  while (remaining > 0 && iterations < maxIterations) {
    iterations++;
    for (let i = 0; i < n; i++) {
      if (done[i]) continue;
      const zr = re[i];
      const zi = im[i];
      // |z| scaled by its larger part (Math.hypot is an order of magnitude slower in the hot loop)
      const mod = modulus(zr, zi);
      let ratioRe: number;
      let ratioIm: number;
      if (mod <= 1) {
        // p and p′ by Horner, and the backward-error scale Σ|a_k||z|^k
        let pr = 0, pi = 0, dr = 0, di = 0, bound = 0;
        for (let k = 0; k <= n; k++) {
          const ndr = dr * zr - di * zi + pr;
          di = dr * zi + di * zr + pi;
          dr = ndr;
          const npr = pr * zr - pi * zi + p[k];
          pi = pr * zi + pi * zr;
          pr = npr;
          bound = bound * mod + Math.abs(p[k]);
        }
        if (modulus(pr, pi) <= tolerance * bound) {
          done[i] = 1;
          remaining--;
          continue;
        }
        const den = dr * dr + di * di;
        if (den === 0) {
          re[i] = zr + 1e-3 * (1 + mod);
          im[i] = zi + 1e-3 * (1 + mod);
          continue;
        }
        ratioRe = (pr * dr + pi * di) / den;
        ratioIm = (pi * dr - pr * di) / den;
      } else {
        // q(y) = y^n p(1/y): Horner over the reversed coefficients at y = 1/z
        // y = 1/z by Smith's division, safe for very large |z|
        let yr: number, yi: number;
        if (Math.abs(zr) >= Math.abs(zi)) {
          const r = zi / zr;
          const d = zr + zi * r;
          yr = 1 / d;
          yi = -r / d;
        } else {
          const r = zr / zi;
          const d = zr * r + zi;
          yr = r / d;
          yi = -1 / d;
        }
        const ymod = 1 / mod;
        let qr = 0, qi = 0, dr = 0, di = 0, bound = 0;
        for (let k = n; k >= 0; k--) {
          const ndr = dr * yr - di * yi + qr;
          di = dr * yi + di * yr + qi;
          dr = ndr;
          const nqr = qr * yr - qi * yi + p[k];
          qi = qr * yi + qi * yr;
          qr = nqr;
          bound = bound * ymod + Math.abs(p[k]);
        }
        if (modulus(qr, qi) <= tolerance * bound) {
          done[i] = 1;
          remaining--;
          continue;
        }
        // p/p′ = 1 / (y·(n − y·q′/q))
        const qd = qr * qr + qi * qi;
        if (qd === 0) continue;
        const tr = (dr * qr + di * qi) / qd; // q′/q
        const ti = (di * qr - dr * qi) / qd;
        const ur = n - (yr * tr - yi * ti);
        const ui = -(yr * ti + yi * tr);
        const vr = yr * ur - yi * ui;
        const vi = yr * ui + yi * ur;
        const vd = vr * vr + vi * vi;
        if (vd === 0) continue;
        ratioRe = vr / vd;
        ratioIm = -vi / vd;
      }
      // Aberth correction: w = ratio / (1 − ratio·Σ_{j≠i} 1/(z_i − z_j))
      let sr = 0, si = 0;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        const ar = zr - re[j];
        const ai = zi - im[j];
        const ad = ar * ar + ai * ai;
        if (ad === 0) continue;
        sr += ar / ad;
        si -= ai / ad;
      }
      const cr = 1 - (ratioRe * sr - ratioIm * si);
      const ci = -(ratioRe * si + ratioIm * sr);
      const cd = cr * cr + ci * ci;
      let wr: number, wi: number;
      if (cd === 0 || !Number.isFinite(cd)) {
        wr = ratioRe;
        wi = ratioIm;
      } else {
        wr = (ratioRe * cr + ratioIm * ci) / cd;
        wi = (ratioIm * cr - ratioRe * ci) / cd;
      }
      if (Number.isFinite(wr) && Number.isFinite(wi)) {
        re[i] = zr - wr;
        im[i] = zi - wi;
      }
    }
  }
  return { converged: remaining === 0, iterations };
}

/** |x + jy| without overflow or underflow in the squares, and cheaper than Math.hypot. */
function modulus(x: number, y: number): number {
  const ax = Math.abs(x);
  const ay = Math.abs(y);
  const big = ax > ay ? ax : ay;
  if (big === 0 || big === Infinity) return big;
  const small = ax > ay ? ay : ax;
  const q = small / big;
  return big * Math.sqrt(1 + q * q);
}

/**
 * Nudges approximations that coincide exactly (or to the last few bits) apart: two equal iterates
 * see no repulsion from each other in the Aberth correction and would converge to the same root.
 */
function separateCoincident(re: Float64Array, im: Float64Array): void {
  const n = re.length;
  for (let i = 1; i < n; i++) {
    for (let j = 0; j < i; j++) {
      const size = Math.max(1e-300, Math.abs(re[j]) + Math.abs(im[j]));
      if (Math.abs(re[i] - re[j]) + Math.abs(im[i] - im[j]) <= 1e-13 * size || (re[i] === re[j] && im[i] === im[j])) {
        const nudge = 1e-8 * Math.max(size, 1e-8);
        re[i] += nudge * Math.cos(0.7 + i);
        im[i] += nudge * Math.sin(0.7 + i);
      }
    }
  }
}

/**
 * Starting points for the Aberth iteration from the upper convex hull of the Newton polygon
 * (k, log|a_k|): each hull edge gives a circle whose radius matches that group of root moduli.
 * Reference: Bini (1996), section 3.
 */
export function initialApproximations(p: Coefficients, re: Float64Array, im: Float64Array): void {
  const n = p.length - 1;
  // points by power k (p is highest-first, so power k sits at index n − k)
  const ks: number[] = [];
  const logs: number[] = [];
  for (let k = 0; k <= n; k++) {
    const a = Math.abs(p[n - k]);
    if (a > 0) {
      ks.push(k);
      logs.push(Math.log(a));
    }
  }
  const hull: number[] = [];
  for (let idx = 0; idx < ks.length; idx++) {
    while (hull.length >= 2) {
      const a = hull[hull.length - 2];
      const b = hull[hull.length - 1];
      const cross = (ks[b] - ks[a]) * (logs[idx] - logs[a]) - (logs[b] - logs[a]) * (ks[idx] - ks[a]);
      if (cross >= 0) hull.pop();
      else break;
    }
    hull.push(idx);
  }
  let slot = 0;
  // a lowest power > 0 means exact zero roots; start those at the origin
  for (let k = 0; k < ks[0]; k++) {
    re[slot] = 0;
    im[slot] = 0;
    slot++;
  }
  for (let h = 0; h + 1 < hull.length; h++) {
    const a = hull[h];
    const b = hull[h + 1];
    const count = ks[b] - ks[a];
    const radius = Math.exp((logs[a] - logs[b]) / count);
    for (let j = 0; j < count; j++) {
      const theta = (2 * Math.PI * j) / count + (2 * Math.PI * h) / n + 0.4;
      re[slot] = radius * Math.cos(theta);
      im[slot] = radius * Math.sin(theta);
      slot++;
    }
  }
}

/**
 * All roots of a real polynomial (highest power first, leading zeros allowed), conjugate-symmetric,
 * each with a backward error near machine precision. Roots at the origin are split off exactly.
 * Example: roots([1, 3, 2]) = [{re: −1, im: 0}, {re: −2, im: 0}] (in some order).
 */
export function roots(polynomial: Polynomial): Complex[] {
  let start = 0;
  while (start < polynomial.length && polynomial[start] === 0) start++;
  let end = polynomial.length;
  const zeros: Complex[] = [];
  while (end > start + 1 && polynomial[end - 1] === 0) {
    end--;
    zeros.push({ re: 0, im: 0 });
  }
  const p = polynomial.slice(start, end);
  const n = p.length - 1;
  if (n <= 0) return zeros;
  if (n === 1) return [...zeros, { re: -p[1] / p[0], im: 0 }];
  // solve for w = z/σ with σ the geometric mean of the root moduli, so that the coefficients of the
  // scaled polynomial are balanced even when the roots are astronomically large or small
  const sigma = Math.abs(p[n] / p[0]) ** (1 / n);
  const balanced = Number.isFinite(sigma) && sigma > 0 && (sigma > 1e8 || sigma < 1e-8);
  // coefficient i of p(σw)/σⁿ is a_i·σ^(−i), formed in the log domain so neither factor over- or underflows
  const logSigma = Math.log(sigma);
  const q = balanced ? p.map((c, i) => (c === 0 ? 0 : Math.sign(c) * Math.exp(Math.log(Math.abs(c)) - i * logSigma))) : p;
  if (balanced && !q.every(Number.isFinite)) return [...zeros, ...rootsOf(p)];
  const scaled = rootsOf(q);
  return [...zeros, ...(balanced ? scaled.map((w) => ({ re: w.re * sigma, im: w.im * sigma })) : scaled)];
}

function rootsOf(p: Polynomial): Complex[] {
  const n = p.length - 1;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  initialApproximations(p, re, im);
  const first = refineRoots(p, re, im, 500);
  if (!first.converged) {
    // clustered roots converge linearly; a second, longer pass from where we are settles them
    refineRoots(p, re, im, 2000);
  }
  const found: Complex[] = [];
  for (let i = 0; i < n; i++) found.push({ re: re[i], im: im[i] });
  return symmetrize(found, 64 * Number.EPSILON, p);
}
