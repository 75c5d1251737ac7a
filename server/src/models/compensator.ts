import type { Complex } from '@polewright/locus-core';
import type { InputIssue as Issue } from '../http/errors.js';
import type { Compensator } from './model.js';

/** Most zeros or poles a compensator may list (the core's degree limit applies to the whole loop). */
export const MAX_COMPENSATOR_ROOTS = 20;

/**
 * Checks a compensator `{ zeros, poles, gain }` (or null) and returns it in plain form; pushes one issue per
 * field at fault. Complex values must come in conjugate pairs, since the loop is a real transfer function.
 */
export function readCompensator(value: unknown, pointer: string, issues: Issue[]): Compensator | null {
  if (value === null || value === undefined) return null;
  if (typeof value !== 'object' || Array.isArray(value)) {
    issues.push({ pointer, detail: 'must be null or an object { "zeros": [...], "poles": [...], "gain": number }' });
    return null;
  }
  const record = value as Record<string, unknown>;
  const zeros = readRoots(record['zeros'] ?? [], `${pointer}/zeros`, issues);
  const poles = readRoots(record['poles'] ?? [], `${pointer}/poles`, issues);
  const gain = record['gain'] ?? 1;
  if (typeof gain !== 'number' || !Number.isFinite(gain) || gain === 0) {
    issues.push({ pointer: `${pointer}/gain`, detail: 'must be a finite, non-zero number' });
    return null;
  }
  if (zeros === null || poles === null) return null;
  return { zeros, poles, gain };
}

function readRoots(value: unknown, pointer: string, issues: Issue[]): Complex[] | null {
  if (!Array.isArray(value)) {
    issues.push({ pointer, detail: 'must be an array of complex numbers { "re": number, "im": number }' });
    return null;
  }
  if (value.length > MAX_COMPENSATOR_ROOTS) {
    issues.push({ pointer, detail: `lists ${value.length} values; at most ${MAX_COMPENSATOR_ROOTS} are accepted` });
    return null;
  }
  const out: Complex[] = [];
  let ok = true;
  value.forEach((v: unknown, i) => {
    const item = v as Record<string, unknown> | null;
    const re = item?.['re'];
    const im = item?.['im'] ?? 0;
    if (typeof item !== 'object' || item === null || typeof re !== 'number' || !Number.isFinite(re) || typeof im !== 'number' || !Number.isFinite(im)) {
      issues.push({ pointer: `${pointer}/${i}`, detail: 'must be { "re": number, "im": number } with finite numbers' });
      ok = false;
      return;
    }
    out.push({ re, im });
  });
  if (!ok) return null;
  const unpaired = firstUnpaired(out);
  if (unpaired >= 0) {
    issues.push({ pointer: `${pointer}/${unpaired}`, detail: 'is complex without its conjugate; complex values of a real compensator come in pairs a ± bj' });
    return null;
  }
  return out;
}

/** Index of the first non-real value whose conjugate is missing (same relative tolerance as the core: 1e-9), or −1. */
function firstUnpaired(values: readonly Complex[]): number {
  const used = new Array<boolean>(values.length).fill(false);
  for (let i = 0; i < values.length; i++) {
    if (used[i]) continue;
    const v = values[i];
    const tolerance = 1e-9 * Math.max(1, Math.hypot(v.re, v.im));
    used[i] = true;
    if (Math.abs(v.im) <= tolerance) continue;
    const j = values.findIndex((w, k) => !used[k] && Math.abs(w.re - v.re) <= tolerance && Math.abs(w.im + v.im) <= tolerance);
    if (j < 0) return i;
    used[j] = true;
  }
  return -1;
}
