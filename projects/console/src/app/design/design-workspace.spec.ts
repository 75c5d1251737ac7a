import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import { LoopRegistry } from '@polewright/elements';
import { designGains, loopPlant, type DesignRequest } from '@polewright/locus-core';
import type { Model, Permission, RevisionSummary, Schemas } from '../api/api-types';
import { Notices } from '../problem/notices';
import { problemInterceptor } from '../problem/problem-interceptor';
import { Session } from '../session/session';
import { DESIGN_DEBOUNCE_MS, DesignWorkspace } from './design-workspace';

const HOIST_PLANT = { expression: '(s+0.6)^2/(s^3*(s+4.5)*(s+11))' };
const EMIL = { id: 'u-emil', email: 'emil.engineer@quillfield.example', name: 'Emil Engineer' };
const ADA = { id: 'u-ada', email: 'ada.admin@quillfield.example', name: 'Ada Admin' };

function model(overrides: Partial<Model> = {}): Model {
  return {
    id: 'm1',
    name: 'Hoist 2 hook position',
    description: 'Position loop of the maintenance hoist.',
    tags: ['hoist', 'position'],
    plant: HOIST_PLANT,
    compensator: null,
    design: { gain: 107, targets: null },
    revision: 1,
    createdAt: '2026-12-01T09:00:00.000Z',
    updatedAt: '2026-12-01T09:00:00.000Z',
    createdBy: EMIL,
    updatedBy: EMIL,
    deletedAt: null,
    ...overrides,
  };
}

/** The engine's own answer to a design request (the API passes the body to this function). */
function engineAnswer(body: Schemas['DesignRequest']): Schemas['DesignResult'] {
  return designGains(body as DesignRequest) as Schemas['DesignResult'];
}

