import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { API_V1, queryParams } from '../api/api-base';
import type { Schemas } from '../api/api-types';

/** One audited event. */
export type AuditEvent = Schemas['AuditEvent'];

/** Filters and page of `GET /audit`: exact action or a prefix ending in ".", actor id, time window [from, to). */
export interface AuditQuery {
  readonly action?: string;
  readonly actorId?: string;
  /** ISO date-time, inclusive. */
  readonly from?: string;
  /** ISO date-time, exclusive. */
  readonly to?: string;
  readonly page?: number;
  readonly pageSize?: number;
}

/** The audit trail (admin): who did what to which thing, newest first. */
@Injectable({ providedIn: 'root' })
export class AuditApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);

  /** One page of events matching the filters. */
  list(query: AuditQuery): Observable<Schemas['AuditPage']> {
    return this.http.get<Schemas['AuditPage']>(`${this.api}/audit`, { params: queryParams({ ...query }) });
  }
}
