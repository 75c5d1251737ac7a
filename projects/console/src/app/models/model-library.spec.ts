import { Component } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatDialog } from '@angular/material/dialog';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { of, Subject } from 'rxjs';
import type { Model, Permission } from '../api/api-types';
import { Notices } from '../problem/notices';
import { Session } from '../session/session';
import { ConfirmActionDialog } from '../confirm/confirm-action-dialog';
import { ModelLibrary, SEARCH_DEBOUNCE_MS } from './model-library';
import { aModel } from './model-fixtures';

@Component({ template: 'model page' })
class ModelPageStub {}

const BELT = aModel();
const HOIST = aModel({ id: '7b1c6f0e-0000-4000-8000-000000000002', name: 'Hoist 2 hook position', tags: ['hoist'], revision: 3 });
const WRITER: Permission[] = ['models:read', 'models:write', 'compute'];
const VIEWER: Permission[] = ['models:read'];

// the first test compiles Material's table, menu and form fields in jsdom: more than the default 5 s on a busy machine
describe('ModelLibrary', { timeout: 30_000 }, () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;
  let undo: Subject<void>;
  let dialog: { open: ReturnType<typeof vi.fn> };
  let snackBar: { open: ReturnType<typeof vi.fn> };
  let notices: { done: ReturnType<typeof vi.fn>; problem: ReturnType<typeof vi.fn> };

  async function open(url: string, permissions: Permission[] = WRITER): Promise<void> {
    undo = new Subject<void>();
    dialog = { open: vi.fn(() => ({ afterClosed: () => of(true) })) };
    snackBar = { open: vi.fn(() => ({ onAction: () => undo })) };
    notices = { done: vi.fn(), problem: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'models', component: ModelLibrary },
          { path: 'models/:id', component: ModelPageStub },
        ]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Session, useValue: { can: (p: Permission) => permissions.includes(p) } },
        { provide: MatDialog, useValue: dialog },
        { provide: MatSnackBar, useValue: snackBar },
        { provide: Notices, useValue: notices },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
  }

  /** The pending list call; checks its query parameters. */
  function listCall(): TestRequest {
    return http.expectOne((r) => r.url === '/api/v1/models' && r.method === 'GET');
  }

  function params(request: TestRequest): Record<string, string> {
    return Object.fromEntries(request.request.params.keys().map((k) => [k, request.request.params.get(k) as string]));
  }

  async function answer(items: Model[] = [BELT, HOIST], total = items.length): Promise<void> {
    const list = await vi.waitFor(() => listCall());
    list.flush({ items, total, page: Number(list.request.params.get('page')), pageSize: Number(list.request.params.get('pageSize')) });
    for (const tags of http.match('/api/v1/models/tags')) tags.flush({ items: [{ tag: 'conveyor', count: 1 }, { tag: 'hoist', count: 1 }, { tag: 'speed', count: 1 }] });
    await harness.fixture.whenStable();
  }

  function text(selector: string): string[] {
    return [...(harness.routeNativeElement as HTMLElement).querySelectorAll(selector)].map((e) => (e.textContent ?? '').trim());
  }

  async function openRowMenu(index: number): Promise<string[]> {
    const triggers = (harness.routeNativeElement as HTMLElement).querySelectorAll<HTMLButtonElement>('td.actions button');
    triggers[index]?.click();
    await harness.fixture.whenStable();
    return [...document.querySelectorAll('.mat-mdc-menu-panel [mat-menu-item] .mat-mdc-menu-item-text')].map((e) => (e.textContent ?? '').trim());
  }

  async function clickMenuItem(label: string): Promise<void> {
    const item = [...document.querySelectorAll<HTMLElement>('.mat-mdc-menu-panel [mat-menu-item]')].find((e) => e.textContent?.includes(label));
    if (!item) throw new Error(`no menu item ${label}`);
    item.click();
    await harness.fixture.whenStable();
  }

  afterEach(() => {
    document.querySelectorAll('.cdk-overlay-container').forEach((e) => e.remove());
    http.verify();
  });

  it('asks the API for the view in the URL: text, tag, sort, page and deleted models', async () => {
    await open('/models?q=belt&tag=conveyor&sort=name&order=desc&page=2&pageSize=10&includeDeleted=true');
    expect(params(listCall())).toEqual({ q: 'belt', tag: 'conveyor', sort: 'name', order: 'desc', page: '2', pageSize: '10', includeDeleted: 'true' });
    http.match('/api/v1/models/tags').forEach((r) => r.flush({ items: [] }));
  });

  it('asks for the newest changes first, 25 a page, without a query in the URL', async () => {
    await open('/models');
    expect(params(listCall())).toEqual({ sort: 'updatedAt', order: 'desc', page: '1', pageSize: '25' });
    http.match('/api/v1/models/tags').forEach((r) => r.flush({ items: [] }));
  });

  it('sorts by name through the column header and goes back to page 1', async () => {
    await open('/models?page=3');
    await answer([BELT, HOIST], 80);
    (harness.routeNativeElement as HTMLElement).querySelector<HTMLElement>('th.mat-column-name .mat-sort-header-container')?.click();
    await harness.fixture.whenStable();
    expect(params(listCall())).toEqual({ sort: 'name', order: 'asc', page: '1', pageSize: '25' });
    expect(TestBed.inject(Router).url).toBe('/models?sort=name');
  });

  it('pages and changes the page size through the paginator', async () => {
    await open('/models');
    await answer([BELT, HOIST], 60);
    const paginator = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(MatPaginatorHarness);
    expect(await paginator.getRangeLabel()).toBe('1 – 25 of 60');
    (harness.routeNativeElement as HTMLElement).querySelector<HTMLButtonElement>('button.mat-mdc-paginator-navigation-next')?.click();
    await harness.fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/models?page=2');
    await answer([BELT, HOIST], 60);
    await paginator.setPageSize(10);
    // the paginator keeps the first row of the page in view: row 26 is on page 3 of 10
    expect(params(await vi.waitFor(() => listCall()))).toMatchObject({ page: '3', pageSize: '10' });
    expect(TestBed.inject(Router).url).toBe('/models?page=3&pageSize=10');
  });

  it('searches after typing stops, from page 1, and keeps the text in the URL', async () => {
    await open('/models?page=2');
    await answer([BELT, HOIST], 60);
    vi.useFakeTimers();
    try {
      const input = (harness.routeNativeElement as HTMLElement).querySelector<HTMLInputElement>('input[type=search]') as HTMLInputElement;
      input.value = 'hoi';
      input.dispatchEvent(new Event('input'));
      input.value = 'hoist';
      input.dispatchEvent(new Event('input'));
      vi.advanceTimersByTime(SEARCH_DEBOUNCE_MS + 10);
    } finally {
      vi.useRealTimers();
    }
    await harness.fixture.whenStable();
    expect(params(listCall())).toEqual({ q: 'hoist', sort: 'updatedAt', order: 'desc', page: '1', pageSize: '25' });
    expect(http.match((r) => r.url === '/api/v1/models')).toEqual([]);
  });

  it('clears the search but keeps the tag with the field’s clear button', async () => {
    await open('/models?q=belt&tag=conveyor');
    await answer();
    (harness.routeNativeElement as HTMLElement).querySelector<HTMLButtonElement>('button[aria-label="Clear the search"]')?.click();
    await harness.fixture.whenStable();
    expect(params(listCall())).toMatchObject({ tag: 'conveyor', page: '1' });
    expect(TestBed.inject(Router).url).toBe('/models?tag=conveyor');
  });

  it('filters by a tag picked in a row', async () => {
    await open('/models');
    await answer();
    (harness.routeNativeElement as HTMLElement).querySelector<HTMLElement>('a.tag')?.click();
    await harness.fixture.whenStable();
    expect(params(listCall())).toMatchObject({ tag: 'conveyor', page: '1' });
  });

  it('shows the design gain, domain and revision of each model', async () => {
    await open('/models');
    await answer([aModel({ plant: { expression: '0.1/(z-0.9)', domain: 'z', sampleTime: 0.02 }, design: { gain: 8.35123, targets: null } }), aModel({ id: 'x', revision: 4, design: { gain: null, targets: null } })]);
    expect(text('td.mat-column-gain')).toEqual(['8.351', 'not set']);
    expect(text('td.mat-column-domain .plane')).toEqual(['z · T = 20 ms', 's']);
    expect(text('td.mat-column-revision')).toEqual(['1', '4']);
  });

  it('offers writers every action and viewers only open and design', async () => {
    await open('/models');
    await answer();
    expect(text('pwc-page-header a')).toContain('addNew model');
    expect(await openRowMenu(0)).toEqual(['Open', 'Design', 'Edit', 'Duplicate', 'Delete']);
    TestBed.resetTestingModule();

    await open('/models', VIEWER);
    await answer();
    expect(text('pwc-page-header a')).toEqual([]);
    expect(await openRowMenu(0)).toEqual(['Open', 'Design']);
  });

  it('duplicates: reads the model, creates "Copy of …" with a comment naming the original, opens the copy', async () => {
    await open('/models');
    await answer();
    await openRowMenu(1);
    await clickMenuItem('Duplicate');
    http.expectOne(`/api/v1/models/${HOIST.id}`).flush(HOIST, { headers: { ETag: `"${HOIST.id}-r3"` } });
    const create = await vi.waitFor(() => http.expectOne((r) => r.url === '/api/v1/models' && r.method === 'POST'));
    expect(create.request.body).toEqual({
      name: 'Copy of Hoist 2 hook position',
      description: HOIST.description,
      tags: ['hoist'],
      plant: HOIST.plant,
      compensator: null,
      design: { gain: 4, targets: null },
      comment: `Duplicated from “Hoist 2 hook position”, revision 3 (model ${HOIST.id}).`,
    });
    create.flush({ ...HOIST, id: 'copy-1', name: 'Copy of Hoist 2 hook position', revision: 1 }, { status: 201, statusText: 'Created' });
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe('/models/copy-1'));
    expect(notices.done).toHaveBeenCalledWith('Created “Copy of Hoist 2 hook position”');
  });

  it('deletes after a confirmation naming the model, and Undo restores it', async () => {
    await open('/models');
    await answer();
    await openRowMenu(0);
    await clickMenuItem('Delete');
    expect(dialog.open).toHaveBeenCalledWith(ConfirmActionDialog, expect.objectContaining({ data: expect.objectContaining({ title: `Delete “${BELT.name}”?`, destructive: true }) }));
    const remove = await vi.waitFor(() => http.expectOne(`/api/v1/models/${BELT.id}`));
    expect(remove.request.method).toBe('DELETE');
    remove.flush(null, { status: 204, statusText: 'No Content' });
    await vi.waitFor(() => expect(snackBar.open).toHaveBeenCalled());
    expect(snackBar.open).toHaveBeenCalledWith(`Deleted “${BELT.name}”`, 'Undo', expect.anything());
    await answer([HOIST]);

    undo.next();
    const restore = await vi.waitFor(() => http.expectOne(`/api/v1/models/${BELT.id}/restore`));
    expect(restore.request.method).toBe('POST');
    restore.flush(BELT);
    await harness.fixture.whenStable();
    await answer([BELT, HOIST]);
    expect(notices.done).toHaveBeenCalledWith(`Restored “${BELT.name}”`);
    expect(text('a.name')).toEqual([BELT.name, HOIST.name]);
  });

  it('does not delete when the confirmation is declined', async () => {
    await open('/models');
    await answer();
    dialog.open.mockReturnValue({ afterClosed: () => of(false) });
    await openRowMenu(0);
    await clickMenuItem('Delete');
    await vi.waitFor(() => expect(dialog.open).toHaveBeenCalled());
    await harness.fixture.whenStable();
    expect(http.match(`/api/v1/models/${BELT.id}`)).toEqual([]);
  });

  it('shows deleted models greyed with a status, and Restore as their only change', async () => {
    await open('/models?includeDeleted=true');
    await answer([{ ...BELT, deletedAt: '2026-12-02T10:00:00.000Z' }]);
    expect(text('tr.deleted .deleted-status')).toEqual(['deleted']);
    expect(await openRowMenu(0)).toEqual(['Open', 'Restore']);
  });

  it('says what to do when there are no models, and when nothing matches', async () => {
    await open('/models');
    await answer([], 0);
    expect(text('.pwc-empty strong')).toEqual(['No models yet.']);
    expect(text('.pwc-empty a')).toContain('addNew model');
    TestBed.resetTestingModule();

    await open('/models?q=zzz');
    await answer([], 0);
    expect(text('.pwc-empty p')[0]).toContain('No model matches “zzz”');
    expect(text('.pwc-empty button')).toEqual(['Clear filters']);
  });
});
