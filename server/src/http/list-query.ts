import type { InputIssue } from './errors.js';

/** Sort direction of a list. */
export type SortOrder = 'asc' | 'desc';

/**
 * One text parameter of a list's query string, trimmed; absent or empty gives undefined, and a repeated
 * parameter (an array) adds an issue with pointer `/query/<name>`.
 */
export function queryText(query: Record<string, unknown>, name: string, issues: InputIssue[]): string | undefined {
  const value = query[name];
  if (value === undefined || value === '') return undefined;
  if (typeof value !== 'string') {
    issues.push({ pointer: `/query/${name}`, detail: 'must be given once, as text' });
    return undefined;
  }
  return value.trim() || undefined;
}

/**
 * `sort` (one of `sorts`, `fallback` when absent) and `order` (`asc`/`desc`, `defaultOrder(sort)` when
 * absent) of a list's query string; anything else adds an issue with its pointer.
 */
export function querySort<S extends string>(query: Record<string, unknown>, sorts: readonly S[], fallback: S, defaultOrder: (sort: S) => SortOrder, issues: InputIssue[]): { sort: S; order: SortOrder } {
  const sort = (queryText(query, 'sort', issues) ?? fallback) as S;
  if (!sorts.includes(sort)) issues.push({ pointer: '/query/sort', detail: `must be one of ${sorts.join(', ')}` });
  const order = queryText(query, 'order', issues) ?? defaultOrder(sort);
  if (order !== 'asc' && order !== 'desc') issues.push({ pointer: '/query/order', detail: 'must be asc or desc' });
  return { sort, order: order as SortOrder };
}
