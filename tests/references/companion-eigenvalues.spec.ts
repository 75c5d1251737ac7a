/**
 * Reference check of the pole paths against an outside eigenvalue solver: the closed-loop poles at
 * gain K are the roots of D + K·N, which are the eigenvalues of the companion matrix of D + K·N.
 * ml-matrix (a port of the JAMA Hessenberg–QR eigensolver) computes those eigenvalues independently
 * of the engine's Aberth–Ehrlich iteration.
 *
 * Roots are compared to 1e-8 relative to max(1, |root|) after pairing them by the minimum-total-distance
 * assignment. A root's error is its condition number times the backward error of the method, so the
 * comparison is made only at gains where every closed-loop root has a condition number below 1e6
 * (see `rootCondition`) and no two roots are closer than 1e-4 relative; near a break point (a multiple
 * root) both methods lose about half the digits and neither can be held to 1e-8 (common practice of
 * numerical analysis, no specific source).
 */
import { describe, expect, it, vi } from 'vitest';
import { characteristic, fromRoots, roots, scaledResidual, type LocusResult } from '../../projects/locus-core/src/public-api';
import { matchedRelativeGaps, type C } from './support/assignment';
import { rootCondition } from './support/conditioning';
import { companionEigenvalues } from './support/eigen';
import { locusManyInSeparateProcess, type IsolatedOutcome } from './support/isolated';
import { separatedRoots } from './support/plants';
import { polyAdd, polyPad, polyScale } from './support/poly';
import { Draw } from './support/random';

// locus calls run in a separate process that may have to time out (see support/isolated.ts)
vi.setConfig({ testTimeout: 600_000 });

const ROOT_TOLERANCE = 1e-8;
const RESIDUAL_TOLERANCE = 1e-9;
const CONDITION_LIMIT = 1e6;
const SEPARATION_LIMIT = 1e-4;
const PLANTS = 60;
const GAINS_PER_PLANT = 10;

interface Case {
  readonly label: string;
  readonly numerator: number[];
  readonly denominator: number[];
}

/** Plants of degree 2…20 with well-separated poles and zeros (a proper numerator of random degree and gain). */
function randomPlants(seed: number, count: number): Case[] {
  const draw = Draw.seeded(seed);
  const out: Case[] = [];
  for (let c = 0; c < count; c++) {
    const n = draw.integer(2, 20);
    const m = draw.integer(0, n);
    const scale = draw.logUniform(-1, 1);
    const poles = separatedRoots(draw, n, scale);
    const zeros = separatedRoots(draw, m, scale, 0.3, poles);
    const gain = draw.sign() * draw.logUniform(-2, 2);
    out.push({
      label: `plant #${c} (seed ${seed}): degree ${n}/${m}, scale ${scale.toPrecision(3)}, numerator gain ${gain.toPrecision(3)}`,
      numerator: polyScale(fromRoots(zeros), gain),
      denominator: fromRoots(poles),
    });
  }
  return out;
}

const plants = randomPlants(20240601, PLANTS);

/**
 * The loci of all plants, computed once in a separate process (see support/isolated.ts) so that a
 * call that never returns fails the tests that need it instead of the whole run.
 */
let outcomes: IsolatedOutcome[] | null = null;
function locusOf(index: number): LocusResult {
  outcomes ??= locusManyInSeparateProcess(plants.map((p) => ({ plant: { numerator: p.numerator, denominator: p.denominator } })));
  const outcome = outcomes[index];
  expect(outcome.failure ?? 'returned', `${plants[index].label}: locus must return`).toBe('returned');
  return outcome.result as LocusResult;
}

/** Smallest distance between two roots, relative to max(1, |root|). */
function minimumRelativeSeparation(values: readonly C[]): number {
  let smallest = Infinity;
  for (let i = 0; i < values.length; i++) {
    for (let j = 0; j < i; j++) {
      const scale = Math.max(1, Math.hypot(values[i].re, values[i].im));
      smallest = Math.min(smallest, Math.hypot(values[i].re - values[j].re, values[i].im - values[j].im) / scale);
    }
  }
  return smallest;
}

/** The closed-loop characteristic polynomial built by the test itself: D + K·N. */
function closedLoopPolynomial(numerator: readonly number[], denominator: readonly number[], gain: number): number[] {
  return polyAdd(denominator, polyScale(polyPad(numerator, denominator.length), gain));
}

