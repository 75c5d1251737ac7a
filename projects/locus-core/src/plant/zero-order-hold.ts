import { expm, matrix } from './math';
import type { StateSpace } from './state-space';

/** Exact sampled model of a state-space model under a held input over one interval h. */
export interface HeldStep {
  /** Φ = e^{Ah}. */
  readonly phi: number[][];
  /** Γ = ∫₀ʰ e^{Aη} dη · B. */
  readonly gamma: number[];
}

/**
 * e^{Ah} and ∫₀ʰ e^{Aη}dη·B from one matrix exponential of the block matrix [[A, B], [0, 0]]·h
 * (C. F. Van Loan, "Computing integrals involving the matrix exponential", IEEE TAC 23 (1978)).
 * mathjs computes the exponential by scaling and squaring with a Padé approximant.
 */
export function heldStep(model: StateSpace, h: number): HeldStep {
  const n = model.a.length;
  if (n === 0) return { phi: [], gamma: [] };
  const block: number[][] = [];
  for (let i = 0; i < n; i++) block.push([...model.a[i].map((v) => v * h), model.b[i] * h]);
  block.push(new Array<number>(n + 1).fill(0));
  const e = exponential(block);
  return {
    phi: e.slice(0, n).map((row) => row.slice(0, n)),
    gamma: e.slice(0, n).map((row) => row[n]),
  };
}

/** Matrix–vector product. */
export function multiplyVector(m: readonly (readonly number[])[], v: readonly number[]): number[] {
  return m.map((row) => row.reduce((acc, x, j) => acc + x * v[j], 0));
}

/**
 * Matrix exponential by scaling and squaring around mathjs' Padé-based `expm`: the matrix is first
 * divided by 2^k so that its 1-norm is at most ½ (where mathjs' parameter search always succeeds), and
 * the result squared k times.
 */
export function exponential(m: number[][]): number[][] {
  let norm = 0;
  for (let j = 0; j < m.length; j++) {
    let column = 0;
    for (let i = 0; i < m.length; i++) column += Math.abs(m[i][j]);
    norm = Math.max(norm, column);
  }
  // an overflowing matrix has no representable exponential: NaN entries, rejected by the caller
  if (!Number.isFinite(norm)) return m.map((row) => row.map(() => NaN));
  // log2(norm) + 1 rather than log2(norm/0.5), which overflows for norms near the largest double
  const k = norm > 0.5 ? Math.ceil(Math.log2(norm) + 1) : 0;
  const factor = 2 ** -k; // stays a (possibly subnormal) positive number up to k = 1074
  const scaled = k > 0 ? m.map((row) => row.map((v) => v * factor)) : m;
  let e = expm(matrix(scaled)).toArray() as number[][];
  for (let i = 0; i < k; i++) e = multiplyMatrices(e, e);
  return e;
}

function multiplyMatrices(x: readonly (readonly number[])[], y: readonly (readonly number[])[]): number[][] {
  const n = x.length;
  const out: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(n).fill(0);
    for (let l = 0; l < n; l++) {
      const v = x[i][l];
      if (v === 0) continue;
      const yl = y[l];
      for (let j = 0; j < n; j++) row[j] += v * yl[j];
    }
    out.push(row);
  }
  return out;
}
