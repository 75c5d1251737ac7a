/**
 * Minimum-total-cost perfect matching of an n×n cost matrix (the Hungarian method with potentials,
 * O(n³), as in Kuhn 1955 / Munkres 1957). Returns `match[i]` = the column assigned to row i.
 */
export function minimumCostAssignment(cost: readonly (readonly number[])[]): number[] {
  const n = cost.length;
  const INF = Number.POSITIVE_INFINITY;
  const u = new Array<number>(n + 1).fill(0);
  const v = new Array<number>(n + 1).fill(0);
  const p = new Array<number>(n + 1).fill(0); // p[j]: row matched to column j (1-based, 0 = none)
  const way = new Array<number>(n + 1).fill(0);
  for (let i = 1; i <= n; i++) {
    p[0] = i;
    let j0 = 0;
    const minv = new Array<number>(n + 1).fill(INF);
    const used = new Array<boolean>(n + 1).fill(false);
    do {
      used[j0] = true;
      const i0 = p[j0];
      let delta = INF;
      let j1 = 0;
      for (let j = 1; j <= n; j++) {
        if (used[j]) continue;
        const cur = cost[i0 - 1][j - 1] - u[i0] - v[j];
        if (cur < minv[j]) {
          minv[j] = cur;
          way[j] = j0;
        }
        if (minv[j] < delta) {
          delta = minv[j];
          j1 = j;
        }
      }
      for (let j = 0; j <= n; j++) {
        if (used[j]) {
          u[p[j]] += delta;
          v[j] -= delta;
        } else minv[j] -= delta;
      }
      j0 = j1;
    } while (p[j0] !== 0);
    do {
      const j1 = way[j0];
      p[j0] = p[j1];
      j0 = j1;
    } while (j0 !== 0);
  }
  const match = new Array<number>(n).fill(-1);
  for (let j = 1; j <= n; j++) if (p[j] > 0) match[p[j] - 1] = j - 1;
  return match;
}

export interface C {
  readonly re: number;
  readonly im: number;
}

/**
 * Pairs two equally long root lists by the minimum-total-distance assignment and returns, for each
 * pair, the distance divided by max(1, |reference root|).
 */
export function matchedRelativeGaps(actual: readonly C[], reference: readonly C[]): { gaps: number[]; pairs: [C, C][] } {
  if (actual.length !== reference.length) throw new Error(`root counts differ: ${actual.length} vs ${reference.length}`);
  const cost = actual.map((a) => reference.map((r) => Math.hypot(a.re - r.re, a.im - r.im)));
  const match = minimumCostAssignment(cost);
  const gaps: number[] = [];
  const pairs: [C, C][] = [];
  match.forEach((j, i) => {
    const r = reference[j];
    gaps.push(cost[i][j] / Math.max(1, Math.hypot(r.re, r.im)));
    pairs.push([actual[i], r]);
  });
  return { gaps, pairs };
}
