import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { callApi, consoleScreenshot, startConsole, type ConsoleRig } from './support/console';

// The link of an invitation e-mail, followed in Chromium: the console's page at /invitations/<token>
// against the real server (fresh database, the fake SMTP capture, a movable clock for expiry).
const LOAD = { timeout: 20000, interval: 200 };
const EMAIL = 'ines.intake@quillfield.example';
const PASSWORD = 'intake-conveyor-2026';

let rig: ConsoleRig;
// how far the server's clock runs ahead of the real one (to let an invitation expire)
let ahead = 0;

beforeAll(async () => {
  rig = await startConsole({ clock: () => new Date(Date.now() + ahead) });
});

afterAll(async () => {
  await rig?.close();
});

/** Invites a person as the demo admin and returns the e-mail's link, moved onto the test server. */
async function invite(email: string, role: 'engineer' | 'viewer', name?: string): Promise<string> {
  const invited = await callApi(rig.api.baseUrl, '/users', { method: 'POST', token: rig.api.tokens.admin, body: { email, role, ...(name ? { name } : {}) } });
  expect(invited.status).toBe(201);
  const mailbox = await callApi(rig.api.baseUrl, '/dev/mailbox', { token: rig.api.tokens.admin });
  const mail = (mailbox.body['items'] as { to: string[]; text: string }[]).find((m) => m.to.includes(email));
  // the e-mail points at PUBLIC_URL/invitations/<token>
  const link = /(https?:\/\/\S+\/invitations\/pwi_[A-Za-z0-9_-]+)/.exec(mail?.text ?? '')?.[1] as string;
  expect(new URL(link).origin).toBe(rig.api.config.publicUrl);
  return new URL(new URL(link).pathname, rig.api.baseUrl).href;
}

const heading = (page: Page) => page.locator('pwc-invitation h1').textContent();
const errorAt = (page: Page, label: string) => page.locator('mat-form-field', { has: page.getByLabel(label, { exact: true }) }).locator('mat-error').textContent();

describe('console invitation page', () => {
  let link: string;

  it('an invited person picks name and password, sees field errors first, and is signed in', async () => {
    link = await invite(EMAIL, 'engineer', 'Ines');
    const { context, page, problems } = await rig.open({ width: 900, height: 900 });
    await page.goto(link);
    await expect.poll(() => heading(page), LOAD).toBe('Join Polewright');
    expect(await page.title()).toBe('Join your team · Polewright');
    expect(await page.locator('.email').textContent()).toBe(EMAIL);
    expect(await page.locator('.role').textContent()).toBe('engineer');
    expect(await page.getByLabel('Your name').inputValue()).toBe('Ines');
    await consoleScreenshot(page, 'invitation-open');

    // checked on the page: nothing is sent
    const accepts: string[] = [];
    page.on('request', (r) => {
      if (r.url().endsWith('/accept')) accepts.push(r.method());
    });
    await page.getByLabel('Password', { exact: true }).fill('short');
    await page.getByLabel('Repeat the password').fill('shorter');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await expect.poll(() => errorAt(page, 'Password')).toBe('At least 10 characters.');
    expect(await errorAt(page, 'Repeat the password')).toBe('The two passwords differ.');
    expect(accepts).toEqual([]);

    // the API's field error lands at its field (a name of blanks is empty once trimmed)
    await page.getByLabel('Your name').fill('   ');
    await page.getByLabel('Password', { exact: true }).fill(PASSWORD);
    await page.getByLabel('Repeat the password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Create my account' }).click();
    await expect.poll(() => errorAt(page, 'Your name'), LOAD).toMatch(/\S/);
    expect(accepts).toEqual(['POST']);
    const waiting = (await rig.api.context.dataSource.query('SELECT status FROM users WHERE email = ?', [EMAIL])) as { status: string }[];
    expect(waiting[0]?.status).toBe('invited');
    // let the message's fade-in finish before the picture
    await page.waitForTimeout(400);
    await consoleScreenshot(page, 'invitation-field-errors');

    // a good name: signed in, on the models, welcomed
    await page.getByLabel('Your name').fill('Ines Intake');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await expect.poll(() => new URL(page.url()).pathname, LOAD).toBe('/models');
    await expect.poll(() => page.locator('pwc-shell .person .name').textContent(), LOAD).toBe('Ines Intake');
    expect(await page.locator('mat-snack-bar-container').textContent()).toContain('Welcome to Polewright, Ines Intake: you are signed in as engineer.');
    const token = await page.evaluate(() => localStorage.getItem('polewright.session'));
    const me = await callApi(rig.api.baseUrl, '/me', { token: token as string });
    expect(me.body['user']).toMatchObject({ email: EMAIL, name: 'Ines Intake', role: 'engineer', status: 'active' });
    await consoleScreenshot(page, 'invitation-signed-in');
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('the same link opened again says the invitation is used and offers to sign in', async () => {
    expect(link).toBeDefined();
    const { context, page, problems } = await rig.open({ width: 900, height: 900 });
    await page.goto(link);
    await expect.poll(() => heading(page), LOAD).toBe('This invitation has been used');
    expect(await page.locator('form').count()).toBe(0);
    await page.getByRole('link', { name: 'Sign in' }).click();
    await expect.poll(() => new URL(page.url()).pathname).toBe('/sign-in');
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('a link no invitation has says so', async () => {
    const { context, page, problems } = await rig.open({ width: 900, height: 900 });
    await page.goto(`${rig.api.baseUrl}/invitations/pwi_nobody-was-invited-with-this`);
    await expect.poll(() => heading(page), LOAD).toBe('Invitation not found');
    expect(await page.locator('.text').textContent()).toContain('does not lead to any invitation');
    await consoleScreenshot(page, 'invitation-unknown');
    expect(problems.exceptions).toEqual([]);
    await context.close();
  });

  it('an expired invitation sends its holder to their administrator', async () => {
    const late = await invite('otto.outfeed@quillfield.example', 'viewer');
    ahead = (rig.api.config.invitationTtlSeconds + 60) * 1000;
    try {
      const { context, page, problems } = await rig.open({ width: 900, height: 900 });
      await page.goto(late);
      await expect.poll(() => heading(page), LOAD).toBe('This invitation has expired');
      expect(await page.locator('.text').textContent()).toContain('Ask your administrator for a new invitation.');
      expect(await page.locator('form').count()).toBe(0);
      await consoleScreenshot(page, 'invitation-expired');
      expect(problems.exceptions).toEqual([]);
      await context.close();
    } finally {
      ahead = 0;
    }
  });
});
