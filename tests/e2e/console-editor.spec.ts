import { normalizePlant, ValidationError } from '@polewright/locus-core';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { callApi, consoleScreenshot, demoPerson, signIn, startConsole, type ConsoleRig } from './support/console';

// The model editor in Chromium against the real server on a fresh database (demo seeded): creating a model
// from an expression with its live locus preview, converting between plant forms, the engine's message at
// the field for a bad plant (nothing saved), a stale edit in two tabs (conflict panel, nothing lost), the
// guard against leaving with unsaved work, and a viewer kept out. Plants are invented for these tests.
let rig: ConsoleRig;

beforeAll(async () => {
  rig = await startConsole();
});

afterAll(async () => {
  await rig?.close();
});

const TAKE_UP = '3.2*(s+2)/(s*(s+0.8)*(s^2+3*s+14))';

/** The number of poles the engine sees (= branches of the locus). */
function branchCount(plant: Record<string, unknown>): number {
  return normalizePlant(plant, '/plant').denominator.length - 1;
}

/** The engine's message for a plant it refuses (the API answers with the same words). */
function engineMessage(plant: Record<string, unknown>): string {
  try {
    normalizePlant(plant, '/plant');
  } catch (error) {
    if (error instanceof ValidationError) return error.issues[0].detail;
  }
  throw new Error('the engine accepted the plant');
}

/** The message under the field an input sits in. */
function errorAt(page: Page, label: string): Promise<string> {
  return page
    .locator('mat-form-field', { has: page.getByLabel(label, { exact: true }) })
    .locator('mat-error')
    .innerText()
    .catch(() => '');
}

/** The model editor of a page is ready (its name field filled for an existing model). */
async function editorReady(page: Page, name?: string): Promise<void> {
  await expect.poll(() => page.locator('pwc-model-editor input[formcontrolname="name"]').count(), { timeout: 15000 }).toBe(1);
  if (name !== undefined) await expect.poll(() => page.getByLabel('Name', { exact: true }).inputValue(), { timeout: 15000 }).toBe(name);
}

async function modelCount(): Promise<number> {
  const page = await callApi(rig.api.baseUrl, '/models?pageSize=1', { token: rig.api.tokens.engineer });
  return page.body['total'] as number;
}

