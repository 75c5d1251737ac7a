import type { HttpTestingController } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { Component, inject } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { problemBody, settle, setUpAdminScreen, tearDownAdminScreen } from '../testing/admin-fixtures';
import { InviteDialog } from './invite-dialog';

@Component({ template: '' })
class Host {
  readonly dialog = inject(MatDialog);
  result: unknown = 'open';
  open(): void {
    this.dialog.open(InviteDialog).afterClosed().subscribe((r) => (this.result = r));
  }
}

// harness steps each wait for the page to settle; on a busy machine a case takes several seconds
describe('InviteDialog', { timeout: 30_000 }, () => {
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

  const field = (label: RegExp) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const type = async (label: RegExp, value: string) => (await (await field(label)).getControl(MatInputHarness))!.setValue(value);
  const send = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Send invitation' }))).click();

  it('checks the e-mail before sending', async () => {
    await send();
    expect(await (await field(/E-mail/)).getTextErrors()).toEqual(['Required.']);
    await type(/E-mail/, 'not an address');
    await send();
    expect(await (await field(/E-mail/)).getTextErrors()).toEqual(['Not an e-mail address.']);
    http.expectNone('/api/v1/users');
  });

  it('sends e-mail, role and name (name only when given), then says where it went and until when the link works', async () => {
    await type(/E-mail/, ' ines.intake@quillfield.example ');
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: /^viewer/ });
    await send();
    const post = http.expectOne({ method: 'POST', url: '/api/v1/users' });
    expect(post.request.body).toEqual({ email: 'ines.intake@quillfield.example', role: 'viewer' });
    post.flush(
      { user: { id: 'u-ines', email: 'ines.intake@quillfield.example', name: 'ines.intake', role: 'viewer', status: 'invited', createdAt: '', updatedAt: '' }, invitationExpiresAt: '2026-12-09T10:00:00.000Z' },
      { status: 201, statusText: 'Created' },
    );
    await settle(fixture);
    const text = document.querySelector('pwc-invite-dialog')?.textContent ?? '';
    expect(text).toContain('Invitation sent');
    expect(text).toContain('ines.intake@quillfield.example');
    expect(document.querySelector('[data-testid="invitation-expires"]')?.textContent).toMatch(/Dec 9, 2026/);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Done' }))).click();
    await settle(fixture);
    expect(fixture.componentInstance.result).toMatchObject({ invitationExpiresAt: '2026-12-09T10:00:00.000Z' });
  });

  it('includes a given name, and shows a taken e-mail (409) at the e-mail field', async () => {
    await type(/E-mail/, 'emil.engineer@quillfield.example');
    await type(/Name/, 'Emil again');
    await send();
    const post = http.expectOne({ method: 'POST', url: '/api/v1/users' });
    expect(post.request.body).toEqual({ email: 'emil.engineer@quillfield.example', role: 'engineer', name: 'Emil again' });
    post.flush(...problemBody(409, 'Conflict', 'A user with the e-mail emil.engineer@quillfield.example already exists.'));
    await settle(fixture);
    expect(await (await field(/E-mail/)).getTextErrors()).toEqual(['A user with the e-mail emil.engineer@quillfield.example already exists.']);
    expect(fixture.componentInstance.result).toBe('open');
  });
});
