import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { callApi, consoleScreenshot, signIn, startConsole, type ConsoleRig } from './support/console';

// The design workspace in Chromium against the real server on a fresh database (demo seeded): an engineer
// sets a damping target on the demo hoist loop, compares the feasible ranges on screen with the API's own
// answer to the same request, picks a range, adds a compensator zero through the table and saves a new
// revision; a viewer explores without being offered to save or edit.
let rig: ConsoleRig;

beforeAll(async () => {
  rig = await startConsole();
});

afterAll(async () => {
  await rig?.close();
});

interface GainRange {
  from: number;
  to: number | null;
}

/** A figure as the screen writes it: 4 significant digits, true minus sign. */
function shown(value: number): string {
  return String(Number(value.toPrecision(4))).replace(/-/g, '−');
}

async function hoist(token: string): Promise<{ id: string; plant: unknown; revision: number }> {
  const page = await callApi(rig.api.baseUrl, `/models?q=${encodeURIComponent('Hoist 2')}`, { token });
  const items = page.body['items'] as { id: string; name: string; plant: unknown; revision: number }[];
  const found = items.find((m) => m.name.startsWith('Hoist 2 hook position'));
  if (!found) throw new Error('the demo hoist loop is missing');
  return found;
}

async function gainOnScreen(page: Page): Promise<number> {
  // the gain control's number field (playwright's CSS reaches into the element's open shadow root)
  return Number(await page.locator('pwl-gain-control input#field').inputValue());
}

describe('console design workspace', () => {
  it('an engineer sets a damping target, picks a feasible range, adds a compensator zero and saves a revision', async () => {
    const token = rig.api.tokens.engineer;
    const model = await hoist(token);
    const revisionsBefore = ((await callApi(rig.api.baseUrl, `/models/${model.id}/revisions`, { token })).body['items'] as unknown[]).length;
    // tall enough for the whole workspace in one screenshot (the shell scrolls inside the window)
    const { context, page, problems } = await rig.open({ width: 1400, height: 2000 });
    await signIn(page, rig.api.baseUrl, 'engineer', `/models/${model.id}/design`);
    await expect.poll(() => page.locator('pwc-gain-verdict .headline').textContent(), { timeout: 30000 }).toMatch(/^Stable at K = /);
    // an engineer gets the plot's compensator tools (the viewer case below checks they are absent)
    expect(await page.locator('pwl-locus-plot button', { hasText: '+ Zero' }).count()).toBe(1);

    const asked = page.waitForRequest((r) => r.method() === 'POST' && r.url().endsWith('/api/v1/design') && (JSON.parse(r.postData() ?? '{}') as { targets?: { minDampingRatio?: number } }).targets?.minDampingRatio === 0.3, { timeout: 30000 });
    await page.getByLabel('Min damping ratio ζ').fill('0.3');
    const body = JSON.parse((await asked).postData() as string) as Record<string, unknown>;
    // without a compensator the loop is the stored plant itself, as the server's loopPlant makes it
    expect(body).toEqual({ plant: model.plant, targets: { minDampingRatio: 0.3 }, dominantOnly: false, dampingLines: [0.3] });

    const direct = await callApi(rig.api.baseUrl, '/design', { method: 'POST', token, body });
    expect(direct.status).toBe(200);
    const ranges = direct.body['gainRanges'] as GainRange[];
    expect(ranges.length).toBeGreaterThan(0);
    const rows = page.locator('pwc-feasible-ranges tr.mat-mdc-row');
    await expect.poll(() => rows.count(), { timeout: 30000 }).toBe(ranges.length);
    for (const [i, range] of ranges.entries()) {
      const cells = (await rows.nth(i).locator('td').allTextContents()).map((t) => t.trim());
      expect(cells[0]).toBe(range.from === 0 ? '0' : shown(range.from));
      expect(cells[2]).toBe(range.to === null ? '∞' : shown(range.to));
    }
    const lines = direct.body['dampingLineGains'] as { dampingRatio: number; gains: number[] }[];
    expect(lines.map((l) => l.dampingRatio)).toEqual([0.3]);
    await consoleScreenshot(page, 'design-workspace');

    const picked = ranges[0];
    await rows.first().getByRole('button', { name: /^Use K = / }).click();
    await expect.poll(() => gainOnScreen(page)).toBeGreaterThan(picked.from);
    const gain = await gainOnScreen(page);
    if (picked.to !== null) expect(gain).toBeLessThan(picked.to);
    await expect.poll(() => page.locator('pwc-gain-verdict').textContent()).toContain('Meets the design targets at this gain.');
    expect(await page.locator('pwc-gain-verdict pwc-caution').isVisible()).toBe(true);
    expect(await page.locator('pwc-feasible-ranges pwc-caution').isVisible()).toBe(true);

    // a compensator zero at −2 through the table: the loop sent to the API becomes compensator × plant
    const compensated = page.waitForRequest((r) => r.method() === 'POST' && r.url().endsWith('/api/v1/design') && 'numerator' in (JSON.parse(r.postData() ?? '{}') as { plant: object }).plant, { timeout: 30000 });
    await page.getByRole('button', { name: 'Add zero' }).click();
    await page.getByLabel('Zero 1 real part').fill('-2');
    await compensated;
    await expect.poll(() => page.locator('.banner.unsaved').textContent()).toContain('compensator');
    expect((await page.locator('pwc-compensator-table td.value').first().textContent())?.trim()).toBe('−2');
    const gainToSave = await gainOnScreen(page);

    await page.getByRole('button', { name: 'Save as new revision' }).click();
    await page.getByLabel('Revision comment').fill('Lead zero at −2: wider band of gains with ζ ≥ 0.3');
    await consoleScreenshot(page, 'design-save-dialog');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await expect.poll(() => page.locator('.byline').textContent(), { timeout: 30000 }).toContain(`Revision ${model.revision + 1},`);
    expect(await page.locator('.banner.unsaved').count()).toBe(0);

    const saved = await callApi(rig.api.baseUrl, `/models/${model.id}`, { token });
    expect(saved.body['revision']).toBe(model.revision + 1);
    expect(saved.body['plant']).toEqual(model.plant);
    expect(saved.body['compensator']).toEqual({ zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 });
    expect(saved.body['design']).toEqual({ gain: gainToSave, targets: { minDampingRatio: 0.3 } });
    const revisions = (await callApi(rig.api.baseUrl, `/models/${model.id}/revisions`, { token })).body['items'] as { revision: number; comment: string }[];
    expect(revisions.length).toBe(revisionsBefore + 1);
    expect(revisions.find((r) => r.revision === model.revision + 1)?.comment).toBe('Lead zero at −2: wider band of gains with ζ ≥ 0.3');
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('a viewer explores gains and targets but is offered no save and no compensator editing', async () => {
    const model = await hoist(rig.api.tokens.viewer);
    const { context, page, problems } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'viewer', `/models/${model.id}/design`);
    await expect.poll(() => page.locator('pwc-gain-verdict .headline').textContent(), { timeout: 30000 }).toMatch(/^Stable at K = /);
    await page.getByLabel('Min damping ratio ζ').fill('0.3');
    await expect.poll(() => page.locator('pwc-feasible-ranges tr.mat-mdc-row').count(), { timeout: 30000 }).toBeGreaterThan(0);
    expect(await page.getByRole('button', { name: 'Save as new revision' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Add zero' }).count()).toBe(0);
    expect(await page.locator('pwl-locus-plot button', { hasText: '+ Zero' }).count()).toBe(0);
    expect(await page.getByLabel('Compensator gain').isDisabled()).toBe(true);
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });
});
