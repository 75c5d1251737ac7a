import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import type { Me } from '../api/api-types';
import { problemInterceptor } from '../problem/problem-interceptor';
import { Notices } from '../problem/notices';
import { authInterceptor } from '../session/auth-interceptor';
import { Session, SESSION_STORAGE_KEY } from '../session/session';
import { Invitation } from './invitation';
import type { InvitationDetails } from './invitations-api';

@Component({ template: '' })
class Elsewhere {}

const TOKEN = 'pwi_line3-invite';
const URL_OF = `/api/v1/invitations/${TOKEN}`;
const OPEN: InvitationDetails = { state: 'open', email: 'ines.intake@quillfield.example', name: 'ines.intake', role: 'engineer', expiresAt: '2026-12-09T08:00:00.000Z' };
const ME: Me = {
  user: { id: 'u-ines', email: OPEN.email, name: 'Ines Intake', role: 'engineer', status: 'active', createdAt: '2026-12-02T08:00:00.000Z', updatedAt: '2026-12-02T08:00:00.000Z' },
  permissions: ['models:read', 'models:write', 'compute'],
  session: { id: 's-1', expiresAt: '2026-12-02T20:00:00.000Z' },
};
const PROBLEM_HEADERS = { 'Content-Type': 'application/problem+json' };