// the elements compute the locus, step response and design in jsdom: slower than a plain component
describe('DesignWorkspace', { timeout: 60000 }, () => {
  let http: HttpTestingController;
  let notices: { done: ReturnType<typeof vi.fn>; problem: ReturnType<typeof vi.fn> };
  let fixture: ComponentFixture<DesignWorkspace>;
  let host: HTMLElement;
  let loopKey = 0;

  async function settle(): Promise<void> {
    for (let i = 0; i < 4; i++) {
      await new Promise((resolve) => setTimeout(resolve, 0));
      TestBed.tick();
    }
  }

  function designCall(): TestRequest {
    return http.expectOne((r) => r.method === 'POST' && r.url === '/api/v1/design');
  }

  async function answerDesign(): Promise<TestRequest> {
    await settle();
    const call = designCall();
    call.flush(engineAnswer(call.request.body as Schemas['DesignRequest']));
    await settle();
    return call;
  }

  async function open(permissions: Permission[], saved: Model = model()): Promise<void> {
    notices = { done: vi.fn(), problem: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([problemInterceptor])),
        provideHttpClientTesting(),
        { provide: Notices, useValue: notices },
        { provide: Session, useValue: { can: (p: Permission) => permissions.includes(p), token: () => 'pws_test', forget: () => undefined } },
        { provide: DESIGN_DEBOUNCE_MS, useValue: 0 },
        // dialogs close at once (jsdom plays no CSS transitions)
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(DesignWorkspace);
    host = fixture.nativeElement as HTMLElement;
    // a fresh id per test: the loop store is application-wide and keyed by model
    const id = `m${++loopKey}`;
    fixture.componentRef.setInput('id', id);
    await settle();
    http.expectOne(`/api/v1/models/${id}`).flush({ ...saved, id }, { headers: { ETag: `"${id}-r${saved.revision}"` } });
    await settle();
  }

  function id(): string {
    return `m${loopKey}`;
  }

  function typeInto(input: HTMLInputElement, value: string): void {
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  }

  // a button by its visible words (an icon's ligature left out)
  function button(name: string | RegExp, root: ParentNode = host): HTMLButtonElement {
    const words = (b: HTMLButtonElement): string => (b.textContent ?? '').replace(b.querySelector('mat-icon')?.textContent ?? '', '').trim();
    const found = [...root.querySelectorAll('button')].find((b) => (typeof name === 'string' ? words(b) === name : name.test(words(b))));
    if (!found) throw new Error(`no button ${String(name)}`);
    return found;
  }

  const overlay = (): HTMLElement => document.querySelector('.cdk-overlay-container') as HTMLElement;
  const loop = () => TestBed.inject(LoopRegistry).loop(`design-${id()}`);

  afterEach(() => {
    try {
      http.verify();
    } finally {
      document.querySelector('.cdk-overlay-container')?.replaceChildren();
      TestBed.resetTestingModule();
    }
  });

  it('sends the targets of the form to POST /design with the loop on screen', async () => {
    await open(['models:read', 'models:write']);
    const first = await answerDesign();
    expect(first.request.body).toEqual({ plant: HOIST_PLANT, dominantOnly: false, dampingLines: [0.5, 0.707] });

    typeInto(host.querySelector('input[formcontrolname="minDampingRatio"]') as HTMLInputElement, '0.3');
    const second = await answerDesign();
    expect(second.request.body).toEqual({ plant: HOIST_PLANT, targets: { minDampingRatio: 0.3 }, dominantOnly: false, dampingLines: [0.3] });
    // the elements got the targets as well (the plot shades the region from the store's design)
    expect(loop().targets()).toEqual({ minDampingRatio: 0.3 });
  });

  it('shows the feasible ranges of the answer; a click sets a gain inside the range, with the caution beside', async () => {
    await open(['models:read', 'models:write'], model({ design: { gain: 107, targets: { minDampingRatio: 0.3 } } }));
    const call = await answerDesign();
    const answer = engineAnswer(call.request.body as Schemas['DesignRequest']);
    const rows = host.querySelectorAll('pwc-feasible-ranges tr.mat-mdc-row');
    expect(rows.length).toBe(answer.gainRanges.length);
    const cells = [...rows[0].querySelectorAll('td')].map((td) => td.textContent?.trim());
    expect(cells[0]).toBe(String(Number(answer.gainRanges[0].from.toPrecision(4))));
    expect(cells[1]).toBe('ζ ≥ 0.3');
    expect(cells[2]).toBe(String(Number((answer.gainRanges[0].to as number).toPrecision(4))));
    expect(cells[3]).toBe('ζ ≥ 0.3');
    expect(host.querySelector('pwc-feasible-ranges pwc-caution')).not.toBeNull();

    button(/^K = /, host.querySelector('pwc-feasible-ranges') as HTMLElement).click();
    await settle();
    const gain = loop().gain();
    const range = answer.gainRanges[0];
    expect(gain).toBeGreaterThan(range.from);
    expect(gain).toBeLessThan(range.to as number);
    expect(gain).toBeCloseTo(Math.sqrt(range.from * (range.to as number)), 1);
    const field = host.querySelector('pwl-gain-control')?.shadowRoot?.querySelector('input#field') as HTMLInputElement;
    expect(Number(field.value)).toBe(gain);
    expect(host.querySelector('pwc-gain-verdict')?.textContent).toContain('Meets the design targets');
    expect(host.querySelector('pwc-gain-verdict pwc-caution')).not.toBeNull();
  });

  it('says plainly when no gain meets all targets', async () => {
    await open(['models:read']);
    await answerDesign();
    typeInto(host.querySelector('input[formcontrolname="minDampingRatio"]') as HTMLInputElement, '0.8');
    const call = await answerDesign();
    expect(engineAnswer(call.request.body as Schemas['DesignRequest']).gainRanges).toEqual([]);
    const panel = host.querySelector('pwc-feasible-ranges') as HTMLElement;
    expect(panel.textContent).toContain('No gain meets all targets.');
    expect(panel.querySelector('table')).toBeNull();
  });

  it('puts the API’s target errors at their fields', async () => {
    await open(['models:read', 'models:write']);
    await answerDesign();
    typeInto(host.querySelector('input[formcontrolname="minDampingRatio"]') as HTMLInputElement, '0.35');
    await settle();
    designCall().flush(
      { title: 'The request is not valid', status: 400, detail: 'see errors', errors: [{ pointer: '/targets/minDampingRatio', detail: 'must be a number between 0 and 1 (exclusive)' }] },
      { status: 400, statusText: 'Bad Request', headers: { 'Content-Type': 'application/problem+json' } },
    );
    await settle();
    fixture.detectChanges();
    expect(host.querySelector('pwc-targets-panel mat-error')?.textContent?.trim()).toBe('must be a number between 0 and 1 (exclusive)');
    expect(notices.problem).not.toHaveBeenCalled();
  });

  it('previews a compensator zero typed into the table on the loop and in the design request', async () => {
    await open(['models:read', 'models:write']);
    await answerDesign();
    button('Add zero').click();
    await settle();
    typeInto(host.querySelector('input[aria-label="Zero 1 real part"]') as HTMLInputElement, '-2');
    const call = await answerDesign();
    const compensator = { zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 };
    expect(call.request.body.plant).toEqual(loopPlant({ plant: HOIST_PLANT, compensator }));
    expect(loop().model()?.compensator).toEqual(compensator);
    expect(host.querySelector('.banner.unsaved')?.textContent).toContain('compensator');
  });

  it('takes a compensator edited on the plot (pw-model-edit) into the table, the request and the edits', async () => {
    await open(['models:read', 'models:write']);
    await answerDesign();
    const plot = host.querySelector('pwl-locus-plot') as HTMLElement;
    expect([...(plot.shadowRoot?.querySelectorAll('button') ?? [])].map((b) => b.textContent?.trim())).toContain('+ Zero');
    // as the plot's compensator editor does: the edited model goes into the loop store, then the event
    const edited = { zeros: [{ re: -1, im: 1.5 }, { re: -1, im: -1.5 }], poles: [{ re: -20, im: 0 }], gain: 2 };
    const current = loop().model();
    loop().setModel({ ...(current as NonNullable<typeof current>), compensator: edited });
    plot.dispatchEvent(new CustomEvent('pw-model-edit', { detail: { plant: current?.plant, compensator: edited }, bubbles: true, composed: true }));
    const call = await answerDesign();
    expect(call.request.body.plant).toEqual(loopPlant({ plant: HOIST_PLANT, compensator: edited }));
    fixture.detectChanges();
    const values = [...host.querySelectorAll('pwc-compensator-table td.value')].map((td) => td.textContent?.trim());
    expect(values).toEqual(['−1 ± 1.5j', '−20']);
    expect((host.querySelector('pwc-compensator-table input[type="number"]:not([aria-label])') as HTMLInputElement).value).toBe('2');
    expect(host.querySelector('.banner.unsaved')?.textContent).toContain('compensator');
    // the store keeps the plot's own model object (no refit of the plot's view)
    expect(loop().model()?.compensator).toBe(edited);
  });

  it('refuses a compensator that makes the loop improper, at the table, and keeps the loop as it was', async () => {
    await open(['models:read', 'models:write']);
    await answerDesign();
    // the hoist has 2 zeros and 5 poles: three more zeros keep it proper, a fourth does not
    for (let i = 0; i < 3; i++) button('Add zero').click();
    await settle();
    for (let i = 1; i <= 3; i++) typeInto(host.querySelector(`input[aria-label="Zero ${i} real part"]`) as HTMLInputElement, String(-i));
    await answerDesign();
    expect(loop().model()?.compensator?.zeros.length).toBe(3);
    button('Add zero').click();
    await settle();
    typeInto(host.querySelector('input[aria-label="Zero 4 real part"]') as HTMLInputElement, '-4');
    await settle();
    fixture.detectChanges();
    expect(host.querySelector('pwc-compensator-table .problem')?.textContent).toContain('more zeros than poles');
    expect(loop().model()?.compensator?.zeros.length).toBe(3);
    expect(button(/Save as new revision/).disabled).toBe(true);
    http.expectNone((r) => r.method === 'POST');
  });

  async function saveDialog(comment: string): Promise<TestRequest> {
    button(/Save as new revision/).click();
    await settle();
    const textarea = overlay().querySelector('textarea') as HTMLTextAreaElement;
    textarea.value = comment;
    textarea.dispatchEvent(new Event('input'));
    button('Save revision', overlay()).click();
    await settle();
    return http.expectOne((r) => r.method === 'PUT' && r.url === `/api/v1/models/${id()}`);
  }

  async function editDesign(): Promise<void> {
    await answerDesign();
    typeInto(host.querySelector('input[formcontrolname="minDampingRatio"]') as HTMLInputElement, '0.3');
    await answerDesign();
    button('Add zero').click();
    await settle();
    typeInto(host.querySelector('input[aria-label="Zero 1 real part"]') as HTMLInputElement, '-2');
    await answerDesign();
    loop().setGain(99.89);
    await settle();
  }

  it('saves plant unchanged with the edited compensator, design gain and targets, a comment and If-Match', async () => {
    await open(['models:read', 'models:write']);
    await editDesign();
    const put = await saveDialog('Lead zero at −2 for ζ ≥ 0.3');
    expect(put.request.headers.get('If-Match')).toBe(`"${id()}-r1"`);
    expect(put.request.body).toEqual({
      name: 'Hoist 2 hook position',
      description: 'Position loop of the maintenance hoist.',
      tags: ['hoist', 'position'],
      plant: HOIST_PLANT,
      compensator: { zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 },
      design: { gain: 99.89, targets: { minDampingRatio: 0.3 } },
      comment: 'Lead zero at −2 for ζ ≥ 0.3',
    });
    const body = put.request.body as Model;
    put.flush({ ...model({ id: id(), revision: 2, compensator: body.compensator, design: body.design }) }, { headers: { ETag: `"${id()}-r2"` } });
    await settle();
    expect(notices.done).toHaveBeenCalledWith('Saved as revision 2');
    expect(host.querySelector('.banner.unsaved')).toBeNull();
    expect(host.querySelector('.byline')?.textContent).toContain('Revision 2');
  });

  it('does not save without a comment', async () => {
    await open(['models:read', 'models:write']);
    await editDesign();
    button(/Save as new revision/).click();
    await settle();
    button('Save revision', overlay()).click();
    await settle();
    http.expectNone((r) => r.method === 'PUT');
    expect(overlay().querySelector('mat-error')?.textContent?.trim()).toBe('Required.');
  });

  it('on 412 says who saved which revision, keeps the edits, and saves on top with the new ETag', async () => {
    await open(['models:read', 'models:write']);
    await editDesign();
    const stale = await saveDialog('Lead zero at −2');
    stale.flush({ title: 'The resource has changed', status: 412, detail: 'the model is at revision 2' }, { status: 412, statusText: 'Precondition Failed' });
    await settle();
    const theirs = model({ id: id(), revision: 2, updatedBy: ADA, updatedAt: '2026-12-02T10:00:00.000Z', design: { gain: 120, targets: null } });
    http.expectOne(`/api/v1/models/${id()}`).flush(theirs, { headers: { ETag: `"${id()}-r2"` } });
    const summary: RevisionSummary = { revision: 2, comment: 'Retuned after the rope change', createdAt: theirs.updatedAt, author: ADA, contentHash: 'x' };
    http.expectOne(`/api/v1/models/${id()}/revisions`).flush({ items: [summary] });
    await settle();
    expect(notices.problem).not.toHaveBeenCalled();
    const conflict = overlay().querySelector('.conflict')?.textContent ?? '';
    expect(conflict).toContain('Ada Admin saved revision 2');
    expect(conflict).toContain('Retuned after the rope change');
    expect(conflict).toContain('Their revision changed the design gain (K = 107 → 120).');
    // the workspace still holds every edit
    expect(loop().model()?.compensator).toEqual({ zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 });
    expect(loop().gain()).toBe(99.89);

    button('Save on top of revision 2', overlay()).click();
    await settle();
    const onTop = http.expectOne((r) => r.method === 'PUT');
    expect(onTop.request.headers.get('If-Match')).toBe(`"${id()}-r2"`);
    expect(onTop.request.body).toMatchObject({ compensator: { zeros: [{ re: -2, im: 0 }], poles: [], gain: 1 }, design: { gain: 99.89, targets: { minDampingRatio: 0.3 } }, comment: 'Lead zero at −2' });
    onTop.flush(model({ id: id(), revision: 3, compensator: (onTop.request.body as Model).compensator, design: (onTop.request.body as Model).design }), { headers: { ETag: `"${id()}-r3"` } });
    await settle();
    expect(notices.done).toHaveBeenCalledWith('Saved as revision 3');
  });

  it('after a 412, cancelling keeps the edits on screen and unsaved', async () => {
    await open(['models:read', 'models:write']);
    await editDesign();
    (await saveDialog('Lead zero')).flush({ title: 'The resource has changed', status: 412, detail: '' }, { status: 412, statusText: 'Precondition Failed' });
    await settle();
    http.expectOne(`/api/v1/models/${id()}`).flush(model({ id: id(), revision: 2, updatedBy: ADA }), { headers: { ETag: `"${id()}-r2"` } });
    http.expectOne(`/api/v1/models/${id()}/revisions`).flush({ items: [] });
    await settle();
    button('Cancel', overlay()).click();
    await settle();
    fixture.detectChanges();
    expect(host.querySelector('.banner.unsaved')?.textContent).toContain('compensator, gain, targets');
    expect((host.querySelector('input[aria-label="Zero 1 real part"]') as HTMLInputElement).value).toBe('-2');
  });

  it('shows the API’s field errors of a refused save at the fields', async () => {
    await open(['models:read', 'models:write']);
    await editDesign();
    (await saveDialog('Lead zero')).flush(
      { title: 'The request is not valid', status: 400, detail: 'see errors', errors: [{ pointer: '/design/targets/minDampingRatio', detail: 'is not met by any gain' }, { pointer: '/compensator/zeros/0', detail: 'is too far out' }] },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    fixture.detectChanges();
    expect(host.querySelector('pwc-targets-panel mat-error')?.textContent?.trim()).toBe('is not met by any gain');
    expect(host.querySelector('pwc-compensator-table mat-error')?.textContent?.trim()).toBe('is too far out');
    expect(host.querySelector('.banner.error')?.textContent).toContain('Not saved');
  });

  it('drops unsaved edits on Revert', async () => {
    await open(['models:read', 'models:write']);
    await editDesign();
    button(/Revert/).click();
    await answerDesign();
    expect(loop().model()?.compensator).toBeNull();
    expect(loop().gain()).toBe(107);
    expect(host.querySelector('.banner.unsaved')).toBeNull();
    expect(host.querySelectorAll('pwc-compensator-table tr.mat-mdc-row').length).toBe(0);
  });

  it('asks before leaving with unsaved edits, and not without', async () => {
    await open(['models:read', 'models:write']);
    await answerDesign();
    expect(fixture.componentInstance.canLeave()).toBe(true);
    loop().setGain(50);
    await settle();
    const leaving = fixture.componentInstance.canLeave();
    expect(leaving).toBeInstanceOf(Promise);
    await settle();
    expect(overlay().textContent).toContain('Leave without saving?');
    button('Stay', overlay()).click();
    expect(await leaving).toBe(false);
  });

  it('lets a viewer explore but shows no save button and no editing', async () => {
    await open(['models:read']);
    await answerDesign();
    expect([...host.querySelectorAll('button')].some((b) => /Save as new revision/.test(b.textContent ?? ''))).toBe(false);
    const plot = host.querySelector('pwl-locus-plot') as HTMLElement;
    expect([...(plot.shadowRoot?.querySelectorAll('button') ?? [])].map((b) => b.textContent?.trim())).not.toContain('+ Zero');
    expect([...host.querySelectorAll('pwc-compensator-table button')].length).toBe(0);
    loop().setGain(50);
    await settle();
    expect(fixture.componentInstance.canLeave()).toBe(true);
    typeInto(host.querySelector('input[formcontrolname="minDampingRatio"]') as HTMLInputElement, '0.3');
    const call = await answerDesign();
    expect(call.request.body.targets).toEqual({ minDampingRatio: 0.3 });
    expect(host.querySelectorAll('pwc-feasible-ranges tr.mat-mdc-row').length).toBeGreaterThan(0);
  });
});
