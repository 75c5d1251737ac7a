import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { API_V1 } from '../api/api-base';
import type { Schemas } from '../api/api-types';
import { handles } from '../problem/problem-context';

/** What to mint: models, page origins and lifetime (`EmbedTokenCreate`). */
export type EmbedTokenRequest = Schemas['EmbedTokenCreate'];

/** A minted token with its expiry, models and origins (`EmbedTokenCreated`). */
export type EmbedToken = Schemas['EmbedTokenCreated'];

/** Shortest and longest lifetime of an embed token (`EmbedTokenCreate.ttlSeconds`). */
export const TOKEN_LIFETIME = { minSeconds: 60, maxSeconds: 86400 } as const;

/** Embed tokens: short-lived, read-only, bound to models and page origins (`POST /embed-tokens`). */
@Injectable({ providedIn: 'root' })
export class EmbedTokensApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);

  /** Mints a token; field errors (400) and a model that is gone (404) are shown by the form. */
  mint(request: EmbedTokenRequest): Observable<EmbedToken> {
    return this.http.post<EmbedToken>(`${this.api}/embed-tokens`, request, { context: handles(400, 404) });
  }
}
