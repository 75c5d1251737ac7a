import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import type { Me } from '../api/api-types';
import { problemInterceptor } from '../problem/problem-interceptor';
import { Notices } from '../problem/notices';
import { authInterceptor } from './auth-interceptor';
import { Session, SESSION_STORAGE_KEY } from './session';

const ME: Me = {
  user: { id: 'u1', email: 'emil.engineer@quillfield.example', name: 'Emil', role: 'engineer', status: 'active', createdAt: '2026-12-01T00:00:00.000Z', updatedAt: '2026-12-01T00:00:00.000Z' },
  permissions: ['models:read', 'models:write', 'compute'],
  session: { id: 's1', expiresAt: '2026-12-02T12:00:00.000Z' },
};

describe('Session', () => {
  let http: HttpTestingController;
  let notices: { done: ReturnType<typeof vi.fn>; problem: ReturnType<typeof vi.fn> };

  beforeEach(() => {
    localStorage.clear();
    notices = { done: vi.fn(), problem: vi.fn() };
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor, problemInterceptor])), provideHttpClientTesting(), { provide: Notices, useValue: notices }],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('signs in, keeps the token for every tab, sends it as a bearer token and loads /me', async () => {
    const session = TestBed.inject(Session);
    const signingIn = session.signIn('emil.engineer@quillfield.example', 'secret-secret');
    const post = http.expectOne('/api/v1/sessions');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ email: 'emil.engineer@quillfield.example', password: 'secret-secret' });
    post.flush({ token: 'pws_abc', expiresAt: ME.session.expiresAt, user: ME.user });
    await Promise.resolve();
    const me = http.expectOne('/api/v1/me');
    expect(me.request.headers.get('Authorization')).toBe('Bearer pws_abc');
    me.flush(ME);
    await signingIn;
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBe('pws_abc');
    expect(session.isSignedIn()).toBe(true);
    expect(session.can('models:write')).toBe(true);
    expect(session.can('admin')).toBe(false);
  });

  it('rejects with the API’s problem on wrong credentials and shows no snackbar (the page shows it)', async () => {
    const session = TestBed.inject(Session);
    const signingIn = session.signIn('emil.engineer@quillfield.example', 'wrong');
    http.expectOne('/api/v1/sessions').flush({ title: 'Unauthorized', status: 401, detail: 'Wrong e-mail or password.' }, { status: 401, statusText: 'Unauthorized' });
    await expect(signingIn).rejects.toMatchObject({ status: 401, detail: 'Wrong e-mail or password.' });
    expect(notices.problem).not.toHaveBeenCalled();
    expect(session.token()).toBeNull();
  });

  it('forgets a stored token the API no longer accepts, quietly', async () => {
    localStorage.setItem(SESSION_STORAGE_KEY, 'pws_old');
    const session = TestBed.inject(Session);
    const restoring = session.restore();
    http.expectOne('/api/v1/me').flush({ title: 'Unauthorized', status: 401, detail: 'Session expired.' }, { status: 401, statusText: 'Unauthorized' });
    await restoring;
    expect(session.token()).toBeNull();
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull();
    expect(notices.problem).not.toHaveBeenCalled();
  });

  it('revokes the token on sign-out and forgets it even when the server cannot be reached', async () => {
    localStorage.setItem(SESSION_STORAGE_KEY, 'pws_abc');
    const session = TestBed.inject(Session);
    const out = session.signOut();
    const del = http.expectOne('/api/v1/sessions/current');
    expect(del.request.method).toBe('DELETE');
    del.error(new ProgressEvent('error'), { status: 0 });
    await out.catch(() => undefined);
    expect(session.token()).toBeNull();
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull();
  });

  it('an expired session during work sends the person to sign in, coming back afterwards', async () => {
    localStorage.setItem(SESSION_STORAGE_KEY, 'pws_abc');
    const session = TestBed.inject(Session);
    const router = TestBed.inject(Router);
    const navigate = vi.spyOn(router, 'navigate').mockResolvedValue(true);
    const { HttpClient } = await import('@angular/common/http');
    const failed = new Promise((resolve) => TestBed.inject(HttpClient).get('/api/v1/models').subscribe({ error: resolve }));
    http.expectOne('/api/v1/models').flush({ title: 'Unauthorized', status: 401, detail: 'Session expired.' }, { status: 401, statusText: 'Unauthorized' });
    await failed;
    expect(session.token()).toBeNull();
    expect(notices.problem).toHaveBeenCalledTimes(1);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/' } });
  });

  it('never sends the token to another origin', async () => {
    localStorage.setItem(SESSION_STORAGE_KEY, 'pws_abc');
    TestBed.inject(Session);
    const { HttpClient } = await import('@angular/common/http');
    TestBed.inject(HttpClient).get('https://elsewhere.example/api/v1/models').subscribe();
    expect(http.expectOne('https://elsewhere.example/api/v1/models').request.headers.has('Authorization')).toBe(false);
  });
});
