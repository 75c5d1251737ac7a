import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Locator, Page } from 'playwright-core';

/** Where the browser tests write their screenshots (look at them). */
export const SCREENSHOTS = 'test-artifacts/screenshots';

/** Every tag of the bundle. */
export const TAGS = ['pw-locus-plot', 'pw-gain-control', 'pw-step-plot', 'pw-pole-table', 'pw-stability-summary', 'pw-loop-studio'];

/**
 * A plain HTML page (no framework) that loads the element bundle from the server root, records every
 * pw- event on `window.pwEvents`, and holds `body`.
 */
export function plainPage(body: string, title = 'Polewright elements test'): string {
  return `<!doctype html>
<html lang="en">
  <head>
    <meta charset="utf-8" />
    <title>${title}</title>
    <link rel="icon" href="data:," />
    <link rel="stylesheet" href="/polewright-elements.css" />
    <script>
      window.pwEvents = [];
      for (const type of ['pw-gain-change', 'pw-pole-pick', 'pw-model-edit', 'pw-load-error']) {
        document.addEventListener(type, (e) => window.pwEvents.push({ type, detail: e.detail, target: e.target.id || e.target.localName }));
      }
    </script>
    <script type="module" src="/polewright-elements.js"></script>
    <style>body { margin: 16px; font-family: sans-serif; } .grid { display: grid; grid-template-columns: 1fr 1fr; gap: 12px; }</style>
  </head>
  <body>
${body}
  </body>
</html>`;
}

/** Waits until every custom element of the bundle is defined (at most 20 s, then says which are missing). */
export async function elementsDefined(page: Page): Promise<void> {
  const missing = await page.evaluate(
    (tags) =>
      Promise.race([
        Promise.all(tags.map((t) => customElements.whenDefined(t))).then(() => []),
        new Promise<string[]>((done) => setTimeout(() => done(tags.filter((t) => !customElements.get(t))), 20000)),
      ]),
    TAGS,
  );
  if (missing.length) throw new Error(`custom elements not defined after 20 s: ${missing.join(', ')} (is dist/elements built?)`);
}

/** A selector inside an element's shadow root (Playwright's CSS engine pierces open shadow roots). */
export function inside(page: Page, hostId: string, selector: string): Locator {
  return page.locator(`#${hostId}`).locator(selector);
}

/** The events recorded on the page so far. */
export function recordedEvents(page: Page): Promise<{ type: string; detail: Record<string, unknown>; target: string }[]> {
  return page.evaluate(() => (window as unknown as { pwEvents: never[] }).pwEvents);
}

/** Writes a full-page screenshot to test-artifacts/screenshots/<name>.png. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOTS, { recursive: true });
  const path = join(SCREENSHOTS, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}
