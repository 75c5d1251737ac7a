import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHeaderHarness } from '@angular/material/sort/testing';
import type { User } from '../api/api-types';
import { ADA, EMIL, type NoticesSpy, problemBody, settle, setUpAdminScreen, VERA, tearDownAdminScreen } from '../testing/admin-fixtures';
import { PeopleList } from './people-list';

const OLGA: User = { ...EMIL, id: 'u-olga', email: 'olga.ops@quillfield.example', name: 'Olga Ostrander', role: 'admin' };

// harness steps each wait for the page to settle; on a busy machine a case takes several seconds
describe('PeopleList', { timeout: 30_000 }, () => {
  let http: HttpTestingController;
  let notices: NoticesSpy;
  let fixture: ComponentFixture<PeopleList>;
  let loader: HarnessLoader;

  function expectList(): TestRequest {
    return http.expectOne((r) => r.url === '/api/v1/users' && r.method === 'GET');
  }

  async function open(people: User[] = [ADA, OLGA, EMIL, VERA]): Promise<void> {
    fixture = TestBed.createComponent(PeopleList);
    loader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    await settle(fixture);
    const first = expectList();
    expect(first.request.params.toString()).toBe('sort=name&order=asc&page=1&pageSize=25');
    first.flush({ items: people, total: people.length, page: 1, pageSize: 25 });
    await settle(fixture);
  }

  const row = (email: string) => fixture.nativeElement.querySelector(`tr[data-user-email="${email}"]`) as HTMLElement;
  const roleSelect = (name: string) => loader.getHarness(MatSelectHarness.with({ selector: `[aria-label="Role of ${name}"]` }));

  beforeEach(() => {
    ({ http, notices } = setUpAdminScreen());
  });

  afterEach(() => tearDownAdminScreen(http));

  it('sends search, filters, sort and page to the API and starts again at the first page', async () => {
    await open();
    await (await loader.getHarness(MatInputHarness.with({ placeholder: 'Name or e-mail' }))).setValue('  quill ');
    await new Promise((resolve) => setTimeout(resolve, 350)); // the search waits for typing to settle
    await settle(fixture);
    const searched = expectList();
    expect(searched.request.params.get('q')).toBe('quill');
    searched.flush({ items: [ADA, EMIL, VERA], total: 3, page: 1, pageSize: 25 });

    await (await loader.getHarness(MatSelectHarness.with({ selector: '[formcontrolname="role"]' }))).clickOptions({ text: 'engineer' });
    await settle(fixture);
    const byRole = expectList();
    expect(byRole.request.params.get('role')).toBe('engineer');
    byRole.flush({ items: [EMIL], total: 1, page: 1, pageSize: 25 });

    await (await loader.getHarness(MatSelectHarness.with({ selector: '[formcontrolname="status"]' }))).clickOptions({ text: 'Deactivated' });
    await settle(fixture);
    const byStatus = expectList();
    expect(byStatus.request.params.get('status')).toBe('deactivated');
    byStatus.flush({ items: [], total: 0, page: 1, pageSize: 25 });
    await settle(fixture);
    expect(fixture.nativeElement.textContent).toContain('Nobody matches these filters.');

    await (await loader.getHarness(MatSortHeaderHarness.with({ label: 'Since' }))).click();
    await settle(fixture);
    const sorted = expectList();
    expect(sorted.request.params.get('sort')).toBe('createdAt');
    expect(sorted.request.params.get('order')).toBe('desc');
    expect(sorted.request.params.get('page')).toBe('1');
    sorted.flush({ items: [], total: 0, page: 1, pageSize: 25 });
  });

  it('changes a role at once, but asks before taking admin rights, and puts the select back on Cancel', async () => {
    await open();
    await (await roleSelect('Vera Osei-Marsh')).clickOptions({ text: 'engineer' });
    await settle(fixture);
    const promote = http.expectOne({ method: 'PATCH', url: '/api/v1/users/u-vera' });
    expect(promote.request.body).toEqual({ role: 'engineer' });
    promote.flush({ ...VERA, role: 'engineer' });
    await settle(fixture);
    expect(notices.done).toHaveBeenCalledWith('Vera Osei-Marsh is now engineer');

    await (await roleSelect('Olga Ostrander')).clickOptions({ text: 'viewer' });
    await settle(fixture);
    const confirm = await loader.getHarness(MatDialogHarness);
    expect(await confirm.getTitleText()).toBe('Take admin rights from Olga Ostrander?');
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    await settle(fixture);
    http.expectNone({ method: 'PATCH', url: '/api/v1/users/u-olga' });
    expect(await (await roleSelect('Olga Ostrander')).getValueText()).toBe('admin');

    await (await roleSelect('Olga Ostrander')).clickOptions({ text: 'viewer' });
    await settle(fixture);
    await (await (await loader.getHarness(MatDialogHarness)).getHarness(MatButtonHarness.with({ text: 'Make viewer' }))).click();
    await settle(fixture);
    const demote = http.expectOne({ method: 'PATCH', url: '/api/v1/users/u-olga' });
    expect(demote.request.body).toEqual({ role: 'viewer' });
    demote.flush({ ...OLGA, role: 'viewer' });
    await settle(fixture);
    expect(await (await roleSelect('Olga Ostrander')).getValueText()).toBe('viewer');
  });

  it('shows the API’s refusal to remove the last admin, and keeps the role', async () => {
    await open();
    await (await roleSelect('Olga Ostrander')).clickOptions({ text: 'engineer' });
    await settle(fixture);
    await (await (await loader.getHarness(MatDialogHarness)).getHarness(MatButtonHarness.with({ text: 'Make engineer' }))).click();
    await settle(fixture);
    http.expectOne({ method: 'PATCH', url: '/api/v1/users/u-olga' }).flush(...problemBody(409, 'Conflict', 'At least one active admin must remain.'));
    await settle(fixture);
    expect(fixture.nativeElement.querySelector('.refusal')?.textContent).toContain('Role not changed: At least one active admin must remain.');
    expect(notices.problem).not.toHaveBeenCalled();
    expect(await (await roleSelect('Olga Ostrander')).getValueText()).toBe('admin');
  });

  it('deactivates after a confirmation saying their sessions end, and offers reactivation', async () => {
    await open();
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Deactivate Emil Varga-Lund"]' }))).click();
    const confirm = await loader.getHarness(MatDialogHarness);
    expect(await confirm.getContentText()).toContain('every session of theirs ends');
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Deactivate' }))).click();
    await settle(fixture);
    const patch = http.expectOne({ method: 'PATCH', url: '/api/v1/users/u-emil' });
    expect(patch.request.body).toEqual({ status: 'deactivated' });
    patch.flush({ ...EMIL, status: 'deactivated' });
    await settle(fixture);
    expect(row(EMIL.email).classList).toContain('inactive');

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Reactivate Emil Varga-Lund"]' }))).click();
    await (await (await loader.getHarness(MatDialogHarness)).getHarness(MatButtonHarness.with({ text: 'Reactivate' }))).click();
    await settle(fixture);
    const back = http.expectOne({ method: 'PATCH', url: '/api/v1/users/u-emil' });
    expect(back.request.body).toEqual({ status: 'active' });
    back.flush(EMIL);
  });

  it('offers the signed-in admin neither deactivation nor a role change of their own row, and says why', async () => {
    await open();
    const mine = row(ADA.email);
    expect(mine.textContent).toContain('you');
    expect(mine.querySelector('button')).toBeNull();
    expect(await (await roleSelect('Ada Brennholt')).isDisabled()).toBe(true);
    expect(mine.querySelector('.self')?.getAttribute('aria-describedby')).toContain('self-note');
    expect(fixture.nativeElement.querySelector('#self-note')?.textContent).toContain('could leave the team without an admin');
  });
});