describe('console model editor', () => {
  it('an engineer creates a model from an expression and sees its locus in the preview and on the API', async () => {
    const { context, page, problems } = await rig.open({ height: 1700 });
    await signIn(page, rig.api.baseUrl, 'engineer', '/models/new');
    await editorReady(page);
    await page.getByLabel('Name', { exact: true }).fill('Tail conveyor take-up');
    await page.getByLabel('Description', { exact: true }).fill('Take-up carriage of the tail conveyor: belt spring and carriage mass.');
    await page.getByPlaceholder('Add a tag').fill('Take Up');
    await page.keyboard.press('Enter');
    await page.keyboard.press('Escape');
    await page.getByLabel('Transfer function G(s)').fill(TAKE_UP);
    const branches = branchCount({ expression: TAKE_UP });
    await expect.poll(() => page.locator('pwl-locus-plot path.pw-branch').count(), { timeout: 15000 }).toBe(branches);
    await expect.poll(() => page.locator('pwl-stability-summary').count()).toBe(1);
    // the summary says "stable" and carries the safety caution itself (once: the editor adds no second copy)
    expect(await page.locator('pwc-model-editor pwl-stability-summary .caution').textContent()).toContain('Verify any gain on the real plant');
    expect(await page.locator('pwc-model-editor pwc-caution').count()).toBe(0);
    await consoleScreenshot(page, 'editor-expression');

    await page.getByRole('button', { name: 'Create model' }).first().click();
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 15000 }).toMatch(/^\/models\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.locator('.mat-mdc-snack-bar-label').first().innerText().catch(() => ''), { timeout: 10000 }).toContain('Saved as revision 1');
    const id = new URL(page.url()).pathname.split('/')[2];
    const saved = await callApi(rig.api.baseUrl, `/models/${id}`, { token: rig.api.tokens.engineer });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ name: 'Tail conveyor take-up', tags: ['take-up'], plant: { expression: TAKE_UP }, revision: 1, compensator: null });
    // the model page draws the stored model's locus from this route
    const locus = await callApi(rig.api.baseUrl, `/models/${id}/locus`, { token: rig.api.tokens.engineer });
    expect((locus.body['branches'] as unknown[]).length).toBe(branches);
    const history = await callApi(rig.api.baseUrl, `/models/${id}/revisions`, { token: rig.api.tokens.engineer });
    expect((history.body['items'] as { comment: string }[]).map((r) => r.comment)).toEqual(['First revision']);
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('switching the plant form converts the plant (coefficients, then poles, zeros and gain)', async () => {
    const { context, page, problems } = await rig.open({ height: 1900 });
    await signIn(page, rig.api.baseUrl, 'engineer', '/models/new');
    await editorReady(page);
    await page.getByLabel('Name', { exact: true }).fill('Form switch');
    await page.getByLabel('Transfer function G(s)').fill(TAKE_UP);
    await page.getByLabel('Dead time').fill('0.4');
    await page.getByRole('radio', { name: 'Coefficients' }).click();
    const engine = normalizePlant({ expression: TAKE_UP }, '/plant');
    const numbers = async (label: string) => (await page.getByLabel(label).inputValue()).split(' ').map(Number);
    expect(await numbers('Numerator coefficients')).toEqual(engine.numerator);
    const denominator = await numbers('Denominator coefficients');
    denominator.forEach((c, i) => expect(c).toBeCloseTo(engine.denominator[i], 9));
    await expect.poll(() => page.locator('pwl-locus-plot path.pw-branch').count(), { timeout: 15000 }).toBe(branchCount({ expression: TAKE_UP, deadTime: 0.4 }));
    await consoleScreenshot(page, 'editor-coefficients');

    await page.getByRole('radio', { name: 'Poles, zeros, gain' }).click();
    await expect.poll(() => page.locator('pwc-complex-list').last().locator('.row').count()).toBe(engine.denominator.length - 1);
    expect(await page.getByLabel('Gain', { exact: true }).inputValue()).toBe('3.2');
    expect(await page.getByLabel('Zero 1, real part').inputValue()).toBe('-2');
    // a lone complex pole: the engine's words at the list, and the offer to add its conjugate
    await page.getByRole('button', { name: 'Add a pole' }).click();
    await page.getByLabel('Pole 5, real part').fill('-6');
    await page.getByLabel('Pole 5, imaginary part').fill('2');
    await expect.poll(() => page.locator('.pair-offer').innerText()).toContain('needs its conjugate −6 − 2j');
    await consoleScreenshot(page, 'editor-factored');
    await page.getByRole('button', { name: 'Add −6 − 2j' }).click();
    await expect.poll(() => page.locator('.pair-offer').count()).toBe(0);
    await expect.poll(() => page.locator('pwl-locus-plot path.pw-branch').count(), { timeout: 15000 }).toBe(branchCount({ expression: TAKE_UP, deadTime: 0.4 }) + 2);
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('a bad expression shows the engine’s message at the field and nothing is saved', async () => {
    const before = await modelCount();
    const { context, page, problems } = await rig.open({ height: 1500 });
    const writes: string[] = [];
    page.on('request', (request) => {
      if (request.url().includes('/api/v1/models') && ['POST', 'PUT'].includes(request.method())) writes.push(`${request.method()} ${request.url()}`);
    });
    await signIn(page, rig.api.baseUrl, 'engineer', '/models/new');
    await editorReady(page);
    await page.getByLabel('Name', { exact: true }).fill('Improper take-up');
    await page.getByLabel('Transfer function G(s)').fill(TAKE_UP);
    await expect.poll(() => page.locator('pwl-locus-plot path.pw-branch').count(), { timeout: 15000 }).toBeGreaterThan(0);
    const improper = '3.2*(s+2)^3/(s*(s+0.8))';
    await page.getByLabel('Transfer function G(s)').fill(improper);
    await expect.poll(() => errorAt(page, 'Transfer function G(s)')).toBe(engineMessage({ expression: improper }));
    await expect.poll(() => page.locator('.preview-note').innerText()).toContain('Showing the last valid plant');
    await consoleScreenshot(page, 'editor-engine-error');
    await page.getByRole('button', { name: 'Create model' }).first().click();
    await expect.poll(() => page.locator('.summary').first().innerText()).toContain('correct the marked fields');
    expect(new URL(page.url()).pathname).toBe('/models/new');
    expect(writes).toEqual([]);
    expect(await modelCount()).toBe(before);
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('a stale edit in two tabs shows the conflict, keeps the typed values, and saving on top loses nothing', async () => {
    const token = rig.api.tokens.engineer;
    const created = await callApi(rig.api.baseUrl, '/models', {
      method: 'POST',
      token,
      body: { name: 'Slitter rewind tension', description: 'Rewind tension of the film slitter.', tags: ['web'], plant: { expression: '2.1*(s+1.4)/(s*(s+0.6)*(s+9))' }, comment: 'First model' },
    });
    expect(created.status).toBe(201);
    const id = created.body['id'] as string;
    const { context, page: tabA, problems } = await rig.open({ height: 1900 });
    await signIn(tabA, rig.api.baseUrl, 'engineer', `/models/${id}/edit`);
    const tabB = await context.newPage();
    await tabB.goto(`${rig.api.baseUrl}/models/${id}/edit`);
    await editorReady(tabA, 'Slitter rewind tension');
    await editorReady(tabB, 'Slitter rewind tension');

    await tabA.getByLabel('Description', { exact: true }).fill('Rewind tension of the film slitter; dancer spring measured again.');
    await tabA.getByLabel('Revision comment').fill('A: dancer spring measured');
    await tabA.getByRole('button', { name: 'Save revision' }).first().click();
    await expect.poll(() => new URL(tabA.url()).pathname, { timeout: 15000 }).toBe(`/models/${id}`);

    const mine = '2.1*(s+1.4)/(s*(s+0.75)*(s+9))';
    await tabB.getByLabel('Transfer function G(s)').fill(mine);
    await tabB.getByLabel('Revision comment').fill('B: heavier rewind roll');
    await tabB.getByRole('button', { name: 'Save revision' }).first().click();
    const panel = tabB.locator('pwc-conflict-panel');
    await expect.poll(() => panel.count(), { timeout: 15000 }).toBe(1);
    const text = await panel.innerText();
    expect(text).toContain(`Revision 2 saved by ${demoPerson('engineer').name}`);
    expect(text).toContain('A: dancer spring measured');
    expect(await panel.locator('tbody tr').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-field')))).toEqual(['description', 'plant']);
    expect(await tabB.getByLabel('Transfer function G(s)').inputValue()).toBe(mine);
    expect(await tabB.getByLabel('Revision comment').inputValue()).toBe('B: heavier rewind roll');
    await consoleScreenshot(tabB, 'editor-conflict');

    await tabB.getByRole('button', { name: 'Save mine as revision 3 on top' }).click();
    await expect.poll(() => new URL(tabB.url()).pathname, { timeout: 15000 }).toBe(`/models/${id}`);
    const history = await callApi(rig.api.baseUrl, `/models/${id}/revisions`, { token });
    expect((history.body['items'] as { revision: number; comment: string }[]).map((r) => [r.revision, r.comment])).toEqual([
      [3, 'B: heavier rewind roll'],
      [2, 'A: dancer spring measured'],
      [1, 'First model'],
    ]);
    const theirs = await callApi(rig.api.baseUrl, `/models/${id}/revisions/2`, { token });
    expect(theirs.body['description']).toBe('Rewind tension of the film slitter; dancer spring measured again.');
    const current = await callApi(rig.api.baseUrl, `/models/${id}`, { token });
    expect(current.body).toMatchObject({ revision: 3, plant: { expression: mine } });
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('asks before leaving with unsaved changes', async () => {
    const { context, page } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'engineer', '/models/new');
    await editorReady(page);
    await page.getByLabel('Name', { exact: true }).fill('Not saved yet');
    await page.getByRole('link', { name: 'Cancel' }).first().click();
    const dialog = page.locator('pwc-confirm-action-dialog');
    await expect.poll(() => dialog.count()).toBe(1);
    expect(await dialog.innerText()).toContain('Leave without saving?');
    await dialog.getByRole('button', { name: 'Stay and keep editing' }).click();
    await expect.poll(() => dialog.count()).toBe(0);
    expect(new URL(page.url()).pathname).toBe('/models/new');
    expect(await page.getByLabel('Name', { exact: true }).inputValue()).toBe('Not saved yet');
    await context.close();
  });

  it('a viewer never reaches the editor, and the API refuses the save anyway', async () => {
    const { context, page } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'viewer');
    await page.goto(`${rig.api.baseUrl}/models/new`);
    await expect.poll(() => page.locator('pwc-not-allowed h1').textContent(), { timeout: 10000 }).toBe('Not for your role');
    expect(await page.locator('pwc-model-editor').count()).toBe(0);
    const refused = await callApi(rig.api.baseUrl, '/models', { method: 'POST', token: rig.api.tokens.viewer, body: { name: 'x', plant: { expression: '1/(s+1)' } } });
    expect(refused.status).toBe(403);
    await context.close();
  });
});
