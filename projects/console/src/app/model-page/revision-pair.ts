import type { Params } from '@angular/router';
import type { RevisionSummary } from '../api/api-types';

/** Two revisions to compare: `from` on the left, `to` on the right. */
export interface RevisionPair {
  readonly from: number;
  readonly to: number;
}

/** The latest two revisions (the one before the newest on the left); null with fewer than two. */
export function defaultPair(revisions: readonly RevisionSummary[]): RevisionPair | null {
  const numbers = revisions.map((r) => r.revision).sort((a, b) => b - a);
  return numbers.length >= 2 ? { from: numbers[1] as number, to: numbers[0] as number } : null;
}

/** A revision number from a query parameter, when the model has that revision. */
function known(value: unknown, revisions: readonly RevisionSummary[]): number | null {
  const n = typeof value === 'string' && /^\d+$/.test(value) ? Number(value) : Number.NaN;
  return revisions.some((r) => r.revision === n) ? n : null;
}

/**
 * The pair the page compares: `from` and `to` of the URL where the model has those revisions, each one
 * that is missing or unknown taken from the latest two. Null while the model has a single revision.
 * Example (revisions 1–3): readPair({ from: '1' }, …) = { from: 1, to: 3 }; readPair({}, …) = { from: 2, to: 3 }.
 */
export function readPair(params: Params, revisions: readonly RevisionSummary[]): RevisionPair | null {
  const fallback = defaultPair(revisions);
  if (!fallback) return null;
  return { from: known(params['from'], revisions) ?? fallback.from, to: known(params['to'], revisions) ?? fallback.to };
}

/**
 * The revision the page shows read-only (`?revision=N`), or null for the current one (no parameter, an
 * unknown number, or the current revision itself).
 */
export function readShownRevision(params: Params, revisions: readonly RevisionSummary[], current: number): number | null {
  const n = known(params['revision'], revisions);
  return n === null || n === current ? null : n;
}
