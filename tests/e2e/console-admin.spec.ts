import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { callApi, consoleScreenshot as saveScreenshot, demoPerson, signIn, startConsole, type ConsoleRig } from './support/console';

// The admin screens of the console in Chromium against the real server on a fresh database (demo seeded,
// fake SMTP): an API key issued in the console works for a script until it is revoked in the console; a
// person invited in the console reads the e-mail in the Mailbox, signs up from its link and signs in; the
// audit log names the admin who issued and revoked the key.
let rig: ConsoleRig;

const KEY_NAME = 'Sorter line nightly check';
const INVITEE = { email: 'ines.intake@quillfield.example', name: 'Ines Intake', password: 'intake-conveyor-2026' };

beforeAll(async () => {
  rig = await startConsole();
});

afterAll(async () => {
  await rig?.close();
});

/** A screenshot once dialogs and ripples have finished moving (for the pictures only; nothing is timed). */
async function consoleScreenshot(page: Page, name: string): Promise<void> {
  await page.waitForTimeout(400);
  await saveScreenshot(page, name);
}

/** The admin's page, signed in once for the whole file (tests follow one another). */
let admin: { page: Page; exceptions: string[] };

async function adminPage(path: string): Promise<Page> {
  if (!admin) {
    const { page, problems } = await rig.open();
    await signIn(page, rig.api.baseUrl, 'admin', path);
    admin = { page, exceptions: problems.exceptions };
    return page;
  }
  await admin.page.goto(`${rig.api.baseUrl}${path}`);
  await admin.page.locator('pwc-shell').waitFor();
  return admin.page;
}

