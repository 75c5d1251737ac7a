import type { Browser, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../../server/src/testing/test-server';
import { launchChromium, watchProblems, type PageProblems } from './support/chromium';
import { screenshot } from './support/elements-page';

// The link of an invitation e-mail, followed in Chromium: the server's plain page at /invitations/<token>
// (server/public/invitation/) against the real API (a fresh SQLite file, real HTTP, the fake SMTP capture).
let api: TestServer;
let browser: Browser;
let page: Page;
let problems: PageProblems;

const EMAIL = 'ines.intake@quillfield.example';
const PASSWORD = 'intake-conveyor-2026';

async function call(path: string, init: { method?: string; token?: string; body?: unknown }): Promise<{ status: number; body: Record<string, unknown> }> {
  const headers: Record<string, string> = { 'Content-Type': 'application/json' };
  if (init.token) headers['Authorization'] = `Bearer ${init.token}`;
  const response = await fetch(`${api.baseUrl}/api/v1${path}`, { method: init.method ?? 'GET', headers, body: init.body === undefined ? undefined : JSON.stringify(init.body) });
  return { status: response.status, body: (await response.json()) as Record<string, unknown> };
}

/** The link of the captured invitation e-mail, moved onto the test server (PUBLIC_URL is not its port). */
async function invitationLink(email: string): Promise<string> {
  const mailbox = await call('/dev/mailbox', { token: api.tokens.admin });
  expect(mailbox.status).toBe(200);
  const mail = (mailbox.body['items'] as { to: string[]; text: string }[]).find((m) => m.to.includes(email));
  const link = /(https?:\/\/\S+\/invitations\/pwi_[A-Za-z0-9_-]+)/.exec(mail?.text ?? '')?.[1];
  expect(link).toBeDefined();
  const url = new URL(link as string);
  expect(url.origin).toBe(api.config.publicUrl);
  return new URL(url.pathname, api.baseUrl).href;
}

async function openPage(url: string): Promise<void> {
  page = await browser.newPage({ viewport: { width: 900, height: 900 } });
  problems = watchProblems(page);
  const response = await page.goto(url);
  expect(response?.status()).toBe(200);
  await page.waitForLoadState('load');
}

/** Console errors other than Chromium's own line about an API refusal the page handled (status given). */
function unexpectedConsoleErrors(...statuses: number[]): string[] {
  return problems.consoleErrors.filter((text) => !statuses.some((status) => text.includes(`Failed to load resource: the server responded with a status of ${status}`)));
}

beforeAll(async () => {
  api = await startTestServer();
  browser = await launchChromium();
});

afterEach(async () => {
  await page?.close();
});

afterAll(async () => {
  await browser?.close();
  await api?.close();
});

describe('the invitation page', () => {
  let link: string;

  it('an invited person sets name and password from the e-mail link, with messages at the fields first', async () => {
    const invited = await call('/users', { method: 'POST', token: api.tokens.admin, body: { email: EMAIL, role: 'engineer' } });
    expect(invited.status).toBe(201);
    link = await invitationLink(EMAIL);
    await openPage(link);
    const accepts: string[] = [];
    page.on('request', (r) => {
      if (r.url().endsWith('/accept')) accepts.push(r.method());
    });
    expect(await page.title()).toBe('Set up your Polewright account');
    await screenshot(page, 'invitation-form');

    // 1. no name and two different passwords: checked on the page, nothing is sent
    await page.getByLabel('Password', { exact: true }).fill('intake-conveyor-2026');
    await page.getByLabel('Repeat the password').fill('intake-conveyor-2025');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await expect.poll(() => page.locator('#confirmation-error').textContent()).toBe('The two passwords do not match.');
    expect(await page.locator('#name-error').textContent()).toBe('Enter your name.');
    expect(await page.getByLabel('Your name').getAttribute('aria-invalid')).toBe('true');
    expect(await page.getByLabel('Repeat the password').getAttribute('aria-invalid')).toBe('true');
    expect(await page.getByLabel('Password', { exact: true }).getAttribute('aria-invalid')).toBeNull();
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('name');
    expect(accepts).toEqual([]);
    await screenshot(page, 'invitation-mismatch');

    // 2. a password shorter than the document's minimum (10): the API's 400 lands at the password field
    await page.getByLabel('Your name').fill('Ines Intake');
    await page.getByLabel('Password', { exact: true }).fill('short');
    await page.getByLabel('Repeat the password').fill('short');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await expect.poll(() => page.locator('#password-error').textContent()).toBe('Must not have fewer than 10 characters.');
    expect(accepts).toEqual(['POST']);
    expect(await page.getByLabel('Password', { exact: true }).getAttribute('aria-invalid')).toBe('true');
    expect(await page.locator('#name-error').textContent()).toBe('');
    expect(await page.locator('#confirmation-error').textContent()).toBe('');
    expect(await page.locator('#notice-title').textContent()).toBe('The request is not valid');
    // the account is still waiting
    const waiting = (await api.context.dataSource.query('SELECT status FROM users WHERE email = ?', [EMAIL])) as { status: string }[];
    expect(waiting[0]?.status).toBe('invited');
    await screenshot(page, 'invitation-field-errors');

    // 3. a good password: the account is ready, and the page says how to sign in
    await page.getByLabel('Password', { exact: true }).fill(PASSWORD);
    await page.getByLabel('Repeat the password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Create my account' }).click();
    await expect.poll(() => page.locator('#ready').isVisible()).toBe(true);
    expect(await page.locator('#ready-title').textContent()).toBe('Your account is ready');
    expect(await page.locator('#ready-email').textContent()).toBe(EMAIL);
    expect(await page.locator('#ready').textContent()).toContain('POST /api/v1/sessions');
    expect(await page.locator('#ready a[href="../elements/"]').count()).toBe(1);
    expect(await page.locator('#accept-form').isVisible()).toBe(false);
    await screenshot(page, 'invitation-ready');
    expect(problems.exceptions).toEqual([]);
    expect(unexpectedConsoleErrors(400)).toEqual([]);

    // the new password signs in through the API (the contract answers 201 with a session)
    const session = await call('/sessions', { method: 'POST', body: { email: EMAIL, password: PASSWORD } });
    expect(session.status).toBe(201);
    expect(session.body['user']).toMatchObject({ email: EMAIL, name: 'Ines Intake', role: 'engineer', status: 'active' });
    const me = await call('/me', { token: String(session.body['token']) });
    expect(me.status).toBe(200);
  });

  it('the same link opened again says the invitation is used, without a form', async () => {
    expect(link).toBeDefined();
    await openPage(link);
    await expect.poll(() => page.locator('#notice').isVisible()).toBe(true);
    expect(await page.locator('#notice-title').textContent()).toBe('This invitation has been used already.');
    expect(await page.locator('#accept-form').isVisible()).toBe(false);
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('notice');
    await screenshot(page, 'invitation-used');
    // the API agrees
    const again = await call(`/invitations/${new URL(link).pathname.split('/').pop()}/accept`, { method: 'POST', body: { name: 'Ines Intake', password: PASSWORD } });
    expect(again.status).toBe(409);
    expect(problems).toEqual({ exceptions: [], consoleErrors: [] });
  });

  it('a link whose invitation disappeared after the page opened shows the API title and detail at the top', async () => {
    await call('/users', { method: 'POST', token: api.tokens.admin, body: { email: 'otto.outfeed@quillfield.example', role: 'viewer' } });
    const other = await invitationLink('otto.outfeed@quillfield.example');
    await openPage(other);
    // an admin's direct database change stands in for the invitation being withdrawn while the page is open
    await api.context.dataSource.query("DELETE FROM invitations WHERE user_id = (SELECT id FROM users WHERE email = 'otto.outfeed@quillfield.example')");
    await page.getByLabel('Your name').fill('Otto Outfeed');
    await page.getByLabel('Password', { exact: true }).fill('outfeed-belt-2026');
    await page.getByLabel('Repeat the password').fill('outfeed-belt-2026');
    await page.getByRole('button', { name: 'Create my account' }).click();
    await expect.poll(() => page.locator('#notice').isVisible()).toBe(true);
    expect(await page.locator('#notice-title').textContent()).toBe('Not found');
    expect(await page.locator('#notice-detail').textContent()).toBe('The invitation was not found');
    expect(await page.locator('#accept-form').isVisible()).toBe(false);
    await screenshot(page, 'invitation-unknown');
    expect(problems.exceptions).toEqual([]);
    expect(unexpectedConsoleErrors(404)).toEqual([]);
  });
});
