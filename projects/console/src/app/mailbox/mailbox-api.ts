import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import { API_V1 } from '../api/api-base';
import type { Schemas } from '../api/api-types';
import { handles } from '../problem/problem-context';

/** One e-mail the server would have sent, as captured. */
export type MailMessage = Schemas['MailMessage'];

/** The development mailbox (admin): e-mail captured by the server's local fake SMTP server. */
@Injectable({ providedIn: 'root' })
export class MailboxApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);

  /** The captured messages, newest first. A 404 means this server has no mailbox (the screen says so). */
  messages(): Observable<MailMessage[]> {
    return this.http.get<Schemas['Mailbox']>(`${this.api}/dev/mailbox`, { context: handles(404) }).pipe(map((box) => box.items));
  }
}
