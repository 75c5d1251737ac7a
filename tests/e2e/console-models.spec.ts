import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { callApi, consoleScreenshot, signIn, startConsole, type ConsoleRig } from './support/console';

// The model library and the model page in Chromium against the real server on a fresh database (the demo
// loops of the invented Quillfield Conveyor Works seeded, two of them with a second, retuned revision).
let rig: ConsoleRig;

interface ApiModel {
  id: string;
  name: string;
  tags: string[];
  revision: number;
  plant: unknown;
  compensator: unknown;
  design: { gain: number | null; targets: unknown };
  deletedAt: string | null;
}

beforeAll(async () => {
  rig = await startConsole();
});

afterAll(async () => {
  await rig?.close();
});

/** The demo models as the API lists them (engineer's view), in the API's name order. */
async function demoModels(query = 'sort=name&pageSize=200'): Promise<ApiModel[]> {
  const answer = await callApi(rig.api.baseUrl, `/models?${query}`, { token: rig.api.tokens.engineer });
  expect(answer.status).toBe(200);
  return answer.body['items'] as ApiModel[];
}

/** The names in the library table, top to bottom, once loading has settled. */
async function rowNames(page: Page): Promise<string[]> {
  await poll(() => page.locator('pwc-model-library mat-progress-bar').count()).toBe(0);
  return (await page.locator('pwc-model-library td.mat-column-name a.name').allTextContents()).map((t) => t.trim());
}

/** Polls until the expectation holds, allowing for lazy-loaded screens and debounced searches on a busy machine. */
function poll<T>(read: () => T | Promise<T>): ReturnType<typeof expect.poll<T>> {
  return expect.poll(read, { timeout: 15000 });
}

function query(page: Page): URLSearchParams {
  return new URL(page.url()).searchParams;
}

async function menuItems(page: Page): Promise<string[]> {
  await page.locator('.mat-mdc-menu-panel').waitFor();
  return (await page.locator('.mat-mdc-menu-panel .mat-mdc-menu-item-text').allTextContents()).map((t) => t.trim());
}

