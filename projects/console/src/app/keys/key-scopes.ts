import type { Scope } from '../api/api-types';

/** A scope an API key may carry, and what it lets a script do (scopes do not imply one another). */
export interface ScopeInfo {
  readonly scope: Scope;
  readonly label: string;
  readonly explanation: string;
}

/** The three scopes of API keys, in the order the API lists them. */
export const SCOPES: readonly ScopeInfo[] = [
  { scope: 'models:read', label: 'Read models', explanation: 'List, read and export models, their revisions and their stored loci.' },
  { scope: 'models:write', label: 'Change models', explanation: 'Create, save, delete, restore and import models. Reading them needs "Read models" as well.' },
  { scope: 'compute', label: 'Compute', explanation: 'Compute pole paths, closed loops and design gain ranges for plants sent with the call. Nothing is stored.' },
];

/** Scopes in the canonical order, whatever order they were picked in. */
export function orderedScopes(picked: Iterable<Scope>): Scope[] {
  const set = new Set(picked);
  return SCOPES.map((s) => s.scope).filter((s) => set.has(s));
}