describe('locus branches against companion-matrix eigenvalues', () => {
  it('traces one branch per open-loop pole, all on one shared gain grid from 0 to the span maximum', () => {
    for (const [index, plant] of plants.entries()) {
      const result = locusOf(index);
      const degree = result.normalizedPlant.denominator.length - 1;
      expect(result.branches.length, plant.label).toBe(degree);
      const grid = result.branches[0].points.map((p) => p.gain);
      expect(grid[0], plant.label).toBe(0);
      expect(grid[grid.length - 1], plant.label).toBe(result.gainSpan.max);
      for (let k = 1; k < grid.length; k++) expect(grid[k] > grid[k - 1], `${plant.label}: grid ascends at ${k}`).toBe(true);
      for (const branch of result.branches) expect(branch.points.map((p) => p.gain), plant.label).toEqual(grid);
    }
  });

  it('puts the branch points at the eigenvalues of the companion matrix of D + K·N, to 1e-8 relative, at gains spread over the span', () => {
    let compared = 0;
    for (const [index, plant] of plants.entries()) {
      const result = locusOf(index);
      const { numerator, denominator } = result.normalizedPlant;
      const length = result.branches[0].points.length;
      let comparedHere = 0;
      for (let j = 0; j < GAINS_PER_PLANT; j++) {
        const k = Math.round((j * (length - 1)) / (GAINS_PER_PLANT - 1));
        const gain = result.branches[0].points[k].gain;
        const polynomial = closedLoopPolynomial(numerator, denominator, gain);
        const eigenvalues = companionEigenvalues(polynomial);
        if (Math.max(...eigenvalues.map((r) => rootCondition(polynomial, r))) > CONDITION_LIMIT) continue;
        // the first-order condition number says nothing once two roots nearly coincide (next to a break
        // point); there the roots are only known to about √ε in either method
        if (minimumRelativeSeparation(eigenvalues) < SEPARATION_LIMIT) continue;
        const poles: C[] = result.branches.map((b) => ({ re: b.points[k].re, im: b.points[k].im }));
        const { gaps, pairs } = matchedRelativeGaps(poles, eigenvalues);
        gaps.forEach((gap, i) => {
          const [got, reference] = pairs[i];
          expect(gap, `${plant.label} at K = ${gain}: pole ${got.re}${got.im >= 0 ? '+' : ''}${got.im}j vs eigenvalue ${reference.re}${reference.im >= 0 ? '+' : ''}${reference.im}j`).toBeLessThanOrEqual(ROOT_TOLERANCE);
        });
        comparedHere++;
      }
      // the gains skipped as ill-conditioned must stay the exception, or the check says nothing
      expect(comparedHere, `${plant.label}: gains compared`).toBeGreaterThanOrEqual(GAINS_PER_PLANT / 2);
      compared += comparedHere;
    }
    expect(compared).toBeGreaterThanOrEqual(0.9 * PLANTS * GAINS_PER_PLANT);
  });

  it('returns only poles with a scaled residual of at most 1e-9 in characteristic(N, D, K), at every traced gain', () => {
    for (const [index, plant] of plants.entries()) {
      const result = locusOf(index);
      const { numerator, denominator } = result.normalizedPlant;
      for (const branch of result.branches) {
        for (const point of branch.points) {
          const residual = scaledResidual(characteristic(numerator, denominator, point.gain), point);
          expect(residual, `${plant.label}: pole ${point.re}${point.im >= 0 ? '+' : ''}${point.im}j at K = ${point.gain}`).toBeLessThanOrEqual(RESIDUAL_TOLERANCE);
        }
      }
    }
  });

  it('builds characteristic(N, D, K) as D + K·N with N aligned at the constant term', () => {
    // (s² + 3s + 2) + 5·(s + 4) = s² + 8s + 22, by hand
    expect(characteristic([1, 4], [1, 3, 2], 5)).toEqual([1, 8, 22]);
    for (const plant of plants.slice(0, 10)) {
      const gain = 1.7;
      const expected = closedLoopPolynomial(plant.numerator, plant.denominator, gain);
      const got = characteristic(plant.numerator, plant.denominator, gain);
      expect(got.length).toBe(expected.length);
      got.forEach((c, i) => expect(c).toBe(expected[i]));
    }
  });
});

