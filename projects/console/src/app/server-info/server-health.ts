import { HttpClient, HttpContext } from '@angular/common/http';
import { inject, Injectable, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { Health } from '../api/api-types';
import { HANDLED_STATUSES, SESSION_REQUIRED } from '../problem/problem-context';

/** `GET /api/health` once at start: the server's version and whether its development mailbox is on. */
@Injectable({ providedIn: 'root' })
export class ServerHealth {
  private readonly http = inject(HttpClient);
  private readonly value = signal<Health | null>(null);

  /** The last health answer (null until loaded or when the server was not reachable). */
  readonly health = this.value.asReadonly();

  /** Loads the health answer; a failure leaves it null (the console still starts). */
  async load(): Promise<void> {
    try {
      this.value.set(await firstValueFrom(this.http.get<Health>('/api/health', { context: new HttpContext().set(SESSION_REQUIRED, false).set(HANDLED_STATUSES, [0, 500, 502, 503, 504]) })));
    } catch {
      this.value.set(null);
    }
  }

  /** Whether the development mailbox (captured e-mail) is available on this server. */
  hasMailbox(): boolean {
    const health = this.value() as (Health & { mailbox?: boolean }) | null;
    return health?.mailbox === true;
  }
}
