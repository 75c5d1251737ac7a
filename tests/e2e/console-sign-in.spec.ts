import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleScreenshot, demoPerson, signIn, startConsole, type ConsoleRig, type DemoRole } from './support/console';

// The console in Chromium against the real server on a fresh database (demo seeded): signing in as each
// role, what each role's navigation offers, a wrong password, and signing out.
let rig: ConsoleRig;

beforeAll(async () => {
  rig = await startConsole();
});

afterAll(async () => {
  await rig?.close();
});

const NAVIGATION: Record<DemoRole, string[]> = {
  admin: ['Models', 'Import and export', 'Embed', 'API keys', 'People', 'Audit log', 'Mailbox'],
  engineer: ['Models', 'Import and export', 'Embed'],
  viewer: ['Models', 'Import and export', 'Embed'],
};

describe('console sign-in', () => {
  for (const role of ['admin', 'engineer', 'viewer'] as const) {
    it(`signs in as the demo ${role} and offers exactly that role's screens`, async () => {
      const { context, page, problems } = await rig.open();
      await signIn(page, rig.api.baseUrl, role);
      await expect.poll(() => page.locator('.person .name').textContent()).toBe(demoPerson(role).name);
      expect((await page.locator('.person .role').textContent())?.trim()).toBe(role);
      const entries = (await page.locator('nav[aria-label="Console"] a[mat-list-item] [matListItemTitle]').allTextContents()).map((t) => t.trim());
      const consoleEntries = entries.filter((t) => !['API reference', 'Embedding demo', 'Element gallery'].includes(t));
      expect(consoleEntries).toEqual(NAVIGATION[role]);
      await consoleScreenshot(page, `signed-in-${role}`);
      expect(problems.exceptions).toEqual([]);
      await context.close();
    });
  }

  it('shows the refusal of a wrong password at the form and stays signed out', async () => {
    const { context, page, problems } = await rig.open();
    await page.goto(`${rig.api.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(demoPerson('viewer').email);
    await page.getByLabel('Password', { exact: true }).fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.locator('.pwc-refusal').textContent(), { timeout: 10000 }).toMatch(/\S/);
    expect(await page.evaluate(() => localStorage.getItem('polewright.session'))).toBeNull();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await consoleScreenshot(page, 'sign-in-refused');
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('an admin screen sends a viewer to the "not for your role" page', async () => {
    const { context, page } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'viewer');
    await page.goto(`${rig.api.baseUrl}/keys`);
    await expect.poll(() => page.locator('pwc-not-allowed h1').textContent(), { timeout: 10000 }).toBe('Not for your role');
    await context.close();
  });

  it('signing out revokes the session: the old token is refused by the API', async () => {
    const { context, page } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'engineer');
    const token = await page.evaluate(() => localStorage.getItem('polewright.session'));
    expect(token).toMatch(/^pws_/);
    await page.locator('.person').click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await expect.poll(() => new URL(page.url()).pathname, { timeout: 10000 }).toBe('/sign-in');
    const me = await fetch(`${rig.api.baseUrl}/api/v1/me`, { headers: { Authorization: `Bearer ${token}` } });
    expect(me.status).toBe(401);
    await context.close();
  });
});
