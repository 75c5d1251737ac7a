import type { Complex } from '@polewright/locus-core';
import type { Compensator } from '../loop/loop-model';

/** Which compensator points the plot's tool adds on a click. */
export type EditTool = 'none' | 'zero' | 'pole';

/**
 * One draggable compensator point: a real value, or the upper member of a conjugate pair (its partner
 * follows, mirrored). `index` and `partner` point into the compensator's `zeros` or `poles`.
 */
export interface Handle {
  readonly kind: 'zero' | 'pole';
  readonly index: number;
  readonly partner: number | null;
  readonly point: Complex;
}

/** The compensator with nothing in it. */
export const EMPTY_COMPENSATOR: Compensator = { zeros: [], poles: [], gain: 1 };

/**
 * The draggable points of a compensator: real ones and the upper member of each conjugate pair (pairs are
 * matched as the model reader checks them: equal real parts, opposite imaginary parts).
 */
export function handlesOf(c: Compensator): Handle[] {
  const out: Handle[] = [];
  for (const kind of ['zero', 'pole'] as const) {
    const list = kind === 'zero' ? c.zeros : c.poles;
    const used = new Set<number>();
    list.forEach((p, i) => {
      if (used.has(i)) return;
      used.add(i);
      if (p.im === 0) {
        out.push({ kind, index: i, partner: null, point: p });
        return;
      }
      const tol = 1e-9 * Math.max(1, Math.hypot(p.re, p.im));
      const j = list.findIndex((q, k) => !used.has(k) && Math.abs(q.re - p.re) <= tol && Math.abs(q.im + p.im) <= tol);
      if (j >= 0) used.add(j);
      const upper = p.im > 0 || j < 0 ? i : j;
      out.push({ kind, index: upper, partner: j < 0 ? null : upper === i ? j : i, point: list[upper] });
    });
  }
  return out;
}

/**
 * The compensator with a point added at `at`: on the real axis when |Im| ≤ `snap` (plane units, so a
 * click within a few pixels of the axis gives a real point), else as a conjugate pair a ± bj.
 */
export function addPoint(c: Compensator | null, kind: 'zero' | 'pole', at: Complex, snap: number): Compensator {
  const base = c ?? EMPTY_COMPENSATOR;
  const added: Complex[] = Math.abs(at.im) <= snap ? [{ re: at.re, im: 0 }] : [{ re: at.re, im: Math.abs(at.im) }, { re: at.re, im: -Math.abs(at.im) }];
  return kind === 'zero' ? { ...base, zeros: [...base.zeros, ...added] } : { ...base, poles: [...base.poles, ...added] };
}

/** How many values adding at `at` puts in (1 real, 2 for a pair) — for the loop's degree check. */
export function addedCount(at: Complex, snap: number): number {
  return Math.abs(at.im) <= snap ? 1 : 2;
}

/**
 * The compensator with a handle moved to `to`: a real point slides along the real axis; a pair moves
 * mirrored and keeps |Im| ≥ `minIm` (it never merges into a double real point while dragged).
 */
export function movePoint(c: Compensator, handle: Handle, to: Complex, minIm: number): Compensator {
  const list = [...(handle.kind === 'zero' ? c.zeros : c.poles)];
  if (handle.partner === null && list[handle.index].im === 0) {
    list[handle.index] = { re: to.re, im: 0 };
  } else {
    const im = Math.max(Math.abs(to.im), minIm);
    list[handle.index] = { re: to.re, im };
    if (handle.partner !== null) list[handle.partner] = { re: to.re, im: -im };
  }
  return handle.kind === 'zero' ? { ...c, zeros: list } : { ...c, poles: list };
}

/** The compensator without a handle's point (and its conjugate partner); null once nothing is left. */
export function removePoint(c: Compensator, handle: Handle): Compensator | null {
  const drop = new Set([handle.index, ...(handle.partner === null ? [] : [handle.partner])]);
  const list = (handle.kind === 'zero' ? c.zeros : c.poles).filter((_, i) => !drop.has(i));
  const next = handle.kind === 'zero' ? { ...c, zeros: list } : { ...c, poles: list };
  return next.zeros.length === 0 && next.poles.length === 0 && next.gain === 1 ? null : next;
}

/** The handle a handle became after an edit (same kind and index), for keeping a selection. */
export function sameHandle(handles: readonly Handle[], kind: 'zero' | 'pole', index: number): Handle | null {
  return handles.find((h) => h.kind === kind && (h.index === index || h.partner === index)) ?? null;
}
