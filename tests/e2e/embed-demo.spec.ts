import { existsSync } from 'node:fs';
import { locus } from '@polewright/locus-core';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { scenarioLoops } from '../../server/src/models/models.seed';
import { startTestServer, type TestServer } from '../../server/src/testing/test-server';
import { CHROMIUM_ARGS, launchChromium, watchProblems, type PageProblems } from './support/chromium';
import { elementsDefined, inside, screenshot } from './support/elements-page';

// The embedding demo (demo/embed, served by the real server at /embed-demo/): a plain HTML dashboard of the
// invented company's line 3 belt drive at light and full load, loading both saved models with the embed
// token its session route mints, and holding both loops at one gain. Needs the build (dist/elements).
const KEYS = ['line3-belt-speed', 'line3-belt-speed-full-load'];
const figure = new Intl.NumberFormat('en-US', { maximumSignificantDigits: 4 });
// patience for the first load (the compute workers start on first use) and for each change to show; not timing
const LOAD = { timeout: 60000 };
const WAIT = { timeout: 15000 };

interface SavedModel {
  id: string;
  name: string;
  plant: object;
  design: { gain: number };
}

let api: TestServer;
let browser: Browser;
let page: Page;
let problems: PageProblems;
let models: SavedModel[];

beforeAll(async () => {
  if (!existsSync('dist/elements/polewright-elements.js')) throw new Error('dist/elements/polewright-elements.js is missing: run npm run build first');
  api = await startTestServer();
  browser = await launchChromium();
  // the two demo loops as the API holds them (read with an engineer's session, not the page's token)
  const names = KEYS.map((key) => scenarioLoops().find((l) => l.key === key)?.name);
  const list = await fetch(`${api.baseUrl}/api/v1/models?pageSize=200`, { headers: { Authorization: `Bearer ${api.tokens.engineer}` } });
  const items = ((await list.json()) as { items: SavedModel[] }).items;
  models = names.map((name) => items.find((m) => m.name === name) as SavedModel);
  expect(models.every(Boolean)).toBe(true);
});

afterEach(async () => {
  await page?.close();
});

afterAll(async () => {
  await browser?.close();
  await api?.close();
});

/** The K each element of a loop shows: summary verdict, step caption, and the locus plot's read-out. */
async function shownGains(key: string): Promise<string[]> {
  const verdict = (await inside(page, `summary-${key}`, '.verdict').textContent()) ?? '';
  const caption = (await inside(page, `step-${key}`, 'figcaption').textContent()) ?? '';
  const plot = (await inside(page, `plot-${key}`, '.pw-area').getAttribute('aria-valuenow')) ?? '';
  return [/At K = ([^ ]+) /.exec(verdict)?.[1] ?? verdict, /at K = ([^:]+):/.exec(caption)?.[1] ?? caption, figure.format(Number(plot))];
}