// the first test of a file also pays for loading Material on a busy machine: a generous time limit
describe('Invitation', { timeout: 20000 }, () => {
  let fixture: ComponentFixture<Invitation>;
  let http: HttpTestingController;
  let host: HTMLElement;
  let notices: { done: ReturnType<typeof vi.fn>; problem: ReturnType<typeof vi.fn> };
  const text = (selector: string) => (host.querySelector(selector)?.textContent ?? '').replace(/\s+/g, ' ').trim();
  const render = async () => {
    await fixture.whenStable();
    fixture.detectChanges();
  };
  const field = (name: string) => host.querySelector<HTMLInputElement>(`input[formcontrolname="${name}"]`)!;
  const errorOf = (name: string) => (field(name).closest('mat-form-field')?.querySelector('mat-error')?.textContent ?? '').trim();
  function fill(name: string, value: string): void {
    field(name).value = value;
    field(name).dispatchEvent(new Event('input'));
  }
  const submit = () => host.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();

  async function open(answer: { body: object; status?: number }): Promise<void> {
    localStorage.clear();
    notices = { done: vi.fn(), problem: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'models', component: Elsewhere },
          { path: 'sign-in', component: Elsewhere },
        ]),
        provideHttpClient(withInterceptors([authInterceptor, problemInterceptor])),
        provideHttpClientTesting(),
        { provide: Notices, useValue: notices },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Invitation);
    fixture.componentRef.setInput('token', TOKEN);
    host = fixture.nativeElement as HTMLElement;
    fixture.detectChanges();
    expect(text('[role="status"]')).toBe('Reading the invitation…');
    const request = http.expectOne(URL_OF);
    expect(request.request.method).toBe('GET');
    if (answer.status) request.flush(answer.body, { status: answer.status, statusText: 'Error', headers: PROBLEM_HEADERS });
    else request.flush(answer.body);
    await render();
  }

  afterEach(() => http.verify());

  it('shows an open invitation with the e-mail, the role and the name to keep or change', async () => {
    await open({ body: OPEN });
    expect(text('h1')).toBe('Join Polewright');
    expect(text('.email')).toBe(OPEN.email);
    expect(text('.role')).toBe('engineer');
    expect(field('name').value).toBe('ines.intake');
    expect(host.querySelector('button[type="submit"]')?.textContent).toContain('Create my account');
  });

  it('checks the passwords on the page first, then puts the API’s field errors at their fields', async () => {
    await open({ body: OPEN });
    fill('password', 'intake-conveyor');
    fill('repeat', 'intake-conveyer');
    submit();
    await render();
    expect(errorOf('repeat')).toBe('The two passwords differ.');
    fill('password', 'short');
    fill('repeat', 'short');
    submit();
    await render();
    expect(errorOf('password')).toBe('At least 10 characters.');
    http.expectNone(`${URL_OF}/accept`);

    fill('name', '   ');
    fill('password', 'intake-conveyor-2026');
    fill('repeat', 'intake-conveyor-2026');
    // a name of blanks passes the page's required check; the API has the last word
    submit();
    const accept = http.expectOne(`${URL_OF}/accept`);
    expect(accept.request.body).toEqual({ name: '', password: 'intake-conveyor-2026' });
    accept.flush({ title: 'Invalid request', status: 400, detail: 'See errors.', errors: [{ pointer: '/name', detail: 'must not be empty' }] }, { status: 400, statusText: 'Bad Request', headers: PROBLEM_HEADERS });
    await render();
    expect(errorOf('name')).toBe('must not be empty');
    expect(notices.problem).not.toHaveBeenCalled();
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBeNull();
  });

  it('signs the new person in with the session the API answers and goes to the models with a welcome', async () => {
    await open({ body: OPEN });
    fill('name', 'Ines Intake');
    fill('password', 'intake-conveyor-2026');
    fill('repeat', 'intake-conveyor-2026');
    submit();
    const accept = http.expectOne(`${URL_OF}/accept`);
    expect(accept.request.method).toBe('POST');
    expect(accept.request.body).toEqual({ name: 'Ines Intake', password: 'intake-conveyor-2026' });
    accept.flush({ token: 'pws_new-session', expiresAt: ME.session.expiresAt, user: ME.user }, { status: 201, statusText: 'Created' });
    await Promise.resolve();
    const me = http.expectOne('/api/v1/me');
    expect(me.request.headers.get('Authorization')).toBe('Bearer pws_new-session');
    me.flush(ME);
    await render();
    await fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/models');
    expect(TestBed.inject(Session).isSignedIn()).toBe(true);
    expect(localStorage.getItem(SESSION_STORAGE_KEY)).toBe('pws_new-session');
    expect(notices.done).toHaveBeenCalledWith('Welcome to Polewright, Ines Intake: you are signed in as engineer.');
  });

  it('says a used invitation is used and offers to sign in, without a form', async () => {
    await open({ body: { ...OPEN, state: 'used' } });
    expect(text('h1')).toBe('This invitation has been used');
    expect(host.querySelector('form')).toBeNull();
    expect(host.querySelector('a[href="/sign-in"]')?.textContent?.trim()).toBe('Sign in');
  });

  it('sends the holder of an expired invitation to their administrator', async () => {
    await open({ body: { ...OPEN, state: 'expired' } });
    expect(text('h1')).toBe('This invitation has expired');
    expect(text('.text')).toContain('Ask your administrator for a new invitation.');
    expect(host.querySelector('form')).toBeNull();
  });

  it('says an unknown link leads to no invitation, without a snackbar', async () => {
    await open({ body: { title: 'Not found', status: 404, detail: 'The invitation was not found' }, status: 404 });
    expect(text('h1')).toBe('Invitation not found');
    expect(text('.text')).toContain('does not lead to any invitation');
    expect(notices.problem).not.toHaveBeenCalled();
  });

  it('reads the state again when accepting finds the invitation used meanwhile', async () => {
    await open({ body: OPEN });
    fill('password', 'intake-conveyor-2026');
    fill('repeat', 'intake-conveyor-2026');
    submit();
    http.expectOne(`${URL_OF}/accept`).flush({ title: 'Conflict', status: 409, detail: 'This invitation has been used already; sign in instead.' }, { status: 409, statusText: 'Conflict', headers: PROBLEM_HEADERS });
    await Promise.resolve();
    await fixture.whenStable();
    http.expectOne(URL_OF).flush({ ...OPEN, state: 'used' });
    await render();
    expect(text('h1')).toBe('This invitation has been used');
    expect(notices.problem).not.toHaveBeenCalled();
  });
});
