import type { ComplexEntry } from './plant-body';

// the pairing rule of the core's hasCompleteConjugatePairs: equal within 1e-9 of the value's size
const TOLERANCE = 1e-9;

/**
 * The rows of a pole or zero list whose complex value has no conjugate in the list (each value pairs
 * once), so that the editor can offer to add it. Rows without a real part are skipped.
 * Example: unpairedRows([{ re: -1, im: 2 }, { re: -3, im: 0 }]) = [0].
 */
export function unpairedRows(entries: readonly ComplexEntry[]): number[] {
  const used = new Array<boolean>(entries.length).fill(false);
  const unpaired: number[] = [];
  entries.forEach((v, i) => {
    if (used[i] || v.re === null) return;
    used[i] = true;
    const im = v.im ?? 0;
    const scale = TOLERANCE * Math.max(1, Math.hypot(v.re, im));
    if (Math.abs(im) <= scale) return;
    const match = entries.findIndex((w, j) => !used[j] && w.re !== null && Math.abs(w.re - (v.re as number)) <= scale && Math.abs((w.im ?? 0) + im) <= scale);
    if (match < 0) unpaired.push(i);
    else used[match] = true;
  });
  return unpaired;
}

/** The conjugate of a value. Example: conjugateOf({ re: -1, im: 2 }) = { re: -1, im: -2 }. */
export function conjugateOf(value: ComplexEntry): ComplexEntry {
  return { re: value.re, im: value.im === null || value.im === 0 ? 0 : -value.im };
}
