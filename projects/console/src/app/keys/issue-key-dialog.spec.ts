import type { HttpTestingController } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { Component, inject } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDatepickerInputHarness } from '@angular/material/datepicker/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { problemBody, settle, setUpAdminScreen, tearDownAdminScreen } from '../testing/admin-fixtures';
import { daysFrom, endOfDay } from './expiry';
import { IssueKeyDialog } from './issue-key-dialog';

/** A host that opens the dialog and keeps what it closed with. */
@Component({ template: '' })
class Host {
  readonly dialog = inject(MatDialog);
  result: unknown = 'open';
  open(): void {
    this.dialog.open(IssueKeyDialog).afterClosed().subscribe((r) => (this.result = r));
  }
}

// harness steps each wait for the page to settle; on a busy machine a case takes several seconds
describe('IssueKeyDialog', { timeout: 30_000 }, () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<Host>;
  let loader: HarnessLoader;

  beforeEach(async () => {
    ({ http } = setUpAdminScreen());
    fixture = TestBed.createComponent(Host);
    loader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    fixture.componentInstance.open();
    await settle(fixture);
  });

  afterEach(() => tearDownAdminScreen(http));

  const field = async (label: RegExp) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const submit = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Issue key' }))).click();
  const text = () => document.querySelector('pwc-issue-key-dialog')?.textContent ?? '';

  it('sends nothing without a name and a scope, and says so at the fields', async () => {
    await submit();
    http.expectNone('/api/v1/api-keys');
    expect(await (await field(/Name/)).getTextErrors()).toEqual(['Required.']);
    expect(text()).toContain('Pick at least one scope.');

    // a name of spaces is no name either
    await (await (await field(/Name/)).getControl(MatInputHarness))!.setValue('   ');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: /Read models/ }))).check();
    await submit();
    http.expectNone('/api/v1/api-keys');
    expect(await (await field(/Name/)).getTextErrors()).toEqual(['Required.']);
    expect(text()).not.toContain('Pick at least one scope.');
  });

  it('explains each scope beside its checkbox', async () => {
    expect(text()).toContain('List, read and export models');
    expect(text()).toContain('Reading them needs "Read models" as well.');
    expect(text()).toContain('Compute pole paths, closed loops and design gain ranges');
  });

  it('sends the scopes in the API’s order and an expiry at the end of the preset day', async () => {
    await (await (await field(/Name/)).getControl(MatInputHarness))!.setValue('Dryer line export');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: /Compute/ }))).check();
    await (await loader.getHarness(MatCheckboxHarness.with({ label: /Read models/ }))).check();
    await (await loader.getHarness(MatButtonHarness.with({ text: '30 days' }))).click();
    await submit();
    const post = http.expectOne({ method: 'POST', url: '/api/v1/api-keys' });
    expect(post.request.body).toEqual({ name: 'Dryer line export', scopes: ['models:read', 'compute'], expiresAt: endOfDay(daysFrom(new Date(), 30)).toISOString() });
    post.flush({ id: 'k-1', name: 'Dryer line export', prefix: 'pwk_x', scopes: ['models:read', 'compute'], createdBy: 'u-ada', createdAt: '', expiresAt: null, revokedAt: null, lastUsedAt: null, secret: 'pwk_x' }, { status: 201, statusText: 'Created' });
    await settle(fixture);
    expect(fixture.componentInstance.result).toMatchObject({ id: 'k-1', secret: 'pwk_x' });
  });

  it('refuses an expiry day that is not in the future, and "No expiry" clears it', async () => {
    await (await (await field(/Name/)).getControl(MatInputHarness))!.setValue('Short-lived');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: /Compute/ }))).check();
    const today = new Date();
    const expiry = await loader.getHarness(MatDatepickerInputHarness);
    await expiry.setValue(`${today.getMonth() + 1}/${today.getDate()}/${today.getFullYear()}`);
    await expiry.blur();
    await submit();
    http.expectNone('/api/v1/api-keys');
    expect(await (await field(/Expires after/)).getTextErrors()).toEqual(['Pick a day after today: a key must expire in the future.']);

    await (await loader.getHarness(MatButtonHarness.with({ text: 'No expiry' }))).click();
    await submit();
    const post = http.expectOne({ method: 'POST', url: '/api/v1/api-keys' });
    expect(post.request.body).toEqual({ name: 'Short-lived', scopes: ['compute'] });
  });

  it('puts the API’s field errors at the fields and keeps the dialog open', async () => {
    await (await (await field(/Name/)).getControl(MatInputHarness))!.setValue('Clock skew');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: /Compute/ }))).check();
    await (await loader.getHarness(MatButtonHarness.with({ text: '30 days' }))).click();
    await submit();
    http.expectOne({ method: 'POST', url: '/api/v1/api-keys' }).flush(...problemBody(400, 'Invalid request', 'See errors.', [{ pointer: '/expiresAt', detail: 'must be in the future' }]));
    await settle(fixture);
    expect(await (await field(/Expires after/)).getTextErrors()).toEqual(['must be in the future']);
    expect(fixture.componentInstance.result).toBe('open');
  });
});
