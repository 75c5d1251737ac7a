import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter, Router } from '@angular/router';
import { normalizePlant, ValidationError } from '@polewright/locus-core';
import type { Model, RevisionSummary } from '../api/api-types';
import { Notices } from '../problem/notices';
import { problemInterceptor } from '../problem/problem-interceptor';
import { Session } from '../session/session';
import { FIRST_COMMENT, ModelEditor } from './model-editor';

const EMIL = { id: 'u-emil', email: 'emil.engineer@quillfield.example', name: 'Emil Varga-Lund' };
const ADA = { id: 'u-ada', email: 'ada.admin@quillfield.example', name: 'Ada Okafor' };
const BELT = '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))';

function model(overrides: Partial<Model> = {}): Model {
  return {
    id: 'm-belt',
    name: 'Line 3 belt speed',
    description: 'Speed loop of the main belt drive.',
    tags: ['conveyor', 'speed'],
    plant: { expression: BELT },
    compensator: null,
    design: { gain: 8.35, targets: null },
    revision: 1,
    createdAt: '2026-12-01T09:00:00.000Z',
    updatedAt: '2026-12-01T09:00:00.000Z',
    createdBy: EMIL,
    updatedBy: EMIL,
    deletedAt: null,
    ...overrides,
  };
}

/** The engine's own message for a plant (what the API would answer), or null when it accepts it. */
function engineMessage(plant: unknown): string | null {
  try {
    normalizePlant(plant, '/plant');
    return null;
  } catch (error) {
    return error instanceof ValidationError ? error.issues[0].detail : String(error);
  }
}

