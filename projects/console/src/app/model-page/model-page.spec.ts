import { Component, input } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatDialog } from '@angular/material/dialog';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { LocusPlot, LoopStudio } from '@polewright/elements';
import { of } from 'rxjs';
import type { Model, Permission, Revision, RevisionSummary } from '../api/api-types';
import { aModel, aRevision, aRevisionSummary } from '../models/model-fixtures';
import { Notices } from '../problem/notices';
import { Session } from '../session/session';
import { ModelPage } from './model-page';
import { RevisionDiff } from './revision-diff';

// The plot elements are tested in their own library; here stand-ins record what the page hands them.
@Component({ selector: 'pwl-loop-studio', template: '' })
class StudioStub {
  readonly model = input<unknown>();
  readonly gain = input<number>();
  readonly targets = input<unknown>();
  readonly loop = input<string>();
  readonly label = input<string>();
}

@Component({ selector: 'pwl-locus-plot', template: '' })
class PlotStub {
  readonly model = input<unknown>();
  readonly gain = input<number>();
  readonly targets = input<unknown>();
  readonly label = input<string | null>();
}

const ID = '7b1c6f0e-0000-4000-8000-000000000001';
const FIRST = aRevision(1, { plant: { expression: '9.5*(s+1.5)/(s*(s+0.9))' }, design: { gain: 8.08, targets: null }, comment: 'First model' });
const SECOND = aRevision(2, {
  plant: { expression: '9.5*(s+2)/(s*(s+0.9))' },
  compensator: { zeros: [{ re: -1, im: 0 }], poles: [{ re: -8, im: 0 }], gain: 1.5 },
  design: { gain: 2.46, targets: { minDampingRatio: 0.4 } },
  comment: 'Retuned',
});
const MODEL = aModel({ id: ID, revision: 2, plant: SECOND.plant, compensator: SECOND.compensator, design: SECOND.design, updatedAt: '2026-12-02T09:00:00.000Z' });
const HISTORY: RevisionSummary[] = [aRevisionSummary(2, { comment: 'Retuned' }), aRevisionSummary(1, { comment: 'First model' })];

