import { expm, matrix } from 'mathjs';
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
  const e = (expm(matrix(block)).toArray() as number[][]);
  return {
    phi: e.slice(0, n).map((row) => row.slice(0, n)),
    gamma: e.slice(0, n).map((row) => row[n]),
  };
}

/** Matrix–vector product. */
export function multiplyVector(m: readonly (readonly number[])[], v: readonly number[]): number[] {
  return m.map((row) => row.reduce((acc, x, j) => acc + x * v[j], 0));
}
