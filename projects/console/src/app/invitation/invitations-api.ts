import { HttpClient, HttpContext } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { API_V1 } from '../api/api-base';
import type { Schemas } from '../api/api-types';
import { HANDLED_STATUSES, SESSION_REQUIRED } from '../problem/problem-context';

/** An invitation as its link's holder sees it (`state`: open, used or expired). */
export type InvitationDetails = Schemas['Invitation'];

/** What the invited person chooses: their name and password. */
export type InvitationAcceptance = Schemas['InvitationAccept'];

/** The public invitation calls: read one before accepting, and accept it (which signs the person in). */
@Injectable({ providedIn: 'root' })
export class InvitationsApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);

  /** The invitation behind a link; an unknown (404) or malformed (400) token is shown by the page. */
  get(token: string): Observable<InvitationDetails> {
    return this.http.get<InvitationDetails>(`${this.api}/invitations/${encodeURIComponent(token)}`, { context: publicCall(400, 404) });
  }

  /** Completes sign-up; the answer is a session. Field errors (400), used or expired (409) and gone (404) are shown by the page. */
  accept(token: string, acceptance: InvitationAcceptance): Observable<Schemas['SessionCreated']> {
    return this.http.post<Schemas['SessionCreated']>(`${this.api}/invitations/${encodeURIComponent(token)}/accept`, acceptance, { context: publicCall(400, 404, 409) });
  }
}

/** A call that needs no session (a 401 does not sign anyone out) whose problems of `statuses` the page shows. */
function publicCall(...statuses: number[]): HttpContext {
  return new HttpContext().set(SESSION_REQUIRED, false).set(HANDLED_STATUSES, statuses);
}