describe('the embedding demo page', () => {
  it('shows both saved loops with the token from its session route, and one gain moves both', async () => {
    page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    problems = watchProblems(page);
    const response = await page.goto(`${api.baseUrl}/embed-demo/`);
    expect(response?.status()).toBe(200);
    await elementsDefined(page);
    await expect.poll(() => page.locator('body').getAttribute('data-ready'), LOAD).toBe('true');

    // headings are the models' names as the API gives them; every branch of each locus is drawn
    expect(await page.locator('h2.loop-title').allTextContents()).toEqual(models.map((m) => m.name));
    for (const [i, key] of KEYS.entries()) {
      const branches = locus({ plant: models[i]!.plant as never }).branches.length;
      await expect.poll(() => inside(page, `plot-${key}`, 'path.pw-branch').count(), LOAD).toBe(branches);
    }

    // both loops start at the gain saved with the light-load model
    const start = figure.format(models[0]!.design.gain);
    for (const key of KEYS) await expect.poll(() => shownGains(key), WAIT).toEqual([start, start, start]);
    expect(await page.locator('#readout-gain').textContent()).toBe(`K = ${start}`);
    expect(await page.locator('#readout-both').textContent()).toBe('yes');
    // the caution stands beside the verdict
    expect(await page.locator('#caution-text').textContent()).toMatch(/^Model-based result: .*Verify any gain on the real plant/);
    expect(await page.locator('#caution-text').isVisible()).toBe(true);
    await screenshot(page, 'embed-demo');

    // the shared gain control belongs to one loop; typing a gain there moves the other loop as well
    const field = page.locator('#shared-gain').locator('input.field');
    await field.fill('3');
    await field.press('Enter');
    for (const key of KEYS) await expect.poll(() => shownGains(key), WAIT).toEqual(['3', '3', '3']);
    expect(await page.locator('#readout-gain').textContent()).toBe('K = 3');

    // the arrow keys on the light-load plot move the gain control and the full-load loop with it
    await inside(page, `plot-${KEYS[0]}`, '.pw-area').focus();
    await page.keyboard.press('PageUp');
    const lightGain = async () => Number(await inside(page, `plot-${KEYS[0]}`, '.pw-area').getAttribute('aria-valuenow'));
    await expect.poll(lightGain, WAIT).toBeGreaterThan(3);
    const raw = await lightGain();
    const moved = figure.format(raw);
    await expect.poll(() => shownGains(KEYS[1]!), WAIT).toEqual([moved, moved, moved]);
    expect(await field.inputValue()).toBe(String(Number(raw.toPrecision(6))));
    expect(await page.locator('#readout-gain').textContent()).toBe(`K = ${moved}`);

    // a gain above the full-load limit but below the light-load one: stable at light load only
    const full = locus({ plant: models[1]!.plant as never }).stableGainRanges[0]!.to!;
    const light = locus({ plant: models[0]!.plant as never }).stableGainRanges[0]!.to!;
    expect(full).toBeLessThan(light);
    const between = Number(((full + light) / 2).toPrecision(3));
    await field.fill(String(between));
    await field.press('Enter');
    await expect.poll(() => inside(page, `summary-${KEYS[0]}`, '.verdict').textContent(), WAIT).toBe(`At K = ${figure.format(between)} the closed loop is stable.`);
    await expect.poll(() => inside(page, `summary-${KEYS[1]}`, '.verdict').textContent(), WAIT).toBe(`At K = ${figure.format(between)} the closed loop is not stable.`);
    expect(await page.locator('#readout-both').textContent()).toBe('no');
    expect(await page.locator('#page-message').isHidden()).toBe(true);
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('keeps its layout on a narrow screen', async () => {
    page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    problems = watchProblems(page);
    await page.goto(`${api.baseUrl}/embed-demo/`);
    await elementsDefined(page);
    await expect.poll(() => page.locator('body').getAttribute('data-ready'), LOAD).toBe('true');
    await expect.poll(() => inside(page, `plot-${KEYS[1]}`, 'path.pw-branch').count(), LOAD).toBeGreaterThan(0);
    // nothing wider than the screen
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await screenshot(page, 'embed-demo-narrow');
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });
});

describe('the embedding demo page on plain HTTP under a host name', () => {
  let named: Browser;
  beforeAll(async () => {
    // a host name that is not localhost: browsers send no Sec-Fetch-Site to plain HTTP there
    named = await chromium.launch({ executablePath: '/usr/bin/chromium', args: [...CHROMIUM_ARGS, '--host-resolver-rules=MAP polewright.quillfield.test 127.0.0.1'], headless: true });
  });
  afterAll(async () => {
    await named?.close();
  });

  it('still reads its models, the browser naming the page by its Referer', async () => {
    page = await named.newPage({ viewport: { width: 1280, height: 800 } });
    problems = watchProblems(page);
    const sent: { site?: string; origin?: string; referer?: string }[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/v1/models/')) sent.push({ site: r.headers()['sec-fetch-site'], origin: r.headers()['origin'], referer: r.headers()['referer'] });
    });
    const base = `http://polewright.quillfield.test:${new URL(api.baseUrl).port}`;
    await page.goto(`${base}/embed-demo/`);
    await expect.poll(() => page.locator('body').getAttribute('data-ready'), LOAD).toBe('true');
    for (const key of KEYS) await expect.poll(() => inside(page, `plot-${key}`, 'path.pw-branch').count(), LOAD).toBeGreaterThan(0);
    expect(sent.length).toBeGreaterThan(0);
    expect(sent.every((h) => h.site === undefined && h.origin === undefined && h.referer === `${base}/embed-demo/`)).toBe(true);
    expect(problems.exceptions).toEqual([]);
    // Chromium's notice that it ignores helmet's Cross-Origin-Opener-Policy on a plain-HTTP host is about the
    // server's headers on any page there, not about this page; nothing else may complain
    expect(problems.consoleErrors.filter((e) => !/^The Cross-Origin-Opener-Policy header has been ignored/.test(e))).toEqual([]);
  });
});

describe('the embedding demo page without the seeded demo', () => {
  let bare: TestServer;
  beforeAll(async () => {
    bare = await startTestServer({ env: { POLEWRIGHT_DEMO: 'off' } });
  });
  afterAll(async () => {
    await bare?.close();
  });

  it('says why there are no plots, in words', async () => {
    page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    problems = watchProblems(page);
    await page.goto(`${bare.baseUrl}/embed-demo/`);
    const message = page.locator('#page-message');
    await expect.poll(() => message.isVisible(), LOAD).toBe(true);
    expect(await message.textContent()).toMatch(/^The demo could not get its embed token: Not found: .*POLEWRIGHT_DEMO=off.* \(404\)/);
    expect(await page.locator('#session-state').textContent()).toBe('not connected');
    expect(await page.locator('pw-locus-plot').count()).toBe(0);
    expect(problems.exceptions).toEqual([]);
    // the browser logs the failed request itself; nothing else may complain
    expect(problems.consoleErrors.filter((e) => !/status of 404/.test(e))).toEqual([]);
  });
});
