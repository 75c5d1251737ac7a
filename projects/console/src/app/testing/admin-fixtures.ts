import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import type { EnvironmentProviders, Provider } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter, type Routes, withComponentInputBinding } from '@angular/router';
import type { Me, User } from '../api/api-types';
import { Notices } from '../problem/notices';
import { problemInterceptor } from '../problem/problem-interceptor';
import { authInterceptor } from '../session/auth-interceptor';
import { Session } from '../session/session';

/** People of the invented demo company, as `GET /users` returns them (test data for the admin screens). */
export const ADA: User = { id: 'u-ada', email: 'ada.admin@quillfield.example', name: 'Ada Brennholt', role: 'admin', status: 'active', createdAt: '2026-11-02T08:00:00.000Z', updatedAt: '2026-11-02T08:00:00.000Z' };
export const EMIL: User = { id: 'u-emil', email: 'emil.engineer@quillfield.example', name: 'Emil Varga-Lund', role: 'engineer', status: 'active', createdAt: '2026-11-03T08:00:00.000Z', updatedAt: '2026-11-03T08:00:00.000Z' };
export const VERA: User = { id: 'u-vera', email: 'vera.viewer@quillfield.example', name: 'Vera Osei-Marsh', role: 'viewer', status: 'active', createdAt: '2026-11-04T08:00:00.000Z', updatedAt: '2026-11-04T08:00:00.000Z' };
export const PEOPLE: readonly User[] = [ADA, EMIL, VERA];

/** Ada's `/me`: the signed-in admin of the admin screens' specs. */
export const ADA_ME: Me = { user: ADA, permissions: ['models:read', 'models:write', 'compute', 'admin'], session: { id: 's-ada', expiresAt: '2026-12-31T00:00:00.000Z' } };

/** A stand-in for the snackbar that records what it was asked to show. */
export interface NoticesSpy {
  readonly done: ReturnType<typeof vi.fn>;
  readonly problem: ReturnType<typeof vi.fn>;
}

/**
 * TestBed for an admin screen: real HttpClient with the console's interceptors against HttpTestingController,
 * animations off, the snackbar recorded, and Ada signed in. Returns the controller and the notices spy.
 */
export function setUpAdminScreen(options: { routes?: Routes; providers?: (Provider | EnvironmentProviders)[] } = {}): { http: HttpTestingController; notices: NoticesSpy } {
  const notices: NoticesSpy = { done: vi.fn(), problem: vi.fn() };
  TestBed.configureTestingModule({
    providers: [
      provideRouter(options.routes ?? [], withComponentInputBinding()),
      provideHttpClient(withInterceptors([authInterceptor, problemInterceptor])),
      provideHttpClientTesting(),
      { provide: Notices, useValue: notices },
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ...(options.providers ?? []),
    ],
  });
  TestBed.inject(Session).update(ADA_ME);
  return { http: TestBed.inject(HttpTestingController), notices };
}

/** Answers the people directory call (`GET /users?sort=name…&pageSize=200`) with everyone. */
export function flushDirectory(http: HttpTestingController, people: readonly User[] = PEOPLE): TestRequest {
  const request = http.expectOne((r) => r.url === '/api/v1/users' && r.params.get('pageSize') === '200');
  request.flush({ items: people, total: people.length, page: 1, pageSize: 200 });
  return request;
}

/** A problem+json error answer for `TestRequest.flush`. */
export function problemBody(status: number, title: string, detail: string, errors: { pointer: string; detail: string }[] = []): [object, { status: number; statusText: string; headers: Record<string, string> }] {
  return [{ type: 'about:blank', title, status, detail, errors }, { status, statusText: title, headers: { 'Content-Type': 'application/problem+json' } }];
}

/** Lets pending promises, timers of 0 ms and change detection run (a few rounds: awaits chain). */
export async function settle(fixture: { whenStable(): Promise<unknown>; detectChanges(): void }): Promise<void> {
  for (let round = 0; round < 3; round++) {
    await new Promise((resolve) => setTimeout(resolve, 0));
    await fixture.whenStable();
  }
  fixture.detectChanges();
}

/**
 * After each case: checks that no request was left unanswered, and resets the TestBed and the overlay even
 * when that check fails, so that one failing case does not take the cases after it down with it.
 */
export function tearDownAdminScreen(http: HttpTestingController | undefined): void {
  try {
    http?.verify();
  } finally {
    TestBed.resetTestingModule();
    document.querySelectorAll('.cdk-overlay-container').forEach((e) => (e.innerHTML = ''));
  }
}
