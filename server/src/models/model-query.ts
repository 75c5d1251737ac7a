import { InputError, type InputIssue } from '../http/errors.js';
import { querySort, queryText } from '../http/list-query.js';
import type { ModelQuery, ModelSort } from './model.js';

/** Page size when none is asked for, and the largest allowed (as in openapi.yaml's PageSize). */
export const PAGE_SIZE = { default: 50, max: 200 } as const;

const SORTS: readonly ModelSort[] = ['name', 'updatedAt', 'createdAt'];

/**
 * Reads the list query (`q`, `tag`, `sort`, `order`, `page`, `pageSize`, `includeDeleted`) from the query
 * string. The OpenAPI validator has already checked it; this turns it into typed values with defaults and
 * still refuses anything odd with pointers `/query/<name>`.
 */
export function readModelQuery(query: Record<string, unknown>): ModelQuery {
  const issues: InputIssue[] = [];
  const text = (name: string) => queryText(query, name, issues);
  const whole = (name: string, fallback: number, max: number): number => {
    const value = query[name];
    if (value === undefined || value === '') return fallback;
    const n = Number(value);
    if (!Number.isInteger(n) || n < 1 || n > max) {
      issues.push({ pointer: `/query/${name}`, detail: `must be a whole number from 1 to ${max}` });
      return fallback;
    }
    return n;
  };
  const { sort, order } = querySort(query, SORTS, 'updatedAt', (s) => (s === 'name' ? 'asc' : 'desc'), issues);
  const includeDeleted = readFlag(query['includeDeleted'], '/query/includeDeleted', issues);
  const result: ModelQuery = {
    q: text('q'),
    tag: text('tag')?.toLowerCase(),
    sort,
    order,
    page: whole('page', 1, 1_000_000),
    pageSize: whole('pageSize', PAGE_SIZE.default, PAGE_SIZE.max),
    includeDeleted,
  };
  if (issues.length) throw new InputError(issues);
  return result;
}

/** A boolean query flag (`true`/`false`, absent = false). */
export function readFlag(value: unknown, pointer: string, issues: InputIssue[]): boolean {
  if (value === undefined || value === '' || value === false || value === 'false') return false;
  if (value === true || value === 'true') return true;
  issues.push({ pointer, detail: 'must be true or false' });
  return false;
}
