import type { ClosedLoopPole } from '@polewright/locus-core';
import { formatComplex } from '../figures/figure-format';

/** One row of the pole table: a real pole, or a conjugate pair shown once as a ± bj. */
export interface PoleRow {
  readonly pole: ClosedLoopPole;
  /** Whether the row stands for a conjugate pair. */
  readonly isPair: boolean;
  readonly value: string;
}

/**
 * The closed-loop poles as table rows: conjugate pairs folded into one row (the member with Im > 0
 * kept), unstable poles first, then from the slowest decay (largest time constant) to the fastest.
 */
export function poleRows(poles: readonly ClosedLoopPole[]): PoleRow[] {
  const used = new Array<boolean>(poles.length).fill(false);
  const rows: PoleRow[] = [];
  poles.forEach((p, i) => {
    if (used[i]) return;
    used[i] = true;
    if (p.im === 0) {
      rows.push({ pole: p, isPair: false, value: formatComplex(p) });
      return;
    }
    const tol = 1e-9 * Math.max(1, Math.hypot(p.re, p.im));
    const j = poles.findIndex((q, k) => !used[k] && Math.abs(q.re - p.re) <= tol && Math.abs(q.im + p.im) <= tol);
    if (j < 0) {
      rows.push({ pole: p, isPair: false, value: formatComplex(p) });
      return;
    }
    used[j] = true;
    const upper = p.im > 0 ? p : poles[j];
    rows.push({ pole: upper, isPair: true, value: formatComplex(upper, true) });
  });
  return rows.sort((a, b) => slowness(b.pole) - slowness(a.pole));
}

function slowness(p: ClosedLoopPole): number {
  if (!p.isStable || p.timeConstant === null) return Number.POSITIVE_INFINITY;
  return p.timeConstant;
}
