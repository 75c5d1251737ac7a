import { existsSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { callApi, consoleScreenshot, signIn, startConsole, type ConsoleRig } from './support/console';
import { serveStatic, type StaticServer } from './support/static-server';

// The console's embed screen in Chromium against the real server (fresh database, demo seeded, the built
// console and elements): an engineer mints an embed token for a demo model, the live preview runs the
// snippet with it, and the same snippet pasted into a page of another origin gets the element's refusal.
const MODEL_NAME = 'Line 3 belt speed (PI + drive)';
const LOAD = { timeout: 30000, interval: 250 };

let rig: ConsoleRig;
let other: StaticServer;
let model: { id: string };
let branches: number;
let snippet = '';

beforeAll(async () => {
  if (!existsSync('dist/elements/polewright-elements.js')) throw new Error('dist/elements is missing: run npm run build first');
  rig = await startConsole();
  // a page server on another port: another origin than the console's
  other = await serveStatic('dist/elements');
  const found = await callApi(rig.api.baseUrl, `/models?q=${encodeURIComponent('PI + drive')}`, { token: rig.api.tokens.engineer });
  model = (found.body['items'] as { id: string; name: string }[]).find((m) => m.name === MODEL_NAME) as { id: string };
  expect(model).toBeDefined();
  const locus = await callApi(rig.api.baseUrl, `/models/${model.id}/locus`, { token: rig.api.tokens.engineer });
  branches = (locus.body['branches'] as unknown[]).length;
  expect(branches).toBeGreaterThan(1);
});

afterAll(async () => {
  await other?.close();
  await rig?.close();
});

/** The text of the snippet block. */
const snippetText = (page: Page) => page.locator('.snippet pre').textContent();

describe('console embed screen', () => {
  it('mints a token for a demo model and this console’s origin; the preview runs the snippet with the model from the API', async () => {
    const { context, page, problems } = await rig.open({ width: 1440, height: 2300 });
    const logged: string[] = [];
    page.on('console', (message) => logged.push(message.text()));
    await signIn(page, rig.api.baseUrl, 'engineer', '/embed');
    await consoleScreenshot(page, 'embed-start');

    // the model from the autocomplete
    await page.getByLabel('Model', { exact: true }).fill('belt speed');
    await page.getByRole('option', { name: new RegExp(MODEL_NAME.replace(/[()+]/g, '\\$&')) }).click();
    expect(await page.getByLabel('Model', { exact: true }).inputValue()).toBe(MODEL_NAME);
    // this console's origin is there already; an origin with a path is refused at the field
    expect((await page.locator('mat-chip-row').allTextContents()).map((t) => t.replace('cancel', '').trim())).toEqual([rig.api.baseUrl]);
    await page.getByLabel('Add an origin').fill('https://wiki.quillfield.example/line-3');
    await page.getByLabel('Add an origin').press('Enter');
    await expect.poll(() => page.locator('mat-error').textContent()).toBe('Only the origin, without path, query or #fragment: https://wiki.quillfield.example');
    await page.getByLabel('Add an origin').fill('https://wiki.quillfield.example');
    await page.getByLabel('Add an origin').press('Enter');
    await expect.poll(() => page.locator('mat-chip-row').count()).toBe(2);
    await page.locator('.presets mat-button-toggle', { hasText: '8 h' }).locator('button').click();

    await page.getByRole('button', { name: 'Mint token' }).click();
    await expect.poll(() => snippetText(page), LOAD).toContain('token="pwe_');
    snippet = (await snippetText(page)) ?? '';
    const token = /token="(pwe_[^"]+)"/.exec(snippet)?.[1];
    expect(snippet).toContain(`model-id="${model.id}"`);
    expect(snippet).toContain(`api-base="${rig.api.baseUrl}/api"`);
    expect(snippet).toContain(`<script type="module" src="${rig.api.baseUrl}/elements/polewright-elements.js"></script>`);
    expect(snippet).toContain('<pw-loop-studio');
    // the token is the API's: bound to this model and both origins
    const stored = (await rig.api.context.dataSource.query('SELECT model_ids, origins, created_at, expires_at FROM embed_tokens ORDER BY created_at DESC LIMIT 1')) as Record<string, string>[];
    expect(JSON.parse(stored[0]?.['model_ids'] ?? '[]')).toEqual([model.id]);
    expect(JSON.parse(stored[0]?.['origins'] ?? '[]')).toEqual([rig.api.baseUrl, 'https://wiki.quillfield.example']);
    expect(Date.parse(stored[0]?.['expires_at'] ?? '') - Date.parse(stored[0]?.['created_at'] ?? '')).toBe(8 * 3600 * 1000);
    expect(token).toBeDefined();

    // the preview: the studio with every branch of the model's locus, loaded with the token
    const frame = page.frameLocator('pwc-embed-preview iframe');
    await expect.poll(() => frame.locator('pw-loop-studio pwl-locus-plot path.pw-branch').count(), LOAD).toBe(branches);
    expect(await page.locator('.preview .explain').count()).toBe(0);
    // the snippet's listener script runs in the preview (the console's policy allows it by hash)
    const field = frame.locator('pw-loop-studio pwl-gain-control input.field');
    await field.fill('3');
    await field.press('Enter');
    await expect.poll(() => page.locator('.preview .events').textContent(), LOAD).toContain('K = 3 on loop line-3-belt-speed-pi-drive');
    await expect.poll(() => logged.some((t) => t === 'Polewright gain 3 on loop line-3-belt-speed-pi-drive'), LOAD).toBe(true);
    await page.waitForTimeout(300);
    await consoleScreenshot(page, 'embed-minted');

    // dark separate elements: the snippet follows without a new token
    await page.getByRole('radio', { name: /Separate elements/ }).check();
    await page.locator('mat-button-toggle', { hasText: 'Dark' }).locator('button').click();
    await expect.poll(() => snippetText(page), LOAD).toContain('<pw-locus-plot');
    expect(await snippetText(page)).toContain(`token="${token}"`);
    await expect.poll(() => frame.locator('pw-locus-plot path.pw-branch').count(), LOAD).toBe(branches);
    await consoleScreenshot(page, 'embed-parts-dark');

    expect(problems.exceptions).toEqual([]);
    expect(problems.consoleErrors).toEqual([]);
    await context.close();
  });

  it('the snippet pasted into a page of an origin it was not minted for shows the element’s refusal', async () => {
    expect(snippet).toContain('token="pwe_');
    const url = other.page('/host.html', `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Another site</title></head><body>\n${snippet}\n</body></html>`);
    expect(new URL(url).origin).not.toBe(rig.api.baseUrl);
    const { context, page, problems } = await rig.open();
    await page.goto(url);
    const refusal = page.locator('pw-loop-studio pwl-locus-plot .pw-error');
    await expect.poll(() => refusal.count(), LOAD).toBe(1);
    expect(await refusal.textContent()).toContain(`This token may not read model ${model.id} from this page (403).`);
    expect(await refusal.textContent()).toContain(`This embed token is not valid on pages from ${new URL(url).origin}.`);
    expect(await page.locator('pw-loop-studio path.pw-branch').count()).toBe(0);
    await page.screenshot({ path: 'test-artifacts/screenshots/console-embed-foreign-origin.png', fullPage: true });
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('previews the refusal, and says why, when the console’s own origin is left out', async () => {
    // the shell scrolls inside its content pane: a tall window shows the preview in the screenshot
    const { context, page, problems } = await rig.open({ width: 1440, height: 2000 });
    await signIn(page, rig.api.baseUrl, 'engineer', `/embed?modelId=${model.id}`);
    await expect.poll(() => page.getByLabel('Model', { exact: true }).inputValue(), LOAD).toBe(MODEL_NAME);
    await page.getByLabel('Add an origin').fill('https://wiki.quillfield.example');
    await page.getByLabel('Add an origin').press('Enter');
    await page.getByRole('button', { name: `Remove ${rig.api.baseUrl}` }).click();
    await page.getByRole('button', { name: 'Mint token' }).click();
    await expect.poll(() => page.locator('.preview .explain').textContent(), LOAD).toContain(`This console's origin (${rig.api.baseUrl}) is not among the token's origins`);
    const frame = page.frameLocator('pwc-embed-preview iframe');
    await expect.poll(() => frame.locator('pwl-locus-plot .pw-error').textContent(), LOAD).toContain(`This embed token is not valid on pages from ${rig.api.baseUrl}.`);
    await expect.poll(() => page.locator('.preview .events').textContent(), LOAD).toContain('The elements reported:');
    await consoleScreenshot(page, 'embed-refused');
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });
});