describe('console administration', () => {
  it('an admin issues a compute key; a script computes a locus with it until the admin revokes it', async () => {
    const page = await adminPage('/keys');
    await page.getByRole('button', { name: 'Issue key' }).click();
    const issue = page.locator('pwc-issue-key-dialog');
    await issue.getByLabel('Name').fill(KEY_NAME);
    await issue.getByRole('checkbox', { name: /Compute/ }).check();
    await issue.getByRole('button', { name: '90 days' }).click();
    await consoleScreenshot(page, 'admin-key-issue');
    await issue.getByRole('button', { name: 'Issue key' }).click();

    const secretField = page.locator('pwc-key-secret-dialog input[data-testid="key-secret"]');
    await secretField.waitFor();
    const secret = await secretField.inputValue();
    expect(secret).toMatch(/^pwk_/);
    // the dialog's ready-to-run example: the script below sends exactly its body
    const command = (await page.locator('pwc-key-secret-dialog pre').textContent()) ?? '';
    expect(command).toContain(`curl -X POST '${rig.api.baseUrl}/api/v1/locus'`);
    expect(command).toContain(`Authorization: Bearer ${secret}`);
    const exampleBody = JSON.parse(/-d '(.+)'/.exec(command)?.[1] ?? 'null') as unknown;
    await consoleScreenshot(page, 'admin-key-secret');
    // only the button closes it
    await page.keyboard.press('Escape');
    await page.mouse.click(8, 8);
    expect(await page.locator('pwc-key-secret-dialog').count()).toBe(1);
    await page.getByRole('button', { name: 'I have stored it' }).click();
    await expect.poll(() => page.locator('pwc-key-secret-dialog').count()).toBe(0);
    const row = page.locator('tr', { hasText: KEY_NAME });
    await expect.poll(() => row.locator('.pwc-status').textContent()).toBe('active');
    expect(await row.textContent()).toContain(demoPerson('admin').name);
    expect(await page.content()).not.toContain(secret);

    // a script uses the key
    const computed = await callApi(rig.api.baseUrl, '/locus', { method: 'POST', token: secret, body: exampleBody });
    expect(computed.status).toBe(200);
    expect(Array.isArray(computed.body['branches'])).toBe(true);

    // the admin revokes it in the console
    await page.reload();
    await row.waitFor();
    await expect.poll(() => row.locator('td').nth(6).textContent()).not.toContain('Not yet');
    await row.getByRole('button', { name: `Revoke the key ${KEY_NAME}` }).click();
    expect(await page.getByRole('alertdialog').textContent()).toContain(`Revoke the key “${KEY_NAME}”?`);
    await consoleScreenshot(page, 'admin-key-revoke');
    await page.getByRole('button', { name: 'Revoke key' }).click();
    await expect.poll(() => row.getAttribute('class')).toContain('revoked');
    expect(await row.locator('.pwc-status').textContent()).toBe('revoked');
    await consoleScreenshot(page, 'admin-keys');

    // the script is refused from now on
    const refused = await callApi(rig.api.baseUrl, '/locus', { method: 'POST', token: secret, body: exampleBody });
    expect(refused.status).toBe(401);
    expect(admin.exceptions).toEqual([]);
  });

  it('an admin invites an engineer; the invitation e-mail in the Mailbox leads to sign-up, then sign-in', async () => {
    const page = await adminPage('/people');
    await page.getByRole('button', { name: 'Invite a person' }).click();
    const invite = page.locator('pwc-invite-dialog');
    await invite.getByLabel('E-mail').fill(INVITEE.email);
    await invite.getByRole('combobox', { name: 'Role' }).click();
    await page.getByRole('option', { name: /^engineer/ }).click();
    await consoleScreenshot(page, 'admin-people-invite');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await expect.poll(() => invite.textContent()).toContain('Invitation sent');
    expect(await invite.textContent()).toContain(INVITEE.email);
    await consoleScreenshot(page, 'admin-people-invited');
    await invite.getByRole('button', { name: 'Done' }).click();
    const row = page.locator(`tr[data-user-email="${INVITEE.email}"]`);
    await expect.poll(() => row.locator('.pwc-status').textContent()).toBe('invited');
    await consoleScreenshot(page, 'admin-people');

    // the Mailbox shows the e-mail; its link points at this console's invitation page
    await page.getByRole('link', { name: 'Mailbox', exact: true }).click();
    const message = page.locator('.list a[mat-list-item]', { hasText: INVITEE.email });
    await message.first().click();
    await expect.poll(() => page.locator('#message-subject').textContent()).toBe('You are invited to Polewright');
    const href = await page.locator('[data-testid="mail-text"] a.invitation').getAttribute('href');
    expect(href).toMatch(/^\/invitations\/pwi_[A-Za-z0-9_-]+$/);
    await consoleScreenshot(page, 'admin-mailbox');
    // the API's copy of the same e-mail carries the same token
    const mailbox = await callApi(rig.api.baseUrl, '/dev/mailbox', { token: rig.api.tokens.admin });
    const mail = (mailbox.body['items'] as { to: string[]; text: string }[]).find((m) => m.to.includes(INVITEE.email));
    expect(mail?.text).toContain(href as string);

    // the invitee follows the link in their own browser
    const invitee = await rig.open({ width: 1024, height: 800 });
    await invitee.page.goto(`${rig.api.baseUrl}${href}`);
    await invitee.page.getByLabel('Name').first().fill(INVITEE.name);
    await invitee.page.getByLabel('Password', { exact: true }).fill(INVITEE.password);
    const repeat = invitee.page.getByLabel(/repeat|again|confirm/i);
    if ((await repeat.count()) > 0) await repeat.first().fill(INVITEE.password);
    await consoleScreenshot(invitee.page, 'admin-invitation-page');
    await invitee.page.getByRole('button', { name: /create|join|accept|sign up|set up/i }).click();
    await expect.poll(async () => (await callApi(rig.api.baseUrl, '/users?q=ines.intake', { token: rig.api.tokens.admin })).body['items'], { timeout: 15000 }).toMatchObject([{ email: INVITEE.email, status: 'active', name: INVITEE.name, role: 'engineer' }]);
    expect(invitee.problems.exceptions).toEqual([]);
    await invitee.context.close();

    // and signs in to the console as an engineer
    const fresh = await rig.open();
    await fresh.page.goto(`${rig.api.baseUrl}/sign-in`);
    await fresh.page.getByLabel('E-mail').fill(INVITEE.email);
    await fresh.page.getByLabel('Password', { exact: true }).fill(INVITEE.password);
    await fresh.page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => fresh.page.locator('.person .name').textContent(), { timeout: 15000 }).toBe(INVITEE.name);
    expect((await fresh.page.locator('.person .role').textContent())?.trim()).toBe('engineer');
    expect(fresh.problems.exceptions).toEqual([]);
    await fresh.context.close();

    // the People list shows them active now
    await page.goto(`${rig.api.baseUrl}/people`);
    await expect.poll(() => row.locator('.pwc-status').textContent()).toBe('active');
  });

  it('the audit log shows the key being issued and revoked, by the admin’s name', async () => {
    const page = await adminPage('/audit');
    await page.locator('input[formcontrolname="action"]').fill('api-key.');
    await expect.poll(() => new URL(page.url()).searchParams.get('action')).toBe('api-key.');
    await page.getByRole('combobox', { name: 'Person' }).click();
    await page.getByRole('option', { name: demoPerson('admin').name }).click();
    await expect.poll(() => new URL(page.url()).searchParams.get('actor')).toMatch(/\S/);

    const created = page.locator('tr[data-action="api-key.created"]');
    const revoked = page.locator('tr[data-action="api-key.revoked"]');
    await expect.poll(() => created.count()).toBe(1);
    await expect.poll(() => revoked.count()).toBe(1);
    for (const row of [created, revoked]) {
      const text = (await row.textContent()) ?? '';
      expect(text).toContain(demoPerson('admin').name);
      expect(text).toContain(`name: ${KEY_NAME}`);
    }
    // every row of the filtered page is an api-key event
    const actions = await page.locator('tr[data-action]').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-action')));
    expect(actions.length).toBeGreaterThanOrEqual(2);
    expect(actions.every((a) => a?.startsWith('api-key.'))).toBe(true);
    await created.getByRole('button', { name: /Show the full detail/ }).click();
    expect(JSON.parse((await page.locator('pre[id^="event-"]').textContent()) ?? '{}')).toMatchObject({ name: KEY_NAME, scopes: ['compute'] });
    await consoleScreenshot(page, 'admin-audit');

    // the filtered view is in the address: opening it afresh shows the same rows
    await page.goto(page.url());
    await expect.poll(() => page.locator('tr[data-action="api-key.revoked"]').count()).toBe(1);
    expect(await page.locator('input[formcontrolname="action"]').inputValue()).toBe('api-key.');
    expect(admin.exceptions).toEqual([]);
  });
});
