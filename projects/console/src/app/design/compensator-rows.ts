import type { Compensator as LoopCompensator } from '@polewright/elements';
import type { Compensator as ApiCompensator, Complex } from '../api/api-types';

export type { LoopCompensator };

/** A root with both parts given (the elements' and the core's form). */
export interface Root {
  readonly re: number;
  readonly im: number;
}

/** One line of the compensator table: a real root (`im` 0) or the conjugate pair re ± j·im (`im` > 0). */
export interface RootRow {
  readonly re: number;
  readonly im: number;
}

/** The compensator as the elements hold it (every field present), from the API's form (fields optional). */
export function loopCompensatorOf(saved: ApiCompensator | null | undefined): LoopCompensator | null {
  if (!saved) return null;
  const full = (list: Complex[] | undefined): Root[] => (list ?? []).map((c) => ({ re: c.re, im: c.im ?? 0 }));
  return { zeros: full(saved.zeros), poles: full(saved.poles), gain: saved.gain ?? 1 };
}

/** Whether a compensator does nothing (no roots, gain 1): saved as null. */
export function isIdentity(c: LoopCompensator | null): boolean {
  return c === null || (c.zeros.length === 0 && c.poles.length === 0 && c.gain === 1);
}

/** The compensator to save: null when it does nothing. */
export function compensatorToSave(c: LoopCompensator | null): ApiCompensator | null {
  return isIdentity(c) ? null : { zeros: (c as LoopCompensator).zeros.map((z) => ({ re: z.re, im: z.im })), poles: (c as LoopCompensator).poles.map((p) => ({ re: p.re, im: p.im })), gain: (c as LoopCompensator).gain };
}

/** Whether two compensators are the same transfer function as listed (same roots in any order, same gain). */
export function sameCompensator(a: LoopCompensator | null, b: LoopCompensator | null): boolean {
  if (isIdentity(a) || isIdentity(b)) return isIdentity(a) && isIdentity(b);
  const x = a as LoopCompensator;
  const y = b as LoopCompensator;
  return x.gain === y.gain && sameRoots(x.zeros, y.zeros) && sameRoots(x.poles, y.poles);
}

function sameRoots(a: readonly Complex[], b: readonly Complex[]): boolean {
  if (a.length !== b.length) return false;
  const key = (c: Complex): string => `${c.re}|${c.im ?? 0}`;
  const left = a.map(key).sort();
  const right = b.map(key).sort();
  return left.every((k, i) => k === right[i]);
}

/**
 * Table rows of a list of roots: real roots one row each, a conjugate pair one row (upper half-plane
 * member, `im` > 0), in the order the roots first appear.
 * Example: rowsOf([{re: −1, im: 2}, {re: −1, im: −2}, {re: −5, im: 0}]) = [{re: −1, im: 2}, {re: −5, im: 0}].
 */
export function rowsOf(roots: readonly Complex[]): RootRow[] {
  const { rows } = groupRoots(roots);
  return rows;
}

/** The row holding the root at `index` of a root list (rows as `rowsOf` makes them), or −1. */
export function rowOfRoot(roots: readonly Complex[], index: number): number {
  return groupRoots(roots).rowOf[index] ?? -1;
}

/** The roots of table rows: a row with `im` ≠ 0 gives the pair re ± j·|im|. */
export function rootsOf(rows: readonly RootRow[]): Root[] {
  return rows.flatMap((row) => (row.im === 0 ? [{ re: row.re, im: 0 }] : [{ re: row.re, im: Math.abs(row.im) }, { re: row.re, im: -Math.abs(row.im) }]));
}

// rows, and for each root the row it went into; a complex root takes the first unused conjugate with it
function groupRoots(roots: readonly Complex[]): { rows: RootRow[]; rowOf: number[] } {
  const rows: RootRow[] = [];
  const rowOf: number[] = [];
  roots.forEach((root, i) => {
    if (rowOf[i] !== undefined) return;
    const im = root.im ?? 0;
    rowOf[i] = rows.length;
    if (im !== 0) {
      const partner = roots.findIndex((other, j) => j !== i && rowOf[j] === undefined && other.re === root.re && (other.im ?? 0) === -im);
      if (partner >= 0) rowOf[partner] = rows.length;
    }
    rows.push({ re: root.re, im: Math.abs(im) });
  });
  return { rows, rowOf };
}

/** A root as engineers write it: `−2`, `−1 ± 3j` (4 significant digits). */
export function rootText(row: RootRow): string {
  const re = formatFigure(row.re);
  return row.im === 0 ? re : `${re} ± ${formatFigure(row.im)}j`;
}

/** A figure in 4 significant digits, without trailing zeros, with a true minus sign. */
export function formatFigure(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return value > 0 ? '∞' : value < 0 ? '−∞' : '—';
  if (value === 0) return '0';
  const abs = Math.abs(value);
  const text = abs >= 1e-3 && abs < 1e6 ? String(Number(value.toPrecision(digits))) : value.toExponential(digits - 1).replace(/\.?0+e/, 'e');
  return text.replace(/-/g, '−');
}
