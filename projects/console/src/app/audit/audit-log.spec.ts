import type { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDateRangeInputHarness } from '@angular/material/datepicker/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { flushDirectory, settle, setUpAdminScreen, tearDownAdminScreen } from '../testing/admin-fixtures';
import type { AuditEvent } from './audit-api';
import { AuditLog } from './audit-log';

@Component({ template: 'model page' })
class ModelPageStub {}

const EVENTS: AuditEvent[] = [
  { id: 30, at: '2026-12-02T09:30:00.000Z', action: 'api-key.revoked', actorId: 'u-ada', targetType: 'api-key', targetId: 'k-4f1c2d9e-0000', detail: { name: 'Belt line nightly' } },
  { id: 29, at: '2026-12-02T09:20:00.000Z', action: 'model.updated', actorId: 'u-emil', targetType: 'model', targetId: 'm-7', detail: { revision: 3, comment: 'Lag moved to 2.1 rad/s' } },
  { id: 28, at: '2026-12-02T09:10:00.000Z', action: 'user.invited', actorId: 'u-ada', targetType: 'user', targetId: 'u-vera', detail: { email: 'vera.viewer@quillfield.example', role: 'viewer' } },
  { id: 27, at: '2026-12-02T09:00:00.000Z', action: 'api-key.expiry-notice', actorId: null, targetType: 'api-key', targetId: 'k-1', detail: null },
];

describe('AuditLog', { timeout: 30_000 }, () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;

  function expectEvents(): TestRequest {
    return http.expectOne((r) => r.url === '/api/v1/audit');
  }

  async function openAt(url: string, events: AuditEvent[] = EVENTS, total = events.length): Promise<TestRequest> {
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    await settle(harness.fixture);
    flushDirectory(http);
    const request = expectEvents();
    request.flush({ items: events, total, page: Number(request.request.params.get('page')), pageSize: Number(request.request.params.get('pageSize')) });
    await settle(harness.fixture);
    return request;
  }

  const el = () => harness.routeNativeElement as HTMLElement;
  const loader = () => TestbedHarnessEnvironment.documentRootLoader(harness.fixture);
  const url = () => TestBed.inject(Router).url;

  beforeEach(() => {
    ({ http } = setUpAdminScreen({ routes: [{ path: 'audit', component: AuditLog }, { path: 'models/:id', component: ModelPageStub }] }));
  });

  afterEach(() => tearDownAdminScreen(http));

  it('reads its filters from the URL and asks the API for that window', async () => {
    const request = await openAt('/audit?action=api-key.&actor=u-ada&from=2026-12-01&to=2026-12-02&page=2&size=25');
    expect(request.request.params.get('action')).toBe('api-key.');
    expect(request.request.params.get('actorId')).toBe('u-ada');
    expect(request.request.params.get('from')).toBe(new Date(2026, 11, 1).toISOString());
    expect(request.request.params.get('to')).toBe(new Date(2026, 11, 3).toISOString());
    expect(request.request.params.get('page')).toBe('2');
    expect(request.request.params.get('pageSize')).toBe('25');
    expect(await (await loader().getHarness(MatAutocompleteHarness)).getValue()).toBe('api-key.');
    expect(await (await loader().getHarness(MatSelectHarness.with({ selector: '[formcontrolname="actor"]' }))).getValueText()).toBe('Ada Brennholt');
    const range = await loader().getHarness(MatDateRangeInputHarness);
    expect(await (await range.getStartInput()).getValue()).toBe(new Date(2026, 11, 1).toLocaleDateString('en-US'));
  });

  it('shows names, not ids, links model targets to the model page, and expands the full detail', async () => {
    await openAt('/audit');
    const rows = [...el().querySelectorAll('tr[data-action]')] as HTMLElement[];
    expect(rows.map((r) => r.dataset['action'])).toEqual(['api-key.revoked', 'model.updated', 'user.invited', 'api-key.expiry-notice']);
    expect(rows[0]!.textContent).toContain('Ada Brennholt');
    expect(rows[0]!.textContent).not.toContain('u-ada');
    expect(rows[0]!.textContent).toContain('name: Belt line nightly');
    expect(rows[1]!.textContent).toContain('Emil Varga-Lund');
    expect(rows[1]!.querySelector('a')?.getAttribute('href')).toBe('/models/m-7');
    expect(rows[2]!.querySelector('.type')?.textContent).toBe('user');
    expect(rows[2]!.textContent).toContain('Vera Osei-Marsh');
    expect(rows[3]!.textContent).toContain('System');

    await (await loader().getHarness(MatButtonHarness.with({ selector: '[aria-label="Show the full detail of event 29"]' }))).click();
    await settle(harness.fixture);
    const json = el().querySelector('#event-29')?.textContent ?? '';
    expect(JSON.parse(json)).toEqual({ revision: 3, comment: 'Lag moved to 2.1 rad/s' });
    expect(el().querySelector('#event-30')).toBeNull();
  });

  it('puts a picked person, a typed action family and days into the URL, back at the first page', async () => {
    await openAt('/audit?page=3', EVENTS, 300);
    await (await loader().getHarness(MatSelectHarness.with({ selector: '[formcontrolname="actor"]' }))).clickOptions({ text: 'Emil Varga-Lund' });
    await settle(harness.fixture);
    expect(url()).toBe('/audit?actor=u-emil');
    const byActor = expectEvents();
    expect(byActor.request.params.get('actorId')).toBe('u-emil');
    expect(byActor.request.params.get('page')).toBe('1');
    byActor.flush({ items: [EVENTS[1]], total: 1, page: 1, pageSize: 50 });

    const action = await loader().getHarness(MatAutocompleteHarness);
    await action.enterText('model.');
    await new Promise((resolve) => setTimeout(resolve, 450)); // typing settles first
    await settle(harness.fixture);
    expect(url()).toBe('/audit?action=model.&actor=u-emil');
    expectEvents().flush({ items: [EVENTS[1]], total: 1, page: 1, pageSize: 50 });

    const range = await loader().getHarness(MatDateRangeInputHarness);
    await (await range.getStartInput()).setValue('12/1/2026');
    await (await range.getEndInput()).setValue('12/2/2026');
    await new Promise((resolve) => setTimeout(resolve, 100));
    await settle(harness.fixture);
    expect(url()).toBe('/audit?action=model.&actor=u-emil&from=2026-12-01&to=2026-12-02');
    const byDays = expectEvents();
    expect(byDays.request.params.get('to')).toBe(new Date(2026, 11, 3).toISOString());
    byDays.flush({ items: [], total: 0, page: 1, pageSize: 50 });
    await settle(harness.fixture);
    expect(el().textContent).toContain('No events match these filters.');

    await (await loader().getHarness(MatButtonHarness.with({ text: 'Clear filters' }))).click();
    await settle(harness.fixture);
    expect(url()).toBe('/audit');
    expectEvents().flush({ items: EVENTS, total: 4, page: 1, pageSize: 50 });
  });

  it('pages through the URL', async () => {
    await openAt('/audit?action=user.', EVENTS, 120);
    await (await loader().getHarness(MatPaginatorHarness)).goToNextPage();
    await settle(harness.fixture);
    expect(url()).toBe('/audit?action=user.&page=2');
    const next = expectEvents();
    expect(next.request.params.get('page')).toBe('2');
    expect(next.request.params.get('action')).toBe('user.');
    next.flush({ items: [], total: 120, page: 2, pageSize: 50 });
  });
});
