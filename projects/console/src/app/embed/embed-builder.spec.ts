import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Model } from '../api/api-types';
import { problemInterceptor } from '../problem/problem-interceptor';
import { Notices } from '../problem/notices';
import { authInterceptor } from '../session/auth-interceptor';
import { EmbedBuilder } from './embed-builder';

const MODEL = {
  id: 'm-belt',
  name: 'Line 3 belt speed',
  description: '',
  tags: ['conveyor'],
  plant: { expression: '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))' },
  compensator: null,
  design: { gain: 2, targets: null },
  revision: 1,
} as unknown as Model;

/** Lets debounced streams (search, the snippet's settled choices) run, then renders. */
async function settle(fixture: ComponentFixture<unknown>, ms = 320): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve, ms));
  fixture.detectChanges();
  await fixture.whenStable();
}

// the first test of a file also pays for loading Material on a busy machine: a generous time limit
describe('EmbedBuilder', { timeout: 20000 }, () => {
  let fixture: ComponentFixture<EmbedBuilder>;
  let http: HttpTestingController;
  let host: HTMLElement;

  const text = (selector: string) => (host.querySelector(selector)?.textContent ?? '').replace(/\s+/g, ' ').trim();
  const searches = () => http.match((r) => r.url === '/api/v1/models');
  const originInput = () => host.querySelector<HTMLInputElement>('input[aria-label="Add an origin"]')!;
  const chips = () => [...host.querySelectorAll('mat-chip-row')].map((c) => (c.textContent ?? '').replace('cancel', '').trim());

  function typeOrigin(value: string): void {
    const input = originInput();
    input.focus();
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', keyCode: 13, bubbles: true }));
    fixture.detectChanges();
  }

  function pickModel(): void {
    fixture.componentInstance['form'].controls.model.setValue(MODEL);
    fixture.detectChanges();
  }

  function mintRequest(): TestRequest {
    host.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    fixture.detectChanges();
    return http.expectOne('/api/v1/embed-tokens');
  }

  beforeEach(async () => {
    URL.createObjectURL = vi.fn(() => 'blob:http://localhost/preview-1');
    URL.revokeObjectURL = vi.fn();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor, problemInterceptor])), provideHttpClientTesting(), { provide: Notices, useValue: { done: vi.fn(), problem: vi.fn() } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(EmbedBuilder);
    host = fixture.nativeElement as HTMLElement;
    fixture.detectChanges();
    await settle(fixture);
    for (const search of searches()) search.flush({ items: [MODEL], total: 1, page: 1, pageSize: 8 });
  });

  afterEach(() => {
    for (const search of searches()) search.flush({ items: [], total: 0, page: 1, pageSize: 8 });
    http.verify();
  });

  it('searches the models by what is typed and takes the one picked from the list', async () => {
    const input = host.querySelector<HTMLInputElement>('input[formcontrolname="model"]')!;
    input.focus();
    input.value = 'belt';
    input.dispatchEvent(new Event('input'));
    await settle(fixture);
    const search = http.expectOne((r) => r.url === '/api/v1/models' && r.params.get('q') === 'belt');
    expect(search.request.params.get('pageSize')).toBe('8');
    search.flush({ items: [MODEL], total: 1, page: 1, pageSize: 8 });
    fixture.detectChanges();
    const option = [...document.querySelectorAll<HTMLElement>('mat-option')].find((o) => o.textContent?.includes('Line 3 belt speed'));
    expect(option).toBeDefined();
    option!.click();
    fixture.detectChanges();
    expect(fixture.componentInstance['form'].controls.model.value).toEqual(MODEL);
    expect(input.value).toBe('Line 3 belt speed');
  });

  it('starts with this console’s origin and refuses an origin with a path at the field', () => {
    expect(chips()).toEqual([location.origin]);
    typeOrigin('https://wiki.quillfield.example/line-3');
    expect(chips()).toEqual([location.origin]);
    expect(text('mat-error')).toBe('Only the origin, without path, query or #fragment: https://wiki.quillfield.example');
    expect(originInput().value).toBe('https://wiki.quillfield.example/line-3');
    typeOrigin('https://wiki.quillfield.example');
    expect(chips()).toEqual([location.origin, 'https://wiki.quillfield.example']);
    expect(host.querySelector('mat-error')).toBeNull();
  });

  it('sends nothing while no model is picked, and says so at the model field', () => {
    host.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    fixture.detectChanges();
    http.expectNone('/api/v1/embed-tokens');
    expect(text('mat-error')).toBe('Pick a model from the list (type part of its name).');
  });

  it('mints a token for the model, origins and lifetime, then shows the snippet with the token and its preview', async () => {
    pickModel();
    typeOrigin('https://wiki.quillfield.example');
    [...host.querySelectorAll<HTMLButtonElement>('.presets button')].find((b) => b.textContent?.includes('8 h'))!.click();
    fixture.detectChanges();
    const request = mintRequest();
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ modelIds: ['m-belt'], origins: [location.origin, 'https://wiki.quillfield.example'], ttlSeconds: 28800 });
    request.flush({ token: 'pwe_minted', expiresAt: new Date(Date.now() + 28800_000).toISOString(), modelIds: ['m-belt'], origins: [location.origin, 'https://wiki.quillfield.example'] });
    await settle(fixture);
    const snippet = text('pre code');
    expect(snippet).toContain('<pw-loop-studio model-id="m-belt"');
    expect(snippet).toContain('token="pwe_minted"');
    expect(snippet).toContain(`api-base="${location.origin}/api"`);
    expect(snippet).toContain("document.addEventListener('pw-gain-change'");
    expect(host.querySelector('iframe')?.getAttribute('src')).toBe('blob:http://localhost/preview-1');
    expect(host.querySelector('.preview .explain')).toBeNull();

    // separate elements: the snippet follows without a new token
    host.querySelector<HTMLInputElement>('mat-radio-button[value="parts"] input')!.click();
    await settle(fixture);
    const parts = text('pre code');
    expect(parts).toContain('<pw-locus-plot model-id="m-belt"');
    expect(parts).toContain('<pw-gain-control loop="line-3-belt-speed" theme="light"></pw-gain-control>');
    expect(parts).not.toContain('pw-loop-studio');
    http.expectNone('/api/v1/embed-tokens');
  });

  it('explains the refusal in the preview when this console’s origin is not among the token’s origins', async () => {
    pickModel();
    typeOrigin('https://wiki.quillfield.example');
    host.querySelector<HTMLButtonElement>(`button[aria-label="Remove ${location.origin}"]`)!.click();
    fixture.detectChanges();
    const request = mintRequest();
    expect(request.request.body.origins).toEqual(['https://wiki.quillfield.example']);
    request.flush({ token: 'pwe_elsewhere', expiresAt: new Date(Date.now() + 3600_000).toISOString(), modelIds: ['m-belt'], origins: ['https://wiki.quillfield.example'] });
    await settle(fixture);
    expect(text('.preview .explain')).toContain(`This console's origin (${location.origin}) is not among the token's origins`);
  });

  it('puts the API’s field errors at the field they name', async () => {
    pickModel();
    const request = mintRequest();
    request.flush(
      { title: 'Invalid request', status: 400, detail: 'See errors.', errors: [{ pointer: '/origins/0', detail: 'must be an origin like https://intranet.example:8443' }] },
      { status: 400, statusText: 'Bad Request', headers: { 'Content-Type': 'application/problem+json' } },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(text('mat-error')).toBe('must be an origin like https://intranet.example:8443');
    expect(host.querySelector('pre code')).toBeNull();
  });
});