// the preview elements compute the locus in jsdom: slower than a plain form
describe('ModelEditor', { timeout: 60000 }, () => {
  let http: HttpTestingController;
  let notices: { done: ReturnType<typeof vi.fn>; problem: ReturnType<typeof vi.fn> };
  let fixture: ComponentFixture<ModelEditor>;
  let host: HTMLElement;
  let navigate: ReturnType<typeof vi.spyOn>;

  async function settle(): Promise<void> {
    for (let i = 0; i < 4; i++) {
      await new Promise((resolve) => setTimeout(resolve, 0));
      TestBed.tick();
    }
  }

  /** Opens the editor: a new model, or the edit of `saved` (answered with its ETag). */
  async function open(saved?: Model): Promise<void> {
    notices = { done: vi.fn(), problem: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([problemInterceptor])),
        provideHttpClientTesting(),
        { provide: Notices, useValue: notices },
        { provide: Session, useValue: { can: () => true, token: () => 'pws_test', forget: () => undefined } },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    fixture = TestBed.createComponent(ModelEditor);
    host = fixture.nativeElement as HTMLElement;
    if (saved) fixture.componentRef.setInput('id', saved.id);
    await settle();
    http.expectOne('/api/v1/models/tags').flush({ items: [{ tag: 'conveyor', count: 3 }] });
    if (saved) http.expectOne(`/api/v1/models/${saved.id}`).flush(saved, { headers: { ETag: `"${saved.id}-r${saved.revision}"` } });
    await settle();
  }

  function field(name: string): HTMLInputElement {
    const input = host.querySelector<HTMLInputElement>(`[formcontrolname="${name}"]`);
    if (!input) throw new Error(`no field ${name}`);
    return input;
  }

  async function typeInto(input: HTMLInputElement, value: string): Promise<void> {
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await settle();
  }

  /** The message shown under a field (mat-error), or '' when none. */
  function errorAt(input: Element): string {
    return input.closest('mat-form-field')?.querySelector('mat-error')?.textContent?.trim() ?? '';
  }

  // a button by its visible words (an icon's ligature left out)
  function button(name: string | RegExp, root: ParentNode = host): HTMLButtonElement {
    const words = (b: HTMLButtonElement): string => (b.textContent ?? '').replace(b.querySelector('mat-icon')?.textContent ?? '', '').trim();
    const found = [...root.querySelectorAll('button')].find((b) => (typeof name === 'string' ? words(b) === name : name.test(words(b))));
    if (!found) throw new Error(`no button ${String(name)}`);
    return found;
  }

  async function click(target: HTMLElement): Promise<void> {
    target.click();
    await settle();
  }

  async function save(): Promise<void> {
    await click(button(/^(Create model|Save revision)$/));
  }

  afterEach(() => {
    try {
      http.verify();
    } finally {
      document.querySelector('.cdk-overlay-container')?.replaceChildren();
      TestBed.resetTestingModule();
    }
  });

  describe('each plant form builds the right plant body', () => {
    it('creates a model from an expression, with the first revision comment by default', async () => {
      await open();
      await typeInto(field('name'), 'Tail conveyor take-up');
      await typeInto(field('expression'), ' 3.2*(s+2)/(s*(s+0.8)*(s^2+3*s+14)) ');
      await save();
      const post = http.expectOne((r) => r.method === 'POST' && r.url === '/api/v1/models');
      expect(post.request.body).toEqual({
        name: 'Tail conveyor take-up',
        description: '',
        tags: [],
        plant: { expression: '3.2*(s+2)/(s*(s+0.8)*(s^2+3*s+14))' },
        compensator: null,
        design: { gain: null, targets: null },
        comment: FIRST_COMMENT,
      });
      post.flush({ ...model({ id: 'm-new', name: 'Tail conveyor take-up' }) }, { status: 201, statusText: 'Created', headers: { ETag: '"m-new-r1"' } });
      await settle();
      expect(notices.done).toHaveBeenCalledWith('Saved as revision 1');
      expect(navigate).toHaveBeenCalledWith(['/models', 'm-new']);
    });

    it('sends coefficient lists, a sampled domain with its period and the dead time in samples', async () => {
      await open();
      await typeInto(field('name'), 'Charger current (sampled)');
      await click(button('Coefficients'));
      await typeInto(field('numerator'), '0.08, 0.056');
      await typeInto(field('denominator'), '1 -1.62 0.62');
      await click(button('Sampled (z)'));
      await typeInto(field('sampleTime'), '0.05');
      await typeInto(field('deadTime'), '0.1');
      await save();
      const post = http.expectOne('/api/v1/models');
      expect(post.request.body.plant).toEqual({ numerator: [0.08, 0.056], denominator: [1, -1.62, 0.62], domain: 'z', sampleTime: 0.05, deadTime: 0.1 });
      post.flush(model({ id: 'm-z' }), { status: 201, statusText: 'Created' });
      await settle();
    });

    it('sends poles, zeros and gain, and offers the missing conjugate of a complex pole', async () => {
      await open();
      await typeInto(field('name'), 'Hoist trolley');
      await click(button('Poles, zeros, gain'));
      await click(button('Add a zero'));
      await typeInto(host.querySelector('input[aria-label="Zero 1, real part"]') as HTMLInputElement, '-3');
      await click(button('Add a pole'));
      await typeInto(host.querySelector('input[aria-label="Pole 1, real part"]') as HTMLInputElement, '0');
      await click(button('Add a pole'));
      await typeInto(host.querySelector('input[aria-label="Pole 2, real part"]') as HTMLInputElement, '-1.3');
      await typeInto(host.querySelector('input[aria-label="Pole 2, imaginary part"]') as HTMLInputElement, '2.1');
      // the engine refuses the lone complex pole (its words, at the list) and the row offers the conjugate
      expect(host.querySelector('pwc-complex-list:last-of-type')?.textContent).toContain(engineMessage({ poles: [{ re: 0 }, { re: -1.3, im: 2.1 }] }));
      await save();
      http.expectNone('/api/v1/models');
      await click(button('Add −1.3 − 2.1j'));
      await typeInto(field('gain'), '2.4');
      await save();
      const post = http.expectOne('/api/v1/models');
      expect(post.request.body.plant).toEqual({
        zeros: [{ re: -3, im: 0 }],
        poles: [{ re: 0, im: 0 }, { re: -1.3, im: 2.1 }, { re: -1.3, im: -2.1 }],
        gain: 2.4,
      });
      post.flush(model({ id: 'm-f' }), { status: 201, statusText: 'Created' });
      await settle();
    });

    it('converts the current plant when the form is switched (expression → poles, zeros, gain → coefficients)', async () => {
      await open();
      await typeInto(field('expression'), '4*(s+3)/(s*(s^2+4*s+5))');
      await click(button('Poles, zeros, gain'));
      expect((host.querySelector('input[aria-label="Pole 2, real part"]') as HTMLInputElement).value).toBe('-2');
      expect(field('gain').value).toBe('4');
      await click(button('Coefficients'));
      expect(field('numerator').value).toBe('4 12');
      expect(field('denominator').value).toBe('1 4 5 0');
      expect(field('denominator').closest('mat-form-field')?.textContent).toContain('Reads as s³ + 4s² + 5s');
    });
  });

  it('shows why a coefficient list cannot be read at its field, and sends nothing', async () => {
    await open();
    await typeInto(field('name'), 'Dryer');
    await click(button('Coefficients'));
    await typeInto(field('numerator'), '0.85');
    await typeInto(field('denominator'), '266 45 1x');
    expect(errorAt(field('denominator'))).toBe('"1x" (coefficient 3) is not a number. Separate the numbers with spaces or commas and write decimals with a point.');
    await typeInto(field('denominator'), '');
    expect(errorAt(field('denominator'))).toBe('Give at least one coefficient, highest power first, e.g. "1 0.9 0".');
    await save();
    http.expectNone('/api/v1/models');
  });

  it('puts the engine’s own message at the expression field while typing, and saves nothing', async () => {
    await open();
    await typeInto(field('name'), 'Improper');
    await typeInto(field('expression'), '(s+1)^2/(s+3)');
    const expected = engineMessage({ expression: '(s+1)^2/(s+3)' });
    expect(expected).toContain('the plant must be proper');
    expect(errorAt(field('expression'))).toBe(expected);
    await typeInto(field('expression'), '1/(s+1');
    expect(errorAt(field('expression'))).toBe(engineMessage({ expression: '1/(s+1' }));
    await save();
    http.expectNone('/api/v1/models');
    expect(host.querySelector('.summary')?.textContent).toContain('correct the marked fields');
  });

  it('says so when the preview shows the last valid plant', async () => {
    await open(model());
    expect(host.querySelector('.preview-note')?.textContent).toContain('Root locus of the plant as typed');
    await typeInto(field('expression'), '9.5*(s+1.5)/(s*(s+0.9)');
    await new Promise((resolve) => setTimeout(resolve, 350));
    await settle();
    expect(host.querySelector('.preview-note')?.textContent).toContain('Showing the last valid plant');
    expect(host.querySelector('pwl-locus-plot')).not.toBeNull();
  });

  it('places the API’s 400 pointers at their fields and the rest in the summary above the form', async () => {
    await open();
    await typeInto(field('name'), 'Belt');
    await typeInto(field('expression'), BELT);
    await save();
    http.expectOne('/api/v1/models').flush(
      {
        type: 'urn:polewright:problem:invalid-request',
        title: 'Invalid request',
        status: 400,
        detail: 'See errors.',
        errors: [
          { pointer: '/name', detail: 'is already used by another model of this team' },
          { pointer: '/tags/0', detail: 'must be lowercase words joined by hyphens (a-z, 0-9), at most 40 characters' },
          { pointer: '/plant/expression', detail: 'multiplies out beyond degree 60' },
          { pointer: '/design/targets/minDampingRatio', detail: 'must be between 0 and 1' },
        ],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    expect(errorAt(field('name'))).toBe('is already used by another model of this team');
    expect(errorAt(field('expression'))).toBe('multiplies out beyond degree 60');
    expect(errorAt(host.querySelector('mat-chip-grid') as Element)).toBe('must be lowercase words joined by hyphens (a-z, 0-9), at most 40 characters');
    const summary = host.querySelector('.summary')?.textContent ?? '';
    expect(summary).toContain('Design targets: must be between 0 and 1');
    expect(summary).not.toContain('already used');
    expect(notices.problem).not.toHaveBeenCalled();
  });

  it('requires a revision comment when editing, and keeps the compensator and design as loaded', async () => {
    const compensator = { zeros: [{ re: -2, im: 0 }], poles: [{ re: -9, im: 0 }], gain: 1.5 };
    await open(model({ compensator, design: { gain: 8.35, targets: { minDampingRatio: 0.4 } } }));
    await typeInto(field('description'), 'Speed loop of the main belt drive, new gearbox.');
    await save();
    http.expectNone('/api/v1/models/m-belt');
    expect(errorAt(field('comment'))).toBe('Required.');
    await typeInto(field('comment'), 'Gearbox replaced');
    await save();
    const put = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/v1/models/m-belt');
    expect(put.request.headers.get('If-Match')).toBe('"m-belt-r1"');
    expect(put.request.body).toMatchObject({ plant: { expression: BELT }, compensator, design: { gain: 8.35, targets: { minDampingRatio: 0.4 } }, comment: 'Gearbox replaced' });
    put.flush(model({ revision: 2 }), { headers: { ETag: '"m-belt-r2"' } });
    await settle();
    expect(notices.done).toHaveBeenCalledWith('Saved as revision 2');
    expect(navigate).toHaveBeenCalledWith(['/models', 'm-belt']);
  });

  describe('a stale edit (412)', () => {
    const theirs = model({ revision: 2, description: 'Speed loop of the main belt drive; torsional mode retuned.', tags: ['conveyor', 'speed', 'retuned'], updatedBy: ADA, updatedAt: '2026-12-02T10:15:00.000Z' });
    const history: RevisionSummary[] = [
      { revision: 2, comment: 'Torsional mode measured again', createdAt: '2026-12-02T10:15:00.000Z', author: ADA, contentHash: 'b' },
      { revision: 1, comment: 'First model', createdAt: '2026-12-01T09:00:00.000Z', author: EMIL, contentHash: 'a' },
    ];

    async function conflict(): Promise<TestRequest> {
      await open(model());
      await typeInto(field('expression'), '9.5*(s+1.5)/(s*(s+1.1)*(s^2+3.2*s+52))');
      await typeInto(field('comment'), 'Motor lag from the new drive');
      await save();
      const put = http.expectOne((r) => r.method === 'PUT');
      put.flush({ type: 'urn:polewright:problem:precondition-failed', title: 'Precondition failed', status: 412, detail: 'The model is at revision 2.' }, { status: 412, statusText: 'Precondition Failed' });
      await settle();
      http.expectOne('/api/v1/models/m-belt').flush(theirs, { headers: { ETag: '"m-belt-r2"' } });
      http.expectOne('/api/v1/models/m-belt/revisions').flush({ items: history });
      await settle();
      return put;
    }

    it('shows the conflict panel with who saved which revision, and keeps the typed values', async () => {
      const put = await conflict();
      expect(put.request.headers.get('If-Match')).toBe('"m-belt-r1"');
      const panel = host.querySelector('pwc-conflict-panel') as HTMLElement;
      expect(panel).not.toBeNull();
      expect(panel.textContent).toContain('Revision 2 saved by Ada Okafor (ada.admin@quillfield.example)');
      expect(panel.textContent).toContain('Torsional mode measured again');
      expect(panel.textContent).not.toContain('First model');
      const rows = [...panel.querySelectorAll('tbody tr')].map((row) => row.getAttribute('data-field'));
      expect(rows).toEqual(['description', 'tags', 'plant']);
      expect(panel.querySelector('tr[data-field="plant"] .who')?.textContent).toBe('changed by you');
      // their 0.9 struck through, my 1.1 marked as inserted
      expect(panel.querySelector('tr[data-field="plant"] td.theirs')?.textContent?.replace(/\s+/g, '')).toContain('(s+0.9)');
      expect(panel.querySelector('tr[data-field="plant"] td.mine')?.textContent?.replace(/\s+/g, '')).toContain('(s+1.1)');
      expect(panel.querySelectorAll('tr[data-field="plant"] td.theirs del').length).toBeGreaterThan(0);
      expect(panel.querySelectorAll('tr[data-field="plant"] td.mine ins').length).toBeGreaterThan(0);
      expect(field('expression').value).toBe('9.5*(s+1.5)/(s*(s+1.1)*(s^2+3.2*s+52))');
      expect(field('comment').value).toBe('Motor lag from the new drive');
      expect(notices.problem).not.toHaveBeenCalled();
    });

    it('saves mine on top with If-Match of their revision', async () => {
      await conflict();
      await click(button('Save mine as revision 3 on top'));
      const put = http.expectOne((r) => r.method === 'PUT');
      expect(put.request.headers.get('If-Match')).toBe('"m-belt-r2"');
      expect(put.request.body).toMatchObject({ plant: { expression: '9.5*(s+1.5)/(s*(s+1.1)*(s^2+3.2*s+52))' }, description: 'Speed loop of the main belt drive.', comment: 'Motor lag from the new drive' });
      put.flush(model({ revision: 3 }), { headers: { ETag: '"m-belt-r3"' } });
      await settle();
      expect(notices.done).toHaveBeenCalledWith('Saved as revision 3');
    });

    it('takes their changes to the fields I left alone, keeping mine', async () => {
      await conflict();
      await click(button(/^Take their changes to fields you left alone/));
      expect(field('description').value).toBe(theirs.description);
      expect(field('expression').value).toBe('9.5*(s+1.5)/(s*(s+1.1)*(s^2+3.2*s+52))');
      const rows = [...host.querySelectorAll('pwc-conflict-panel tbody tr')].map((row) => row.getAttribute('data-field'));
      expect(rows).toEqual(['plant']);
    });

    it('discards mine and loads theirs on request', async () => {
      await conflict();
      await click(button('Discard mine and load theirs'));
      expect(host.querySelector('pwc-conflict-panel')).toBeNull();
      expect(field('expression').value).toBe(BELT);
      expect(field('description').value).toBe(theirs.description);
      expect(field('comment').value).toBe('');
      await typeInto(field('comment'), 'On top of revision 2');
      await save();
      const put = http.expectOne((r) => r.method === 'PUT');
      expect(put.request.headers.get('If-Match')).toBe('"m-belt-r2"');
      put.flush(model({ revision: 3 }));
      await settle();
    });
  });

  it('asks before leaving with unsaved changes, and not without', async () => {
    await open(model());
    const editor = fixture.componentInstance;
    await expect(editor.canLeave()).resolves.toBe(true);
    await typeInto(field('name'), 'Line 3 belt speed (renamed)');
    const leaving = editor.canLeave();
    await settle();
    const dialog = document.querySelector('pwc-confirm-action-dialog') as HTMLElement;
    expect(dialog.textContent).toContain('Leave without saving?');
    button('Stay and keep editing', dialog).click();
    await expect(leaving).resolves.toBe(false);
  });
});
