import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { EMPTY, expand, type Observable, reduce } from 'rxjs';
import { API_V1, queryParams } from '../api/api-base';
import type { Role, Schemas, User } from '../api/api-types';
import { handles } from '../problem/problem-context';

/** A user's account state (`User.status`). */
export type UserStatus = User['status'];

/** The list query of the People screen (`GET /users`): search, filters, order and page. */
export interface PeopleQuery {
  /** Case-insensitive text searched in e-mail and name. */
  readonly q?: string;
  readonly role?: Role;
  readonly status?: UserStatus;
  readonly sort?: 'email' | 'name' | 'createdAt';
  readonly order?: 'asc' | 'desc';
  readonly page?: number;
  readonly pageSize?: number;
}

/** The largest page the API gives (`PageSize` maximum). */
const LARGEST_PAGE = 200;

/**
 * The people of the team (admin): list with server-side filters and paging, a directory of everyone (for
 * "issued by" and actor names elsewhere), invite, and change role or status.
 */
@Injectable({ providedIn: 'root' })
export class PeopleApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);

  /** One page of people. */
  list(query: PeopleQuery): Observable<Schemas['UserPage']> {
    return this.http.get<Schemas['UserPage']>(`${this.api}/users`, { params: queryParams({ ...query }) });
  }

  /** Everyone, by name (all pages): to show names where the API gives user ids. */
  directory(): Observable<User[]> {
    const page = (n: number) => this.list({ sort: 'name', order: 'asc', page: n, pageSize: LARGEST_PAGE });
    return page(1).pipe(
      expand((p) => (p.page * p.pageSize < p.total && p.items.length > 0 ? page(p.page + 1) : EMPTY)),
      reduce((all, p) => all.concat(p.items), [] as User[]),
    );
  }

  /** Invites a person; the e-mail holds a link to complete sign-up. A taken e-mail comes back as 409. */
  invite(invite: Schemas['UserInvite']): Observable<Schemas['UserInvited']> {
    return this.http.post<Schemas['UserInvited']>(`${this.api}/users`, invite, { context: handles(400, 409) });
  }

  /**
   * Changes a person's role or status. The API refuses (409) to remove the last active admin, or the
   * caller's own admin rights; the screen shows that message itself.
   */
  update(id: string, change: Schemas['UserUpdate']): Observable<User> {
    return this.http.patch<User>(`${this.api}/users/${encodeURIComponent(id)}`, change, { context: handles(409) });
  }
}

/** A lookup from user id to the person (for names in other screens). */
export function byId(users: readonly User[]): ReadonlyMap<string, User> {
  return new Map(users.map((u) => [u.id, u]));
}

/** The name to show for a user id: the person's name, or a short form of the id when the person is unknown. */
export function personName(people: ReadonlyMap<string, User>, id: string | null | undefined): string {
  if (!id) return 'System';
  return people.get(id)?.name ?? `Unknown person (${id.slice(0, 8)})`;
}