describe('console model library and model page', () => {
  it('an engineer filters the library by tag and by text, sorts by name and pages, with the view in the URL', async () => {
    const all = await demoModels();
    const conveyor = all.filter((m) => m.tags.includes('conveyor')).map((m) => m.name);
    expect(conveyor.length).toBeGreaterThan(0);
    const { context, page, problems } = await rig.open({ width: 1366, height: 1000 });
    await signIn(page, rig.api.baseUrl, 'engineer');
    await poll(async () => (await rowNames(page)).sort()).toEqual(all.map((m) => m.name).sort());
    await consoleScreenshot(page, 'models-library');

    // tag filter from the select (with counts)
    await page.getByRole('combobox', { name: 'Tag' }).click();
    await page.getByRole('option', { name: `conveyor (${conveyor.length})` }).click();
    await poll(() => query(page).get('tag')).toBe('conveyor');
    await poll(async () => (await rowNames(page)).sort()).toEqual([...conveyor].sort());

    // text search (debounced) on top of the tag, then without it: what the API finds for the same query
    const fullLoad = (await demoModels('q=full%20load&tag=conveyor')).map((m) => m.name);
    expect(fullLoad.length).toBe(1);
    await page.getByLabel('Search names and descriptions').fill('full load');
    await poll(() => query(page).get('q')).toBe('full load');
    await poll(() => rowNames(page)).toEqual(fullLoad);
    await page.getByRole('button', { name: 'Clear filters' }).first().click();
    await poll(() => page.url()).toBe(`${rig.api.baseUrl}/models`);
    const hoist = (await demoModels('q=hoist')).map((m) => m.name).sort();
    expect(hoist.length).toBeGreaterThan(0);
    await page.getByLabel('Search names and descriptions').fill('hoist');
    await poll(async () => (await rowNames(page)).sort()).toEqual(hoist);

    // nothing matches: the empty state says what to do
    await page.getByLabel('Search names and descriptions').fill('no such loop anywhere');
    await poll(() => page.locator('.pwc-empty').textContent()).toContain('No model matches “no such loop anywhere”');
    await page.locator('.pwc-empty').getByRole('button', { name: 'Clear filters' }).click();
    await poll(async () => (await rowNames(page)).length).toBe(all.length);

    // sort by name through the header: the API's name order
    await page.locator('th.mat-column-name .mat-sort-header-container').click();
    await poll(() => query(page).get('sort')).toBe('name');
    await poll(() => rowNames(page)).toEqual(all.map((m) => m.name));

    // a shared link with a small page, then the next page, and Back
    await page.goto(`${rig.api.baseUrl}/models?sort=name&pageSize=5`);
    await poll(() => rowNames(page)).toEqual(all.slice(0, 5).map((m) => m.name));
    await page.getByRole('button', { name: 'Next page' }).click();
    await poll(() => query(page).get('page')).toBe('2');
    await poll(() => rowNames(page)).toEqual(all.slice(5, 10).map((m) => m.name));
    await page.goBack();
    await poll(() => query(page).get('page')).toBeNull();
    await poll(() => rowNames(page)).toEqual(all.slice(0, 5).map((m) => m.name));

    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('an engineer duplicates a demo model, deletes the copy and gets it back (Undo, then Restore)', async () => {
    const original = (await demoModels()).find((m) => m.name === 'Line 3 belt speed (PI + drive)') as ApiModel;
    expect(original).toBeDefined();
    const { context, page, problems } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'engineer', '/models?sort=name');
    await rowNames(page);
    await page.getByRole('button', { name: `Actions for ${original.name}` }).click();
    expect(await menuItems(page)).toEqual(['Open', 'Design', 'Edit', 'Duplicate', 'Delete']);
    await page.getByRole('menuitem', { name: 'Duplicate' }).click();

    // the copy opens: same content, its own id, a comment saying where it came from
    await poll(() => new URL(page.url()).pathname).toMatch(/^\/models\/[0-9a-f-]{36}$/);
    const copyId = new URL(page.url()).pathname.split('/')[2] as string;
    expect(copyId).not.toBe(original.id);
    await poll(() => page.locator('pwc-page-header h1').textContent()).toBe(`Copy of ${original.name}`);
    const copy = (await callApi(rig.api.baseUrl, `/models/${copyId}`, { token: rig.api.tokens.engineer })).body as unknown as ApiModel;
    expect(copy).toMatchObject({ name: `Copy of ${original.name}`, tags: original.tags, plant: original.plant, compensator: original.compensator, design: original.design, revision: 1 });
    const history = await callApi(rig.api.baseUrl, `/models/${copyId}/revisions`, { token: rig.api.tokens.engineer });
    expect((history.body['items'] as { comment: string }[])[0]?.comment).toContain(`Duplicated from “${original.name}”, revision ${original.revision}`);

    // delete on the model page (confirmation names it), then Undo in the snackbar
    await page.locator('pwc-page-header').getByRole('button', { name: 'Delete' }).click();
    await poll(() => page.locator('mat-dialog-container').textContent()).toContain(`Copy of ${original.name}`);
    await page.locator('mat-dialog-container').getByRole('button', { name: 'Delete' }).click();
    await poll(() => page.locator('.banner.deleted').count()).toBe(1);
    expect((await callApi(rig.api.baseUrl, `/models/${copyId}`, { token: rig.api.tokens.engineer })).status).toBe(404);
    await page.getByRole('button', { name: 'Undo' }).click();
    await poll(() => page.locator('.banner.deleted').count()).toBe(0);
    expect((await callApi(rig.api.baseUrl, `/models/${copyId}`, { token: rig.api.tokens.engineer })).status).toBe(200);

    // delete from the library; the row goes; "Show deleted" brings it back greyed, and Restore restores it
    await page.goto(`${rig.api.baseUrl}/models?q=${encodeURIComponent('Copy of')}`);
    await poll(() => rowNames(page)).toEqual([`Copy of ${original.name}`]);
    await page.getByRole('button', { name: `Actions for Copy of ${original.name}` }).click();
    await page.getByRole('menuitem', { name: 'Delete' }).click();
    await page.locator('mat-dialog-container').getByRole('button', { name: 'Delete' }).click();
    await poll(() => page.locator('.pwc-empty').textContent()).toContain('No model matches');
    await page.getByRole('switch', { name: 'Show deleted' }).click();
    await poll(() => query(page).get('includeDeleted')).toBe('true');
    await poll(() => page.locator('tr.deleted .deleted-status').allTextContents()).toEqual(['deleted']);
    await page.getByRole('button', { name: `Actions for Copy of ${original.name}` }).click();
    expect(await menuItems(page)).toEqual(['Open', 'Restore']);
    await page.getByRole('menuitem', { name: 'Restore' }).click();
    await poll(() => page.locator('tr.deleted').count()).toBe(0);
    const restored = await callApi(rig.api.baseUrl, `/models/${copyId}`, { token: rig.api.tokens.engineer });
    expect(restored.status).toBe(200);
    expect(restored.body['deletedAt']).toBeNull();

    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('an engineer compares revisions 1 and 2 of a retuned demo loop: the changed design gain is highlighted', async () => {
    const retuned = (await demoModels()).find((m) => m.revision === 2 && m.name === 'Compressor header pressure') as ApiModel;
    expect(retuned).toBeDefined();
    const first = (await callApi(rig.api.baseUrl, `/models/${retuned.id}/revisions/1`, { token: rig.api.tokens.engineer })).body as unknown as ApiModel;
    expect(first.design.gain).not.toBe(retuned.design.gain);
    const { context, page, problems } = await rig.open({ width: 1366, height: 3000 });
    await signIn(page, rig.api.baseUrl, 'engineer');
    await page.getByRole('link', { name: retuned.name }).click();
    await poll(() => new URL(page.url()).pathname).toBe(`/models/${retuned.id}`);

    // the current revision in the studio, with the caution beside the design gain
    await poll(() => page.locator('.design .gain').textContent()).toBe(String(retuned.design.gain));
    expect(await page.locator('#pwc-model-content pwc-caution').isVisible()).toBe(true);
    await poll(() => page.locator('pwl-loop-studio pwl-locus-plot').count()).toBe(1);
    expect(await page.locator('pwc-revision-history tr[data-revision]').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-revision')))).toEqual(['2', '1']);

    // the comparison defaults to revisions 1 and 2
    const gainRow = page.locator('table.diff tr[data-field="design.gain"]');
    await poll(() => gainRow.evaluate((row) => row.classList.contains('changed'))).toBe(true);
    expect((await gainRow.locator('[data-side=before]').textContent())?.trim()).toBe(String(first.design.gain));
    expect((await gainRow.locator('[data-side=after]').textContent())?.trim()).toBe(String(retuned.design.gain));
    expect(await page.locator('table.diff tr[data-field="plant.expression"]').evaluate((row) => row.classList.contains('changed'))).toBe(false);
    expect(await page.locator('table.diff tr.changed .badge').count()).toBeGreaterThan(0);
    // both loci drawn, side by side, each at its own design gain
    const plots = page.locator('pwc-revision-diff pwl-locus-plot');
    await poll(() => plots.count()).toBe(2);
    await poll(() => plots.evaluateAll((els) => els.map((el) => el.shadowRoot?.querySelectorAll('path').length ?? 0).every((n) => n > 0))).toBe(true);
    const boxes = await plots.evaluateAll((els) => els.map((el) => el.getBoundingClientRect()).map((r) => ({ top: Math.round(r.top), left: r.left, height: r.height })));
    expect(boxes[0]?.top).toBe(boxes[1]?.top);
    expect(boxes[0]!.left).toBeLessThan(boxes[1]!.left);
    expect(boxes[0]!.height).toBeGreaterThan(200);
    expect(await page.locator('pwc-revision-diff figcaption').allTextContents()).toEqual([`Revision 1 at K = ${first.design.gain}`, `Revision 2 at K = ${retuned.design.gain}`]);
    await consoleScreenshot(page, 'model-page');
    // the comparison alone: a screen-sized window scrolled to it (the shell scrolls inside the viewport)
    await page.setViewportSize({ width: 1366, height: 1500 });
    await page.locator('#pwc-compare').evaluate((section) => section.scrollIntoView({ block: 'start' }));
    await consoleScreenshot(page, 'model-revision-diff');

    // revision 1 opened read-only
    await page.locator('pwc-revision-history tr[data-revision="1"]').getByRole('button', { name: 'View revision 1' }).click();
    await poll(() => query(page).get('revision')).toBe('1');
    await poll(() => page.locator('.banner.old').textContent()).toContain('revision 1 of 2, read only');
    await poll(() => page.locator('.design .gain').textContent()).toBe(String(first.design.gain));

    // an unknown id says so
    await page.goto(`${rig.api.baseUrl}/models/00000000-0000-4000-8000-000000000000`);
    await poll(() => page.locator('.panel h1').textContent()).toBe('No such model');

    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('a viewer reads the library and a model page without any change actions, and the API refuses a viewer’s save', async () => {
    const model = (await demoModels())[0] as ApiModel;
    const { context, page, problems } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'viewer');
    await poll(async () => (await rowNames(page)).length).toBeGreaterThan(0);
    expect(await page.getByRole('link', { name: 'New model' }).count()).toBe(0);
    await page.getByRole('button', { name: `Actions for ${model.name}` }).click();
    expect(await menuItems(page)).toEqual(['Open', 'Design']);
    await page.getByRole('menuitem', { name: 'Open' }).click();
    await poll(() => page.locator('pwc-page-header h1').textContent()).toBe(model.name);
    await poll(() => page.locator('pwc-page-header .actions .mdc-button__label').allTextContents()).toEqual(['Design']);
    expect(await page.locator('pwc-revision-history').count()).toBe(1);
    await consoleScreenshot(page, 'model-page-viewer');

    const token = (await page.evaluate(() => localStorage.getItem('polewright.session'))) as string;
    const current = await fetch(`${rig.api.baseUrl}/api/v1/models/${model.id}`, { headers: { Authorization: `Bearer ${token}` } });
    const etag = current.headers.get('ETag') as string;
    const refused = await fetch(`${rig.api.baseUrl}/api/v1/models/${model.id}`, {
      method: 'PUT',
      headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json', 'If-Match': etag },
      body: JSON.stringify({ name: 'Renamed by a viewer', plant: model.plant }),
    });
    expect(refused.status).toBe(403);
    expect(refused.headers.get('Content-Type')).toContain('application/problem+json');
    expect((await callApi(rig.api.baseUrl, `/models/${model.id}`, { token: rig.api.tokens.engineer })).body['name']).toBe(model.name);

    expect(problems.exceptions).toEqual([]);
    await context.close();
  });
});
