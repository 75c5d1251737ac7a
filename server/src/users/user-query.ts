import { isRole, type Role } from '../auth/permissions.js';
import { InputError, type InputIssue } from '../http/errors.js';
import { querySort, queryText } from '../http/list-query.js';
import type { UserStatus } from './user.entity.js';

/** What the user list can be sorted by. */
export type UserSort = 'email' | 'name' | 'createdAt';

/** Filters and order of the user list (paging comes from `pagingOf`). */
export interface UserQuery {
  /** Case-insensitive substring of the e-mail or the name. */
  readonly q?: string;
  readonly role?: Role;
  readonly status?: UserStatus;
  readonly sort: UserSort;
  readonly order: 'asc' | 'desc';
}

const SORTS: readonly UserSort[] = ['email', 'name', 'createdAt'];
const STATUSES: readonly UserStatus[] = ['invited', 'active', 'deactivated'];

/**
 * Reads `q`, `role`, `status`, `sort` and `order` from the query string of `GET /users`. The OpenAPI
 * validator has checked them already; this gives typed values with defaults (every user, by e-mail, as
 * before the filters existed; `order` defaults to `asc` for the texts and `desc` for createdAt, as the
 * model list does) and still refuses anything odd with pointers `/query/<name>`.
 */
export function readUserQuery(query: Record<string, unknown>): UserQuery {
  const issues: InputIssue[] = [];
  const text = (name: string) => queryText(query, name, issues);
  const { sort, order } = querySort(query, SORTS, 'email', (s) => (s === 'createdAt' ? 'desc' : 'asc'), issues);
  const role = text('role');
  if (role !== undefined && !isRole(role)) issues.push({ pointer: '/query/role', detail: 'must be admin, engineer or viewer' });
  const status = text('status') as UserStatus | undefined;
  if (status !== undefined && !STATUSES.includes(status)) issues.push({ pointer: '/query/status', detail: `must be one of ${STATUSES.join(', ')}` });
  if (issues.length) throw new InputError(issues);
  return { q: text('q'), role: role as Role | undefined, status, sort, order };
}