describe('ModelPage', { timeout: 30_000 }, () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;
  let notices: { done: ReturnType<typeof vi.fn>; problem: ReturnType<typeof vi.fn> };

  async function open(url: string, permissions: Permission[] = ['models:read', 'models:write', 'compute']): Promise<void> {
    notices = { done: vi.fn(), problem: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'models/:id', component: ModelPage }]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Session, useValue: { can: (p: Permission) => permissions.includes(p) } },
        { provide: MatDialog, useValue: { open: vi.fn(() => ({ afterClosed: () => of(true) })) } },
        { provide: MatSnackBar, useValue: { open: vi.fn(() => ({ onAction: () => of() })) } },
        { provide: Notices, useValue: notices },
      ],
    });
    TestBed.overrideComponent(ModelPage, { remove: { imports: [LoopStudio] }, add: { imports: [StudioStub] } });
    TestBed.overrideComponent(RevisionDiff, { remove: { imports: [LocusPlot] }, add: { imports: [PlotStub] } });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
  }

  /** Answers the model and its history. */
  async function load(model: Model = MODEL, history: RevisionSummary[] = HISTORY): Promise<void> {
    const get = http.expectOne((r) => r.url === `/api/v1/models/${model.id}`);
    expect(get.request.params.get('includeDeleted')).toBe('true');
    get.flush(model, { headers: { ETag: `"${model.id}-r${model.revision}"` } });
    (await vi.waitFor(() => http.expectOne(`/api/v1/models/${model.id}/revisions`))).flush({ items: history });
    await harness.fixture.whenStable();
  }

  /** Answers the reads of single revisions the page asks for; returns their numbers. */
  async function answerRevisions(...revisions: Revision[]): Promise<number[]> {
    await harness.fixture.whenStable();
    const asked: number[] = [];
    for (const request of http.match((r) => /\/revisions\/\d+$/.test(r.url))) {
      const n = Number(request.request.url.split('/').at(-1));
      asked.push(n);
      const revision = revisions.find((r) => r.revision === n);
      if (revision) request.flush(revision);
    }
    await harness.fixture.whenStable();
    return asked.sort();
  }

  function page(): HTMLElement {
    return harness.routeNativeElement as HTMLElement;
  }

  function texts(selector: string): string[] {
    return [...page().querySelectorAll(selector)].map((e) => (e.textContent ?? '').replace(/\s+/g, ' ').trim());
  }

  afterEach(() => {
    document.querySelectorAll('.cdk-overlay-container').forEach((e) => e.remove());
    http.verify();
  });

  it('shows the model with its facts, the caution, and the studio on the current revision', async () => {
    await open(`/models/${ID}`);
    await load();
    await answerRevisions(FIRST, SECOND);
    expect(texts('pwc-page-header h1')).toEqual([MODEL.name]);
    expect(texts('.header-detail .tag')).toEqual(['conveyor', 'speed']);
    expect(texts('.changed-by')[0]).toContain('last changed by Emil Varga-Lund');
    expect(texts('.design .gain')).toEqual(['2.46']);
    expect(texts('.design dd')[1]).toBe('ζ ≥ 0.4');
    expect(page().querySelector('#pwc-model-content pwc-caution')).not.toBeNull();
    const studio = harness.fixture.debugElement.query((e) => e.componentInstance instanceof StudioStub).componentInstance as StudioStub;
    expect(studio.model()).toEqual({ plant: MODEL.plant, compensator: MODEL.compensator });
    expect(studio.gain()).toBe(2.46);
    expect(studio.targets()).toEqual({ minDampingRatio: 0.4 });
    expect(studio.loop()).toBe(`model-${ID}-r2`);
    expect(texts('pwc-page-header .actions .mdc-button__label')).toEqual(['Design', 'Edit', 'Duplicate', 'Delete']);
  });

  it('compares the latest two revisions by default and highlights the changed expression, compensator and gain', async () => {
    await open(`/models/${ID}`);
    await load();
    expect(await answerRevisions(FIRST, SECOND)).toEqual([1, 2]);
    const changed = [...page().querySelectorAll<HTMLElement>('table.diff tr.changed')].map((r) => r.dataset['field']);
    expect(changed).toEqual(['plant.expression', 'compensator', 'compensator.zeros', 'compensator.poles', 'compensator.gain', 'design.gain', 'design.minDampingRatio']);
    const expression = page().querySelector('tr[data-field="plant.expression"]') as HTMLElement;
    expect([...expression.querySelectorAll('[data-side=before] .removed')].map((e) => e.textContent)).toEqual(['1.5']);
    expect([...expression.querySelectorAll('[data-side=after] .added')].map((e) => e.textContent)).toEqual(['2']);
    const gain = page().querySelector('tr[data-field="design.gain"]') as HTMLElement;
    expect(gain.querySelector('[data-side=before]')?.textContent?.trim()).toBe('8.08');
    expect(gain.querySelector('[data-side=after] .added')?.textContent?.trim()).toBe('2.46');
    (page().querySelector('pwc-revision-diff mat-slide-toggle button') as HTMLButtonElement).click();
    await harness.fixture.whenStable();
    expect(page().querySelectorAll('table.diff tbody tr:not(.group)').length).toBe(changed.length);
    expect(texts('table.diff tr.group th')).toEqual(['Plant', 'Compensator', 'Design']);
    const plots = harness.fixture.debugElement.queryAll((e) => e.componentInstance instanceof PlotStub).map((e) => e.componentInstance as PlotStub);
    expect(plots.map((p) => p.gain())).toEqual([8.08, 2.46]);
    expect(plots.map((p) => p.model())).toEqual([{ plant: FIRST.plant, compensator: null }, { plant: SECOND.plant, compensator: SECOND.compensator }]);
  });

  it('compares the pair named in the URL, and a pick in a select changes the URL', async () => {
    const third = aRevision(3, { ...SECOND, revision: 3, design: { gain: 3, targets: null } });
    await open(`/models/${ID}?from=1&to=3`);
    await load({ ...MODEL, revision: 3 }, [aRevisionSummary(3), ...HISTORY]);
    expect(await answerRevisions(FIRST, SECOND, third)).toEqual([1, 3]);
    const selects = await TestbedHarnessEnvironment.loader(harness.fixture).getAllHarnesses(MatSelectHarness);
    expect(await selects[0]!.getValueText()).toMatch(/^Revision 1/);
    await selects[1]!.open();
    await selects[1]!.clickOptions({ text: /^Revision 2/ });
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe(`/models/${ID}?from=1&to=2`));
    // revision 1 was read once: the page keeps revisions it has read
    expect(await answerRevisions(FIRST, SECOND, third)).toEqual([2]);
  });

  it('opens an older revision read-only with its own content and loop key', async () => {
    await open(`/models/${ID}?revision=1`);
    await load();
    await answerRevisions(FIRST, SECOND);
    expect(texts('.banner.old p')[0]).toContain('revision 1 of 2, read only');
    const studio = harness.fixture.debugElement.query((e) => e.componentInstance instanceof StudioStub).componentInstance as StudioStub;
    expect(studio.model()).toEqual({ plant: FIRST.plant, compensator: null });
    expect(studio.gain()).toBe(8.08);
    expect(studio.loop()).toBe(`model-${ID}-r1`);
    expect(texts('.design .gain')).toEqual(['8.08']);
  });

  it('says there is no such model for an unknown id', async () => {
    await open('/models/no-such-id');
    http.expectOne((r) => r.url === '/api/v1/models/no-such-id').flush({ title: 'Not found', status: 404, detail: 'Model no-such-id' }, { status: 404, statusText: 'Not Found' });
    await harness.fixture.whenStable();
    expect(texts('.panel h1')).toEqual(['No such model']);
    expect(texts('.panel code')).toEqual(['no-such-id']);
    expect(notices.problem).not.toHaveBeenCalled();
  });

  it('shows a deleted model with a banner, and Restore brings it back', async () => {
    await open(`/models/${ID}`);
    await load({ ...MODEL, deletedAt: '2026-12-02T10:00:00.000Z' });
    await answerRevisions(FIRST, SECOND);
    expect(texts('.banner.deleted p')[0]).toContain('Deleted on');
    expect(texts('pwc-page-header .actions .mdc-button__label')).toEqual(['Restore']);
    (page().querySelector('.banner.deleted button') as HTMLButtonElement).click();
    const restore = await vi.waitFor(() => http.expectOne(`/api/v1/models/${ID}/restore`));
    restore.flush(MODEL);
    await vi.waitFor(() => expect(notices.done).toHaveBeenCalledWith(`Restored “${MODEL.name}”`));
    await vi.waitFor(() => http.expectOne((r) => r.url === `/api/v1/models/${ID}`)).then((r) => r.flush(MODEL));
    (await vi.waitFor(() => http.expectOne(`/api/v1/models/${ID}/revisions`))).flush({ items: HISTORY });
    await harness.fixture.whenStable();
    expect(page().querySelector('.banner.deleted')).toBeNull();
  });

  it('offers a viewer no edit, duplicate, delete or restore', async () => {
    await open(`/models/${ID}`, ['models:read']);
    await load();
    await answerRevisions(FIRST, SECOND);
    expect(texts('pwc-page-header .actions .mdc-button__label')).toEqual(['Design']);
    TestBed.resetTestingModule();

    await open(`/models/${ID}`, ['models:read']);
    await load({ ...MODEL, deletedAt: '2026-12-02T10:00:00.000Z' });
    await answerRevisions(FIRST, SECOND);
    expect(texts('pwc-page-header .actions .mdc-button__label')).toEqual([]);
    expect(texts('.banner.deleted button')).toEqual([]);
  });

  it('says so when a model has one revision, instead of a comparison', async () => {
    await open(`/models/${ID}`);
    await load({ ...MODEL, revision: 1 }, [aRevisionSummary(1)]);
    expect(await answerRevisions()).toEqual([]);
    expect(texts('#pwc-compare .pwc-empty')[0]).toContain('one revision so far');
  });
});
