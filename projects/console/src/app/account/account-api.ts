import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { API_V1 } from '../api/api-base';
import type { Me } from '../api/api-types';
import { handles } from '../problem/problem-context';

/** What a person may change about themselves (`PATCH /me`). */
export interface AccountChange {
  readonly name?: string;
  readonly currentPassword?: string;
  readonly newPassword?: string;
}

/** The signed-in person's own account. */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);
  private readonly api = inject(API_V1);

  /** Changes the person's name and/or password; a password change ends their other sessions. */
  change(change: AccountChange): Observable<Me> {
    // a wrong current password comes back as a field error, shown at the field
    return this.http.patch<Me>(`${this.api}/me`, change, { context: handles(400) });
  }
}
