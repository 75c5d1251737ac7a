import type { Params } from '@angular/router';
import type { ModelQuery } from './models-api';

/** The library's view of the list: every field set (the URL leaves defaults out). */
export interface LibraryQuery {
  readonly q: string;
  readonly tag: string;
  readonly sort: NonNullable<ModelQuery['sort']>;
  readonly order: NonNullable<ModelQuery['order']>;
  readonly page: number;
  readonly pageSize: number;
  readonly includeDeleted: boolean;
}

/** Page sizes the paginator offers (the API takes up to 200). */
export const PAGE_SIZES: readonly number[] = [10, 25, 50, 100];

/** What the library shows without query parameters: newest change first, 25 a page. */
export const DEFAULT_LIBRARY_QUERY: LibraryQuery = { q: '', tag: '', sort: 'updatedAt', order: 'desc', page: 1, pageSize: 25, includeDeleted: false };

const SORTS: readonly LibraryQuery['sort'][] = ['name', 'updatedAt', 'createdAt'];

/** The order a sort starts with, as the API defaults it: names A→Z, times newest first. */
export function defaultOrder(sort: LibraryQuery['sort']): LibraryQuery['order'] {
  return sort === 'name' ? 'asc' : 'desc';
}

function whole(value: unknown, fallback: number, min: number, max: number): number {
  const n = typeof value === 'string' && /^\d+$/.test(value) ? Number(value) : Number.NaN;
  return Number.isSafeInteger(n) && n >= min && n <= max ? n : fallback;
}

function text(value: unknown, max: number): string {
  return typeof value === 'string' ? value.trim().slice(0, max) : '';
}

/**
 * Reads the library's query parameters (as the URL holds them) into a full query; anything missing or
 * out of range falls back to the default, so a hand-edited link still opens a sensible list.
 * Example: readLibraryQuery({ sort: 'name', page: '2' }) = { …defaults, sort: 'name', order: 'asc', page: 2 }.
 */
export function readLibraryQuery(params: Params): LibraryQuery {
  const sort = SORTS.includes(params['sort']) ? (params['sort'] as LibraryQuery['sort']) : DEFAULT_LIBRARY_QUERY.sort;
  const order = params['order'] === 'asc' || params['order'] === 'desc' ? (params['order'] as LibraryQuery['order']) : defaultOrder(sort);
  return {
    q: text(params['q'], 200),
    tag: text(params['tag'], 40).toLowerCase(),
    sort,
    order,
    page: whole(params['page'], 1, 1, 1_000_000),
    pageSize: whole(params['pageSize'], DEFAULT_LIBRARY_QUERY.pageSize, 1, 200),
    includeDeleted: params['includeDeleted'] === 'true',
  };
}

/**
 * The query parameters of a library view for the URL: only what differs from the defaults, so that the
 * plain library is `/models` and a shared link reads well (`/models?tag=conveyor&sort=name`).
 */
export function libraryQueryParams(query: LibraryQuery): Params {
  const params: Params = {};
  if (query.q) params['q'] = query.q;
  if (query.tag) params['tag'] = query.tag;
  if (query.sort !== DEFAULT_LIBRARY_QUERY.sort) params['sort'] = query.sort;
  if (query.order !== defaultOrder(query.sort)) params['order'] = query.order;
  if (query.page !== 1) params['page'] = String(query.page);
  if (query.pageSize !== DEFAULT_LIBRARY_QUERY.pageSize) params['pageSize'] = String(query.pageSize);
  if (query.includeDeleted) params['includeDeleted'] = 'true';
  return params;
}

/** The list call for a library view (`GET /models`): empty filters left out. */
export function listQuery(query: LibraryQuery): ModelQuery {
  return {
    q: query.q || undefined,
    tag: query.tag || undefined,
    sort: query.sort,
    order: query.order,
    page: query.page,
    pageSize: query.pageSize,
    includeDeleted: query.includeDeleted || undefined,
  };
}

/** Whether the view narrows the list (text or tag): an empty answer then means "no match", not "no models". */
export function isFiltered(query: LibraryQuery): boolean {
  return query.q !== '' || query.tag !== '';
}
