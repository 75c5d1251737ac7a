import { existsSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../../server/src/testing/test-server';
import { launchChromium, watchProblems, type PageProblems } from './support/chromium';
import { elementsDefined, inside, plainPage, recordedEvents, screenshot } from './support/elements-page';
import { serveStatic, type StaticServer } from './support/static-server';

// The elements against the real API (server/src/testing/test-server.ts: the app on a fresh SQLite file,
// real HTTP), in Chromium: a saved model loaded with an embed token from another origin, the gallery page
// served by the server at /elements/, and the error states the API's problem answers lead to.
let api: TestServer;
let site: StaticServer;
let browser: Browser;
let page: Page;
let problems: PageProblems;
let modelId: string;

async function call(path: string, init: { method?: string; token: string; body?: unknown }): Promise<{ status: number; body: Record<string, unknown> }> {
  const response = await fetch(`${api.baseUrl}/api/v1${path}`, {
    method: init.method ?? 'GET',
    headers: { Authorization: `Bearer ${init.token}`, 'Content-Type': 'application/json' },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  return { status: response.status, body: (await response.json()) as Record<string, unknown> };
}

async function embedToken(origin: string): Promise<string> {
  const issued = await call('/embed-tokens', { method: 'POST', token: api.tokens.engineer, body: { modelIds: [modelId], origins: [origin], ttlSeconds: 600 } });
  expect(issued.status).toBe(201);
  expect(String(issued.body['token'])).toMatch(/^pwe_/);
  return String(issued.body['token']);
}

beforeAll(async () => {
  if (!existsSync('dist/elements/polewright-elements.js')) throw new Error('dist/elements/polewright-elements.js is missing: run npm run build first');
  api = await startTestServer();
  site = await serveStatic('dist/elements');
  browser = await launchChromium();
  // the demo hoist loop (demo/scenario.json, invented), saved with a design gain inside its stable band
  const created = await call('/models', {
    method: 'POST',
    token: api.tokens.engineer,
    body: {
      name: 'Hoist 2 hook position (saved)',
      plant: { expression: '(s+0.6)^2/(s^3*(s+4.5)*(s+11))' },
      compensator: null,
      design: { gain: 80, targets: { minDampingRatio: 0.3 } },
    },
  });
  expect(created.status).toBe(201);
  modelId = String(created.body['id']);
});

afterEach(async () => {
  await page?.close();
});

afterAll(async () => {
  await browser?.close();
  await site?.close();
  await api?.close();
});

describe('pw- elements with the API', () => {
  it('an embed token from the API loads a saved model, from the page of another origin', async () => {
    const token = await embedToken(site.baseUrl);
    page = await browser.newPage({ viewport: { width: 1200, height: 1000 } });
    problems = watchProblems(page);
    const html = plainPage(`
      <pw-loop-studio id="studio" model-id="${modelId}" api-base="${api.baseUrl}/api" token="${token}" loop="saved"></pw-loop-studio>
      <pw-pole-table id="poles" loop="saved"></pw-pole-table>`);
    await page.goto(site.page('/saved-model.html', html));
    await elementsDefined(page);
    await expect.poll(() => page.locator('#studio').locator('.heading').textContent(), { timeout: 15000 }).toBe('Hoist 2 hook position (saved)');
    // the saved design gain and targets came with the model; a second element on the loop shares them
    await expect.poll(() => inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 80 — stable');
    expect(await page.locator('#studio').locator('pwl-gain-control input.field').inputValue()).toBe('80');
    expect(await page.locator('#studio').locator('pwl-locus-plot path.pw-branch').count()).toBe(5);
    expect(await page.locator('#studio').locator('pwl-stability-summary .verdict').textContent()).toBe('At K = 80 the closed loop is stable.');
    await screenshot(page, 'elements-api-saved-model');
    expect(await recordedEvents(page)).toEqual([]);
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('the gallery page is served by the server at /elements/', async () => {
    page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    problems = watchProblems(page);
    const response = await page.goto(`${api.baseUrl}/elements/`);
    expect(response?.status()).toBe(200);
    await elementsDefined(page);
    await expect.poll(() => inside(page, 'belt-plot', 'path.pw-branch').count()).toBe(4);
    expect(problems.exceptions).toEqual([]);
  });

  it('a token the API refuses shows the 401 with the problem title in the element, and pw-load-error', async () => {
    page = await browser.newPage();
    problems = watchProblems(page);
    // a page of the server's own origin, so that the browser may read the problem answer
    await page.goto(`${api.baseUrl}/elements/`);
    await elementsDefined(page);
    const message = await page.evaluate(
      ({ id }) =>
        new Promise<string>((done) => {
          const table = document.createElement('pw-pole-table');
          table.id = 'refused';
          table.addEventListener('pw-load-error', (e) => done((e as CustomEvent<{ message: string }>).detail.message));
          table.setAttribute('model-id', id);
          table.setAttribute('token', 'pwe_not-a-token');
          document.body.prepend(table);
        }),
      { id: modelId },
    );
    // the element quotes the problem answer of the API itself
    const problem = await call(`/models/${modelId}`, { token: 'pwe_not-a-token' });
    expect(problem.status).toBe(401);
    expect(message).toMatch(/^The embed token was not accepted \(401\)/);
    expect(message).toContain(`The API says: ${problem.body['title']}: ${problem.body['detail']}`);
    await expect.poll(() => inside(page, 'refused', '.status.error').textContent()).toMatch(/not accepted \(401\)/);
    expect(await inside(page, 'refused', '.status.error').isVisible()).toBe(true);
    expect(problems.exceptions).toEqual([]);
  });

  it('a model that does not exist shows the 404 with the problem detail', async () => {
    page = await browser.newPage();
    problems = watchProblems(page);
    await page.goto(`${api.baseUrl}/elements/`);
    await elementsDefined(page);
    const missing = '00000000-0000-4000-8000-000000000000';
    await page.evaluate(
      ({ id, token }) => {
        const summary = document.createElement('pw-stability-summary');
        summary.id = 'missing';
        summary.setAttribute('model-id', id);
        summary.setAttribute('token', token);
        document.body.prepend(summary);
      },
      { id: missing, token: api.tokens.viewer },
    );
    const problem = await call(`/models/${missing}`, { token: api.tokens.viewer });
    expect(problem.status).toBe(404);
    await expect.poll(() => inside(page, 'missing', '.status.error').textContent()).toBe(
      `No model ${missing} was found (404). The API says: ${problem.body['title']}: ${problem.body['detail']}`,
    );
    expect(problems.exceptions).toEqual([]);
  });
});