describe('roots() against companion-matrix eigenvalues', () => {
  it('finds the roots of polynomials built from separated roots as the eigensolver does, to 1e-8 relative', () => {
    const draw = Draw.seeded(777);
    for (let c = 0; c < 80; c++) {
      const n = draw.integer(1, 20);
      const scale = draw.logUniform(-2, 2);
      const chosen = separatedRoots(draw, n, scale);
      const p = polyScale(fromRoots(chosen), draw.sign() * draw.logUniform(-3, 3));
      const eigenvalues = companionEigenvalues(p);
      const found = roots(p);
      expect(found.length).toBe(n);
      const { gaps } = matchedRelativeGaps(found, eigenvalues);
      for (const gap of gaps) expect(gap, `case ${c}, degree ${n}, scale ${scale}`).toBeLessThanOrEqual(ROOT_TOLERANCE);
      // and both agree with the roots the polynomial was built from (rounding of the product only)
      const { gaps: toChosen } = matchedRelativeGaps(found, chosen);
      for (const gap of toChosen) expect(gap, `case ${c}: against the chosen roots`).toBeLessThanOrEqual(ROOT_TOLERANCE);
    }
  });

  it('finds the roots of random-coefficient polynomials, with exact zero roots split off, as the eigensolver does', () => {
    const draw = Draw.seeded(4242);
    let compared = 0;
    for (let c = 0; c < 200; c++) {
      const n = draw.integer(1, 20);
      const zerosAtOrigin = draw.uniform(0, 1) < 0.25 ? draw.integer(1, 3) : 0;
      const p = [draw.sign() * draw.uniform(0.5, 2)];
      for (let i = 1; i <= n; i++) p.push(draw.normal());
      if (p[n] === 0) p[n] = 1;
      const padded = [...(draw.uniform(0, 1) < 0.2 ? [0] : []), ...p, ...new Array<number>(zerosAtOrigin).fill(0)];
      const eigenvalues = [...companionEigenvalues(p), ...new Array<C>(zerosAtOrigin).fill({ re: 0, im: 0 })];
      if (Math.max(...companionEigenvalues(p).map((r) => rootCondition(p, r))) > CONDITION_LIMIT) continue;
      const found = roots(padded);
      expect(found.length, `case ${c}`).toBe(n + zerosAtOrigin);
      expect(found.filter((r) => r.re === 0 && r.im === 0).length, `case ${c}: exact zeros`).toBeGreaterThanOrEqual(zerosAtOrigin);
      const { gaps } = matchedRelativeGaps(found, eigenvalues);
      for (const gap of gaps) expect(gap, `case ${c}, degree ${n}`).toBeLessThanOrEqual(ROOT_TOLERANCE);
      compared++;
    }
    expect(compared).toBeGreaterThanOrEqual(180);
  });

  it('finds the same roots whatever the overall scale of the coefficients, from 1e-200 to 1e200', () => {
    // c·p has the roots of p for every c ≠ 0, and so has its companion matrix (built from the monic
    // polynomial), so the eigenvalues are the reference at every scale
    const draw = Draw.seeded(31337);
    for (let c = 0; c < 12; c++) {
      const n = draw.integer(2, 10);
      const base = polyScale(fromRoots(separatedRoots(draw, n, draw.logUniform(-1, 1))), draw.uniform(0.5, 2));
      const reference = companionEigenvalues(base);
      for (const factor of [1e-200, 1e-160, 1e-120, 1e-60, 1, 1e60, 1e120, 1e160, 1e200]) {
        const found = roots(polyScale(base, factor));
        const { gaps } = matchedRelativeGaps(found, reference);
        for (const gap of gaps) expect(gap, `case ${c}, degree ${n}, coefficients scaled by ${factor}`).toBeLessThanOrEqual(ROOT_TOLERANCE);
      }
    }
  });

  it('returns real roots as exact conjugate pairs or exactly real values for a real polynomial', () => {
    const draw = Draw.seeded(99);
    for (let c = 0; c < 50; c++) {
      const n = draw.integer(2, 20);
      const p = [1, ...Array.from({ length: n }, () => draw.normal())];
      const found = roots(p);
      const upper = found.filter((r) => r.im > 0).map((r) => `${r.re}/${r.im}`).sort();
      const lower = found.filter((r) => r.im < 0).map((r) => `${r.re}/${-r.im}`).sort();
      expect(upper, `case ${c}`).toEqual(lower);
    }
  });
});
