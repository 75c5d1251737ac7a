import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { LOOP_RETRY_POLICY, LoopRegistry } from './loop-registry';
import { modelUrl } from './model-loader';

const request = { apiBase: '/api/', modelId: 'b5a1c3d2-0000-4000-8000-000000000001', token: 'pwe_embed' };
const url = '/api/v1/models/b5a1c3d2-0000-4000-8000-000000000001';
const resource = {
  id: request.modelId,
  name: 'Line 3 belt speed',
  description: '',
  tags: ['conveyor'],
  plant: { expression: '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))' },
  compensator: null,
  design: { gain: 0.8, targets: { minDampingRatio: 0.4 } },
  revision: 3,
  deletedAt: null,
};
const wait = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

let controller: HttpTestingController | null = null;

function setup() {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(), provideHttpClientTesting(), { provide: LOOP_RETRY_POLICY, useValue: { retries: 2, baseDelayMs: 1 } }],
  });
  controller = TestBed.inject(HttpTestingController);
  return { http: controller, state: TestBed.inject(LoopRegistry).loop('api') };
}

describe('loading a model from the API', () => {
  afterEach(() => {
    controller?.verify();
    controller = null;
  });

  it('builds the model URL from the API base, tolerating a trailing slash and escaping the id', () => {
    expect(modelUrl(request)).toBe(url);
    expect(modelUrl({ ...request, apiBase: 'https://x.test/api', modelId: 'a/b' })).toBe('https://x.test/api/v1/models/a%2Fb');
  });

  it('sends the embed token as a bearer token and applies model, saved gain and targets', async () => {
    const { http, state } = setup();
    const done = state.loadFromApi(request);
    expect(state.status()).toBe('loading');
    const call = http.expectOne(url);
    expect(call.request.method).toBe('GET');
    expect(call.request.headers.get('Authorization')).toBe('Bearer pwe_embed');
    call.flush(resource);
    const outcome = await done;
    expect(outcome.ok).toBe(true);
    expect(state.status()).toBe('ready');
    expect(state.model()?.name).toBe('Line 3 belt speed');
    expect(state.gain()).toBe(0.8);
    expect(state.targets()).toEqual({ minDampingRatio: 0.4 });
    expect(state.locus()?.branches.length).toBe(4);
  });

  it('keeps the page gain when asked to', async () => {
    const { http, state } = setup();
    state.setGain(2.5);
    const done = state.loadFromApi(request, { keepGain: true });
    http.expectOne(url).flush(resource);
    await done;
    expect(state.gain()).toBe(2.5);
  });

  it('repeats after a 503 and a network failure, then succeeds', async () => {
    const { http, state } = setup();
    const done = state.loadFromApi(request);
    http.expectOne(url).flush({ title: 'Service Unavailable' }, { status: 503, statusText: 'Service Unavailable' });
    await wait(20);
    http.expectOne(url).error(new ProgressEvent('error'));
    await wait(20);
    http.expectOne(url).flush(resource);
    expect((await done).ok).toBe(true);
    expect(state.status()).toBe('ready');
  });

  it('gives up after the last repeat with a message saying how often it tried', async () => {
    const { http, state } = setup();
    const done = state.loadFromApi(request);
    for (let i = 0; i < 3; i++) {
      http.expectOne(url).error(new ProgressEvent('error'));
      await wait(20);
    }
    const outcome = await done;
    expect(outcome.ok).toBe(false);
    expect(state.status()).toBe('error');
    expect(state.error()).toMatch(/could not be reached after 3 attempts/);
  });

  it.each([
    [401, 'Unauthorized', 'The token has expired.', /embed token was not accepted \(401\).*Unauthorized: The token has expired\./],
    [403, 'Forbidden', 'This origin may not use the token.', /may not read model .* \(403\).*Forbidden: This origin may not use the token\./],
    [404, 'Not Found', 'No model with this id.', /No model .* was found \(404\).*Not Found: No model with this id\./],
  ])('does not repeat a %i and shows the problem title and detail', async (status, title, detail, message) => {
    const { http, state } = setup();
    const done = state.loadFromApi(request);
    http.expectOne(url).flush({ type: 'about:blank', title, status, detail }, { status, statusText: title, headers: { 'Content-Type': 'application/problem+json' } });
    const outcome = await done;
    await wait(20);
    http.expectNone(url);
    expect(outcome.ok).toBe(false);
    expect(state.status()).toBe('error');
    expect(state.error()).toMatch(message);
  });

  it('refuses an answer whose plant the core does not accept, naming the field', async () => {
    const { http, state } = setup();
    const done = state.loadFromApi(request);
    http.expectOne(url).flush({ ...resource, plant: { numerator: [1, 2, 3], denominator: [1, 1] } });
    expect((await done).ok).toBe(false);
    expect(state.error()).toMatch(/Model not accepted: plant › numerator has degree 2/);
  });

  it('lets a newer load or an inline model supersede the one in flight', async () => {
    const { http, state } = setup();
    const first = state.loadFromApi(request);
    state.setModel({ plant: { expression: '1/(s+1)' }, compensator: null });
    const outcome = await first;
    expect(outcome).toMatchObject({ ok: false, superseded: true });
    expect(http.expectOne(url).cancelled).toBe(true);
    expect(state.status()).toBe('ready');
    expect(state.model()?.plant).toEqual({ expression: '1/(s+1)' });
  });
});
