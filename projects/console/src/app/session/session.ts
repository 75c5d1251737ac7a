import { HttpClient, HttpContext } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { API_V1 } from '../api/api-base';
import type { Me, Permission, Schemas } from '../api/api-types';
import { HANDLED_STATUSES, SESSION_REQUIRED } from '../problem/problem-context';

/** Where the session token is kept: shared by the console's tabs of one browser profile. */
export const SESSION_STORAGE_KEY = 'polewright.session';

/**
 * The signed-in person: the session token (kept in localStorage so every tab of the console shares it)
 * and `GET /me` (user, permissions, expiry). Signing out in one tab signs out the others.
 */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);
  private readonly tokenValue = signal<string | null>(readToken());
  private readonly meValue = signal<Me | null>(null);

  /** The bearer token of this session, or null when signed out. */
  readonly token = this.tokenValue.asReadonly();
  /** The signed-in person, their permissions and session (null until loaded, or when signed out). */
  readonly me = this.meValue.asReadonly();
  /** Whether someone is signed in (and `/me` loaded). */
  readonly isSignedIn = computed(() => this.meValue() !== null);
  /** The signed-in person's role. */
  readonly role = computed(() => this.meValue()?.user.role ?? null);

  constructor() {
    // another tab signed in or out: follow it
    globalThis.addEventListener?.('storage', (event: StorageEvent) => {
      if (event.key !== SESSION_STORAGE_KEY) return;
      this.tokenValue.set(event.newValue);
      if (!event.newValue) this.meValue.set(null);
      else void this.restore();
    });
  }

  /** Whether the signed-in person has a permission (`models:write`, `admin`…). */
  can(permission: Permission): boolean {
    return this.meValue()?.permissions.includes(permission) ?? false;
  }

  /** Signs in (`POST /sessions`) and loads `/me`; throws the API's problem on bad credentials. */
  async signIn(email: string, password: string): Promise<Me> {
    const created = await firstValueFrom(
      this.http.post<Schemas['SessionCreated']>(`${this.api}/sessions`, { email, password }, { context: new HttpContext().set(SESSION_REQUIRED, false).set(HANDLED_STATUSES, [400, 401]) }),
    );
    return this.adopt(created.token);
  }

  /** Takes over a session token the API issued (sign-in, accepted invitation) and loads `/me`. */
  async adopt(token: string): Promise<Me> {
    this.store(token);
    const me = await firstValueFrom(this.http.get<Me>(`${this.api}/me`));
    this.meValue.set(me);
    return me;
  }

  /** Loads `/me` for a stored token at start; a token the API no longer accepts is forgotten quietly. */
  async restore(): Promise<void> {
    if (!this.tokenValue()) return;
    try {
      this.meValue.set(await firstValueFrom(this.http.get<Me>(`${this.api}/me`, { context: new HttpContext().set(SESSION_REQUIRED, false).set(HANDLED_STATUSES, [0, 401, 403]) })));
    } catch {
      this.forget();
    }
  }

  /** Replaces the loaded `/me` (after the person changed their own name). */
  update(me: Me): void {
    this.meValue.set(me);
  }

  /** Signs out: revokes the token on the server (`DELETE /sessions/current`), then forgets it here. */
  async signOut(): Promise<void> {
    try {
      if (this.tokenValue()) await firstValueFrom(this.http.delete(`${this.api}/sessions/current`, { context: new HttpContext().set(SESSION_REQUIRED, false).set(HANDLED_STATUSES, [0, 401]) }));
    } finally {
      this.forget();
    }
  }

  /** Forgets the session in this browser (the token was refused, or the person signed out). */
  forget(): void {
    this.store(null);
    this.meValue.set(null);
  }

  private store(token: string | null): void {
    this.tokenValue.set(token);
    try {
      if (token) localStorage.setItem(SESSION_STORAGE_KEY, token);
      else localStorage.removeItem(SESSION_STORAGE_KEY);
    } catch {
      // storage disabled (private mode): the session lasts as long as this tab
    }
  }
}

function readToken(): string | null {
  try {
    return localStorage.getItem(SESSION_STORAGE_KEY);
  } catch {
    return null;
  }
}
