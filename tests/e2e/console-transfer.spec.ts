import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { scenarioLoops } from '../../server/src/models/models.seed';
import { callApi, consoleScreenshot, signIn, startConsole, type ConsoleRig } from './support/console';

// The console's import and export screen in Chromium against the real server (fresh database, demo
// seeded): a CSV with a good and a bad row, the progress and the per-row result; the export bundle; the
// CSV template made in the browser; and what a viewer sees.
const LOAD = { timeout: 30000, interval: 200 };
const CSV = ['name,expression,tags,designGain', 'Sorter infeed belt (import test),7.5/(s*(s+3)*(s+12)),sorter;import-test,4', 'Broken scale feeder (import test),2/(s*(s+,feeder,2'].join('\n');

let rig: ConsoleRig;

beforeAll(async () => {
  rig = await startConsole();
});

afterAll(async () => {
  await rig?.close();
});

/** Chooses a file with the page's file button (as a person would). */
async function choose(page: Page, name: string, content: string | Buffer, mimeType = 'text/csv'): Promise<void> {
  const chooser = page.waitForEvent('filechooser');
  await page.getByRole('button', { name: 'Choose file' }).click();
  await (await chooser).setFiles({ name, mimeType, buffer: Buffer.isBuffer(content) ? content : Buffer.from(content) });
}

/** The rows of the result table: status, the link of a created model, the pointers and messages of a rejected one. */
function resultRows(page: Page) {
  return page.locator('tr[data-status]').evaluateAll((rows) =>
    rows.map((row) => ({
      row: row.querySelector('td')?.textContent?.trim(),
      status: (row as HTMLElement).dataset['status'],
      link: row.querySelector('a')?.getAttribute('href') ?? null,
      errors: [...row.querySelectorAll('.errors li')].map((li) => [li.querySelector('.pointer')?.textContent, li.querySelector('.message')?.textContent]),
    })),
  );
}

describe('console import and export', () => {
  it('imports a CSV with one good and one bad row: the progress reaches 100 %, the table links the new model and lists the rejection', async () => {
    const { context, page, problems } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'engineer', '/transfer');
    await consoleScreenshot(page, 'transfer-start');
    await choose(page, 'sorter-loops.csv', CSV);

    await expect.poll(() => page.locator('tr[data-status]').count(), LOAD).toBe(2);
    expect(await page.locator('.progress mat-progress-bar').getAttribute('aria-valuenow')).toBe('100');
    expect(await page.locator('.progress .phase').textContent()).toContain('Uploaded 100 %, checked.');
    expect((await page.locator('.counts .pwc-status').allTextContents()).map((t) => t.trim())).toEqual(['1 created', '1 rejected']);
    const rows = await resultRows(page);
    expect(rows.map((r) => [r.row, r.status])).toEqual([
      ['1', 'created'],
      ['2', 'rejected'],
    ]);
    expect(rows[1]?.errors).toEqual([['/plant/expression', expect.stringMatching(/^cannot be parsed/)]]);

    // the link leads to the model the API stored, with the row's content
    const id = /^\/models\/([^/]+)$/.exec(rows[0]?.link ?? '')?.[1] as string;
    const created = await callApi(rig.api.baseUrl, `/models/${id}`, { token: rig.api.tokens.engineer });
    expect(created.status).toBe(200);
    expect(created.body).toMatchObject({ name: 'Sorter infeed belt (import test)', tags: ['sorter', 'import-test'], plant: { expression: '7.5/(s*(s+3)*(s+12))' }, design: { gain: 4 } });
    const rejected = await callApi(rig.api.baseUrl, `/models?q=${encodeURIComponent('Broken scale feeder')}`, { token: rig.api.tokens.engineer });
    expect(rejected.body['total']).toBe(0);
    await consoleScreenshot(page, 'transfer-result');

    await page.locator(`a[href="/models/${id}"]`).click();
    await expect.poll(() => new URL(page.url()).pathname).toBe(`/models/${id}`);
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('downloads an export bundle under the server’s file name holding the demo models', async () => {
    const { context, page, problems } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'viewer', '/transfer');
    // a viewer exports but has no import, and is told why
    expect(await page.locator('[data-testid="drop-zone"]').count()).toBe(0);
    expect(await page.locator('.no-import').textContent()).toContain('needs the models:write permission');
    const downloading = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download export' }).click();
    const download = await downloading;
    expect(download.suggestedFilename()).toMatch(/^polewright-models-\d{4}-\d{2}-\d{2}\.json$/);
    const bundle = JSON.parse(readFileSync((await download.path()) as string, 'utf8')) as { format: string; models: { name: string; sourceId: string }[] };
    expect(bundle.format).toBe('polewright-models');
    const names = bundle.models.map((m) => m.name);
    for (const loop of scenarioLoops()) expect(names).toContain(loop.name);
    await expect.poll(async () => (await page.locator('.saved').textContent())?.trim()).toBe(`Saved ${download.suggestedFilename()}: ${bundle.models.length} models.`);
    await consoleScreenshot(page, 'transfer-viewer');
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('the CSV template made in the browser imports cleanly; a file over 1 MiB is refused on the page', async () => {
    const { context, page, problems } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'engineer', '/transfer');
    await page.getByText('CSV columns').click();
    const downloading = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download CSV template' }).click();
    const template = await downloading;
    expect(template.suggestedFilename()).toBe('polewright-models-template.csv');
    const text = readFileSync((await template.path()) as string, 'utf8');
    await consoleScreenshot(page, 'transfer-columns');

    await choose(page, 'template.csv', text);
    await expect.poll(() => page.locator('tr[data-status]').count(), LOAD).toBe(2);
    expect((await resultRows(page)).map((r) => r.status)).toEqual(['created', 'created']);

    const imports: string[] = [];
    page.on('request', (r) => {
      if (r.url().endsWith('/models/import')) imports.push(r.method());
    });
    await choose(page, 'too-big.csv', Buffer.alloc(1024 * 1024 + 1, 'a'));
    await expect.poll(() => page.locator('.problem').textContent()).toContain('too-big.csv is 1.0 MiB; the import takes files up to 1.0 MiB.');
    expect(imports).toEqual([]);
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });
});
