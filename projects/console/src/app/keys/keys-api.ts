import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import { API_V1 } from '../api/api-base';
import type { Schemas } from '../api/api-types';
import { handles } from '../problem/problem-context';

/** An API key as the API lists it (never its secret). */
export type ApiKey = Schemas['ApiKey'];
/** What issuing a key needs: name, scopes, optional expiry. */
export type ApiKeyCreate = Schemas['ApiKeyCreate'];
/** A freshly issued key with its secret (`pwk_…`), which exists only in this answer. */
export type ApiKeyCreated = Schemas['ApiKeyCreated'];

/** API keys for scripts and other services (admin): list, issue, revoke. */
@Injectable({ providedIn: 'root' })
export class KeysApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);

  /** Every key, newest first, revoked and expired ones included. */
  list(): Observable<ApiKey[]> {
    return this.http.get<{ items: ApiKey[] }>(`${this.api}/api-keys`).pipe(map((page) => page.items));
  }

  /** Issues a key; field errors come back as a 400 the dialog shows at its fields. */
  issue(input: ApiKeyCreate): Observable<ApiKeyCreated> {
    return this.http.post<ApiKeyCreated>(`${this.api}/api-keys`, input, { context: handles(400) });
  }

  /** Revokes a key at once: calls with it are refused from now on. */
  revoke(id: string): Observable<void> {
    return this.http.delete<void>(`${this.api}/api-keys/${encodeURIComponent(id)}`);
  }
}
