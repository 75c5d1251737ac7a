import { existsSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { launchChromium, watchProblems, type PageProblems } from './support/chromium';
import { elementsDefined, inside, plainPage, recordedEvents, screenshot } from './support/elements-page';
import { serveStatic, type StaticServer } from './support/static-server';

// Real-browser tests of the pw- custom elements on plain HTML pages (no Angular on the page), against the
// built bundle in dist/elements (npm run build). Demo loops from demo/scenario.json (invented).
const BELT = '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))';
// 1/(s(s+1)(s+2)) is stable for 0 < K < 6 (Routh–Hurwitz, worked by hand)
const CUBIC = '1/(s*(s+1)*(s+2))';

let server: StaticServer;
let browser: Browser;
let page: Page;
let problems: PageProblems;

async function open(name: string, body: string, viewport = { width: 1200, height: 900 }): Promise<Page> {
  page = await browser.newPage({ viewport });
  problems = watchProblems(page);
  await page.goto(server.page(`/${name}.html`, plainPage(body)));
  await elementsDefined(page);
  return page;
}

beforeAll(async () => {
  if (!existsSync('dist/elements/polewright-elements.js')) throw new Error('dist/elements/polewright-elements.js is missing: run npm run build first');
  server = await serveStatic('dist/elements');
  browser = await launchChromium();
});

afterEach(async () => {
  await page?.close();
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('pw- elements on a plain HTML page', () => {
  const sharedLoop = `
    <div class="grid">
      <pw-locus-plot id="plot-a" loop="belt" gain="1.2" model="${BELT}" style="height: 340px"></pw-locus-plot>
      <pw-locus-plot id="plot-b" loop="belt" theme="dark" style="height: 340px"></pw-locus-plot>
      <pw-gain-control id="gain" loop="belt"></pw-gain-control>
      <pw-stability-summary id="summary" loop="belt"></pw-stability-summary>
      <pw-step-plot id="step" loop="belt"></pw-step-plot>
      <pw-pole-table id="poles" loop="belt"></pw-pole-table>
    </div>`;

  it('render the plot, gain control, step response, pole table and summary without any framework on the page', async () => {
    await open('render', sharedLoop);
    // the page loads one script, the bundle, and nothing else
    expect(await page.evaluate(() => Array.from(document.scripts).filter((s) => s.src).map((s) => new URL(s.src).pathname))).toEqual(['/polewright-elements.js']);
    await expect.poll(() => inside(page, 'plot-a', 'path.pw-branch').count()).toBe(4);
    expect(await inside(page, 'plot-b', 'path.pw-branch').count()).toBe(4);
    expect(await inside(page, 'gain', 'input[type=range]').isEnabled()).toBe(true);
    expect(await inside(page, 'gain', 'input.field').inputValue()).toBe('1.2');
    expect(await inside(page, 'step', 'path.response').getAttribute('d')).toMatch(/^M/);
    expect(await inside(page, 'poles', 'tbody tr').count()).toBe(2);
    expect(await inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 1.2 — stable');
    expect(await inside(page, 'summary', '.caution').textContent()).toContain('Verify any gain on the real plant');
    await screenshot(page, 'elements-shared-loop');
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('follow attribute and property changes', async () => {
    await open('changes', sharedLoop);
    await expect.poll(() => inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 1.2 — stable');
    await page.locator('#step').evaluate((el) => el.setAttribute('gain', '3'));
    await expect.poll(() => inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 3 — stable');
    await page.locator('#poles').evaluate((el) => ((el as unknown as { gain: number }).gain = 25));
    await expect.poll(() => inside(page, 'summary', '.verdict').textContent()).toBe('At K = 25 the closed loop is not stable.');
    // a new model as an attribute, then as a property holding an object
    await page.locator('#plot-a').evaluate((el, m) => el.setAttribute('model', m), CUBIC);
    await expect.poll(() => inside(page, 'summary', '.ranges li').allTextContents()).toEqual(['0 < K < 6']);
    await page.locator('#plot-b').evaluate((el) => ((el as unknown as { model: unknown }).model = { numerator: [1], denominator: [1, 3, 2] }));
    await expect.poll(() => inside(page, 'summary', '.ranges li').allTextContents()).toEqual(['K > 0']);
    expect(await inside(page, 'plot-a', 'path.pw-branch').count()).toBe(2);
    // theme as a property is reflected to the attribute the styles key on
    await page.locator('#gain').evaluate((el) => ((el as unknown as { theme: string }).theme = 'dark'));
    await expect.poll(() => page.locator('#gain').getAttribute('theme')).toBe('dark');
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('send pw-gain-change to the page and keep two elements of one loop in step', async () => {
    await open('events', sharedLoop);
    await expect.poll(() => inside(page, 'plot-a', '.pw-area').getAttribute('aria-valuenow')).toBe('1.2');
    const field = inside(page, 'gain', 'input.field');
    await field.fill('4');
    await field.press('Enter');
    await expect.poll(() => inside(page, 'plot-b', '.pw-area').getAttribute('aria-valuenow')).toBe('4');
    expect(await inside(page, 'plot-a', '.pw-area').getAttribute('aria-valuenow')).toBe('4');
    expect(await inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 4 — stable');
    // both plots put the closed-loop markers at the same places (same size, same loop)
    const markers = (id: string) => inside(page, id, 'circle.pw-gain-marker').evaluateAll((els) => els.map((e) => `${e.getAttribute('cx')},${e.getAttribute('cy')}`));
    expect(await markers('plot-a')).toEqual(await markers('plot-b'));
    expect((await markers('plot-a')).length).toBe(4);
    const events = await recordedEvents(page);
    expect(events).toEqual([{ type: 'pw-gain-change', detail: { gain: 4, loop: 'belt' }, target: 'gain' }]);
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('take the gain back from the page through setGain after the user moved it', async () => {
    await open('set-gain', `<pw-gain-control id="gain" loop="reset" model="${CUBIC}"></pw-gain-control>
      <pw-pole-table id="poles" loop="reset"></pw-pole-table>`);
    await page.evaluate(() => Object.assign(document.getElementById('gain') as HTMLElement, { gain: 3 }));
    await expect.poll(() => inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 3 — stable');
    const field = inside(page, 'gain', 'input.field');
    await field.fill('5');
    await field.press('Enter');
    await expect.poll(() => inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 5 — stable');
    // the property already holds 3, so setting it again changes nothing (input semantics); setGain does
    await page.evaluate(() => Object.assign(document.getElementById('gain') as HTMLElement, { gain: 3 }));
    expect(await page.evaluate(() => (document.getElementById('gain') as HTMLElement & { setGain(k: number): boolean }).setGain(3))).toBe(true);
    await expect.poll(() => inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 3 — stable');
    expect(await field.inputValue()).toBe('3');
    const events = await recordedEvents(page);
    expect(events).toEqual([{ type: 'pw-gain-change', detail: { gain: 5, loop: 'reset' }, target: 'gain' }]);
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('work from the keyboard: Tab to the slider, arrows and End move the gain, the field takes a typed gain', async () => {
    await open('keyboard', `<pw-gain-control id="gain" loop="keys" model="${CUBIC}" gain="1"></pw-gain-control>
      <pw-pole-table id="poles" loop="keys"></pw-pole-table>`);
    await expect.poll(() => inside(page, 'gain', 'input.field').inputValue()).toBe('1');
    await page.keyboard.press('Tab'); // the number field comes first
    await page.keyboard.press('Tab');
    const slider = inside(page, 'gain', 'input[type=range]');
    expect(await slider.evaluate((el) => el.getRootNode() instanceof ShadowRoot && (el.getRootNode() as ShadowRoot).activeElement === el)).toBe(true);
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowRight');
    await expect.poll(async () => Number(await inside(page, 'gain', 'input.field').inputValue())).toBeGreaterThan(1);
    await page.keyboard.press('End');
    // End goes to the top of the slider: 30× the crossing gain K = 6, past the stable range
    await expect.poll(() => slider.getAttribute('aria-valuetext')).toBe('K = 180, not stable');
    expect(await inside(page, 'gain', 'input.field').inputValue()).toBe('180');
    await screenshot(page, 'elements-keyboard-focus');
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Control+A');
    await page.keyboard.type('2.5');
    await page.keyboard.press('Enter');
    await expect.poll(() => inside(page, 'poles', 'caption').textContent()).toBe('Closed-loop poles at K = 2.5 — stable');
    const events = await recordedEvents(page);
    expect(events.length).toBeGreaterThanOrEqual(4);
    expect(events.every((e) => e.type === 'pw-gain-change' && e.target === 'gain' && e.detail['loop'] === 'keys')).toBe(true);
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('refuse a typed gain that is not a number with a visible message at the field', async () => {
    await open('bad-gain', `<pw-gain-control id="gain" model="${CUBIC}" gain="2"></pw-gain-control>`);
    const field = inside(page, 'gain', 'input.field');
    await expect.poll(() => field.inputValue()).toBe('2');
    await field.fill('fast');
    await field.press('Enter');
    const message = inside(page, 'gain', '#field-message');
    await expect.poll(() => message.textContent()).toMatch(/not a number/);
    expect(await message.isVisible()).toBe(true);
    expect(await field.getAttribute('aria-invalid')).toBe('true');
    expect(await inside(page, 'gain', 'input[type=range]').getAttribute('aria-valuetext')).toBe('K = 2, stable');
    expect(await recordedEvents(page)).toEqual([]);
    await screenshot(page, 'elements-bad-gain');
  });

  it('show a bad model as a visible message in each element, send pw-load-error, and throw nothing', async () => {
    await open('bad-model', `
      <pw-step-plot id="improper" model="(s+1)^2/(s+3)"></pw-step-plot>
      <pw-stability-summary id="not-json" model='{"expression": '></pw-stability-summary>
      <pw-pole-table id="bad-field" model='{"numerator": [1, "x"], "denominator": [1, 2]}'></pw-pole-table>
      <pw-gain-control id="no-token" model-id="3f0c5a52-1f4e-4c55-9d43-8d7a2b1c0e11"></pw-gain-control>
      <pw-locus-plot id="bad-plot" model="s^3/(s+1" style="height: 240px"></pw-locus-plot>`);
    const improper = inside(page, 'improper', '.message.error');
    await expect.poll(() => improper.textContent()).toMatch(/Model not accepted: expression has degree 2, above the denominator's 1/);
    expect(await improper.isVisible()).toBe(true);
    expect(await inside(page, 'not-json', '.status.error').textContent()).toMatch(/not valid JSON/);
    expect(await inside(page, 'bad-field', '.status.error').textContent()).toMatch(/numerator › 1 must be a finite number/);
    expect(await inside(page, 'no-token', '.status.error').textContent()).toMatch(/token is missing/);
    expect(await page.locator('#bad-plot').evaluate((el) => el.shadowRoot?.textContent ?? '')).toMatch(/Model not accepted/);
    const events = await recordedEvents(page);
    expect(events.filter((e) => e.type === 'pw-load-error').map((e) => e.target).sort()).toEqual(['bad-field', 'bad-plot', 'improper', 'no-token', 'not-json']);
    await screenshot(page, 'elements-bad-model');
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('lay out the studio in two columns on a wide page and one on a narrow one', async () => {
    const studio = `<pw-loop-studio id="studio" gain="80" targets='{"minDampingRatio": 0.3}' model="(s+0.6)^2/(s^3*(s+4.5)*(s+11))"></pw-loop-studio>`;
    await open('studio-wide', studio);
    await expect.poll(() => page.locator('#studio').locator('pwl-pole-table tbody tr').count()).toBeGreaterThan(0);
    const box = (selector: string) => page.locator('#studio').locator(selector).boundingBox();
    const [plot, side] = [await box('pwl-locus-plot'), await box('.side')];
    expect(side!.x).toBeGreaterThan(plot!.x + plot!.width - 1);
    expect(await page.locator('#studio').locator('pwl-stability-summary .verdict').textContent()).toBe('At K = 80 the closed loop is stable.');
    await screenshot(page, 'elements-studio-wide');
    await page.close();
    await open('studio-narrow', studio, { width: 480, height: 900 });
    await expect.poll(() => page.locator('#studio').locator('pwl-pole-table tbody tr').count()).toBeGreaterThan(0);
    const [plotN, sideN] = [await box('pwl-locus-plot'), await box('.side')];
    expect(sideN!.y).toBeGreaterThan(plotN!.y + plotN!.height - 1);
    await screenshot(page, 'elements-studio-narrow');
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('serve the gallery page, whose plain script hears the elements events', async () => {
    page = await browser.newPage({ viewport: { width: 1280, height: 1000 } });
    problems = watchProblems(page);
    await page.goto(`${server.baseUrl}/index.html`);
    await elementsDefined(page);
    await expect.poll(() => inside(page, 'belt-plot-2', 'path.pw-branch').count()).toBe(4);
    await page.locator('#set-gain').click();
    await expect.poll(() => inside(page, 'belt-gain', 'input.field').inputValue()).toBe('2');
    const field = inside(page, 'belt-gain', 'input.field');
    await field.fill('3');
    await field.press('Enter');
    await expect.poll(() => page.locator('#event-log').textContent()).toMatch(/pw-gain-change {2}gain=3\.000 {2}loop=belt {2}from <pw-gain-control>/);
    expect(await page.locator('#event-log').textContent()).toMatch(/pw-load-error {2}Model not accepted/);
    await screenshot(page, 'elements-gallery');
    await page.locator('#theme-toggle').click();
    // a .pw-dark ancestor turns every element dark, the parts inside the studio included (--pw-bg #15191f)
    const background = (selector: string) => page.locator(selector).first().evaluate((el) => getComputedStyle(el).backgroundColor);
    await expect.poll(() => background('#belt-gain .control')).toBe('rgb(21, 25, 31)');
    expect(await background('#hoist-studio pwl-gain-control .control')).toBe('rgb(21, 25, 31)');
    expect(await background('#hoist-studio pwl-pole-table .frame')).toBe('rgb(21, 25, 31)');
    await screenshot(page, 'elements-gallery-dark');
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });
});
