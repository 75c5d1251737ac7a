import type { HttpTestingController } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { flushDirectory, type NoticesSpy, settle, setUpAdminScreen, tearDownAdminScreen } from '../testing/admin-fixtures';
import { KeyList } from './key-list';
import type { ApiKey, ApiKeyCreated } from './keys-api';

const ACTIVE: ApiKey = { id: 'k-1', name: 'Belt line nightly', prefix: 'pwk_Ab3dEf9h', scopes: ['models:read', 'compute'], createdBy: 'u-ada', createdAt: '2026-11-20T09:00:00.000Z', expiresAt: null, revokedAt: null, lastUsedAt: '2026-12-01T06:00:00.000Z' };
const REVOKED: ApiKey = { ...ACTIVE, id: 'k-2', name: 'Old dryer export', prefix: 'pwk_Zz9yXx8w', createdBy: 'u-gone', revokedAt: '2026-11-25T10:00:00.000Z' };
const EXPIRED: ApiKey = { ...ACTIVE, id: 'k-3', name: 'Trial script', prefix: 'pwk_Qq1wEe2r', expiresAt: '2026-01-01T00:00:00.000Z' };
const SECRET = 'pwk_SeCrEt0nlyOnce_4f7a9c2e1b6d8h3k5m0p2r4t6v8x';

// harness steps each wait for the page to settle; on a busy machine a case takes several seconds
describe('KeyList', { timeout: 30_000 }, () => {
  let http: HttpTestingController;
  let notices: NoticesSpy;
  let fixture: ComponentFixture<KeyList>;
  let loader: HarnessLoader;

  async function open(keys: ApiKey[] = [ACTIVE, REVOKED, EXPIRED]): Promise<void> {
    fixture = TestBed.createComponent(KeyList);
    loader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    fixture.detectChanges();
    http.expectOne('/api/v1/api-keys').flush({ items: keys });
    flushDirectory(http);
    await settle(fixture);
  }

  function rowOf(id: string): HTMLElement {
    return fixture.nativeElement.querySelector(`tr[data-key-id="${id}"]`) as HTMLElement;
  }

  beforeEach(() => {
    ({ http, notices } = setUpAdminScreen());
  });

  afterEach(() => tearDownAdminScreen(http));

  it('lists every key with its issuer’s name and its status; revoked keys stay, greyed, without a revoke button', async () => {
    await open();
    const active = rowOf('k-1');
    expect(active.textContent).toContain('Belt line nightly');
    expect(active.textContent).toContain('pwk_Ab3dEf9h…');
    expect(active.textContent).toContain('Ada Brennholt');
    expect(active.textContent).toContain('Never');
    expect(active.querySelector('.pwc-status')?.textContent?.trim()).toBe('active');
    expect(active.querySelector('button.revoke')).not.toBeNull();

    const revoked = rowOf('k-2');
    expect(revoked.classList).toContain('revoked');
    expect(revoked.querySelector('.pwc-status')?.textContent?.trim()).toBe('revoked');
    expect(revoked.querySelector('button.revoke')).toBeNull();
    // an issuer no longer in the team still gets a readable label
    expect(revoked.textContent).toContain('Unknown person (u-gone)');

    expect(rowOf('k-3').querySelector('.pwc-status')?.textContent?.trim()).toBe('expired');
  });

  it('issues a key, shows its secret once in a dialog that only closes on purpose, and never lists the secret', async () => {
    await open([]);
    expect(fixture.nativeElement.textContent).toContain('No API keys yet');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Issue key/ }))).click();
    const issue = await loader.getHarness(MatDialogHarness);
    await (await (await issue.getHarness(MatFormFieldHarness.with({ floatingLabelText: /Name/ }))).getControl(MatInputHarness))!.setValue('  Belt line nightly  ');
    await (await issue.getHarness(MatCheckboxHarness.with({ label: /Compute/ }))).check();
    await (await issue.getHarness(MatButtonHarness.with({ text: 'Issue key' }))).click();

    const post = http.expectOne({ method: 'POST', url: '/api/v1/api-keys' });
    expect(post.request.body).toEqual({ name: 'Belt line nightly', scopes: ['compute'] });
    const created: ApiKeyCreated = { ...ACTIVE, id: 'k-9', name: 'Belt line nightly', scopes: ['compute'], lastUsedAt: null, secret: SECRET };
    post.flush(created, { status: 201, statusText: 'Created' });
    await settle(fixture);

    const secretInput = document.querySelector<HTMLInputElement>('pwc-key-secret-dialog input[data-testid="key-secret"]');
    expect(secretInput?.value).toBe(SECRET);
    expect(secretInput?.readOnly).toBe(true);
    const dialogText = document.querySelector('pwc-key-secret-dialog')?.textContent ?? '';
    expect(dialogText).toContain('This is the only time the key is shown.');
    expect(dialogText).toContain(`curl -X POST '${location.origin}/api/v1/locus'`);
    expect(dialogText).toContain(`Bearer ${SECRET}`);
    // the list behind it has the new key, without its secret
    expect(fixture.nativeElement.textContent).toContain('Belt line nightly');
    expect(fixture.nativeElement.textContent).not.toContain(SECRET);

    // neither a click outside nor Escape closes it
    (document.querySelector('.cdk-overlay-backdrop') as HTMLElement).click();
    const secretDialog = await loader.getHarness(MatDialogHarness);
    await secretDialog.close();
    await settle(fixture);
    expect(document.querySelector('pwc-key-secret-dialog')).not.toBeNull();

    await (await secretDialog.getHarness(MatButtonHarness.with({ text: 'I have stored it' }))).click();
    await settle(fixture);
    http.expectOne('/api/v1/api-keys').flush({ items: [{ ...ACTIVE, id: 'k-9', name: 'Belt line nightly', scopes: ['compute'] }] });
    flushDirectory(http);
    await settle(fixture);
    expect(document.querySelector('pwc-key-secret-dialog')).toBeNull();
    expect(document.body.textContent).not.toContain(SECRET);
    expect(rowOf('k-9').textContent).toContain('Belt line nightly');
  });

  it('revokes after a confirmation that names the key, then lists it as revoked', async () => {
    await open([ACTIVE]);
    await (await loader.getHarness(MatButtonHarness.with({ selector: '.revoke' }))).click();
    const confirm = await loader.getHarness(MatDialogHarness);
    expect(await confirm.getTitleText()).toBe('Revoke the key “Belt line nightly”?');
    expect(await confirm.getContentText()).toContain('pwk_Ab3dEf9h…');

    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    await settle(fixture);
    http.expectNone({ method: 'DELETE', url: '/api/v1/api-keys/k-1' });

    await (await loader.getHarness(MatButtonHarness.with({ selector: '.revoke' }))).click();
    await (await (await loader.getHarness(MatDialogHarness)).getHarness(MatButtonHarness.with({ text: 'Revoke key' }))).click();
    await settle(fixture);
    http.expectOne({ method: 'DELETE', url: '/api/v1/api-keys/k-1' }).flush(null, { status: 204, statusText: 'No Content' });
    await settle(fixture);
    http.expectOne('/api/v1/api-keys').flush({ items: [{ ...ACTIVE, revokedAt: '2026-12-02T10:00:00.000Z' }] });
    flushDirectory(http);
    await settle(fixture);
    expect(notices.done).toHaveBeenCalledWith('Key “Belt line nightly” revoked');
    expect(rowOf('k-1').classList).toContain('revoked');
    expect(rowOf('k-1').querySelector('button.revoke')).toBeNull();
  });
});
