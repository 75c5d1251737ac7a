import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { expect } from 'vitest';
import { DEMO_PEOPLE } from '../../../server/src/seed/demo-people';
import { startTestServer, type TestServer, type TestServerOptions } from '../../../server/src/testing/test-server';
import { launchChromium, watchProblems, type PageProblems } from './chromium';
import { SCREENSHOTS } from './elements-page';

/** A demo role of the seeded invented company (server/src/seed/demo-people.ts). */
export type DemoRole = 'admin' | 'engineer' | 'viewer';

/** A running console: the real server on a fresh SQLite file (demo seeded) serving dist/console, and Chromium. */
export interface ConsoleRig {
  readonly api: TestServer;
  readonly browser: Browser;
  /** A new browser context (its own localStorage) with a page at the console's size, problems recorded. */
  open(options?: { width?: number; height?: number }): Promise<{ context: BrowserContext; page: Page; problems: PageProblems }>;
  close(): Promise<void>;
}

/** The demo person of a role: e-mail, name and password. */
export function demoPerson(role: DemoRole): { email: string; name: string; password: string } {
  const person = DEMO_PEOPLE.find((p) => p.role === role);
  if (!person) throw new Error(`no demo person with role ${role}`);
  return person;
}

/** Starts the server (which serves the built console at `/`) and Chromium. Build the console first. */
export async function startConsole(options: TestServerOptions = {}): Promise<ConsoleRig> {
  if (!existsSync('dist/console/browser/index.html')) throw new Error('dist/console is missing: run npm run build (or npm run build:console) first');
  const api = await startTestServer(options);
  const browser = await launchChromium();
  return {
    api,
    browser,
    async open({ width = 1366, height = 900 } = {}) {
      const context = await browser.newContext({ viewport: { width, height } });
      const page = await context.newPage();
      return { context, page, problems: watchProblems(page) };
    },
    async close() {
      await browser.close();
      await api.close();
    },
  };
}

/** Signs in through the sign-in page as a demo role and waits for the signed-in shell. */
export async function signIn(page: Page, baseUrl: string, role: DemoRole, path = '/models'): Promise<void> {
  const person = demoPerson(role);
  await page.goto(`${baseUrl}/sign-in?returnUrl=${encodeURIComponent(path)}`);
  await page.getByLabel('E-mail').fill(person.email);
  await page.getByLabel('Password', { exact: true }).fill(person.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect.poll(() => page.locator('pwc-shell').count(), { timeout: 15000 }).toBe(1);
  await expect.poll(() => new URL(page.url()).pathname, { timeout: 15000 }).toBe(path.split('?')[0]);
}

/** Saves a full-page screenshot of the console to test-artifacts/screenshots/console-<name>.png. */
export async function consoleScreenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOTS, { recursive: true });
  const file = join(SCREENSHOTS, `console-${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Calls the REST API directly (as a script would), with a bearer token. */
export async function callApi(baseUrl: string, path: string, init: { method?: string; token?: string; body?: unknown } = {}): Promise<{ status: number; body: Record<string, unknown> }> {
  const headers: Record<string, string> = { 'Content-Type': 'application/json' };
  if (init.token) headers['Authorization'] = `Bearer ${init.token}`;
  const response = await fetch(`${baseUrl}/api/v1${path}`, { method: init.method ?? 'GET', headers, body: init.body === undefined ? undefined : JSON.stringify(init.body) });
  const text = await response.text();
  return { status: response.status, body: text ? (JSON.parse(text) as Record<string, unknown>) : {} };
}
