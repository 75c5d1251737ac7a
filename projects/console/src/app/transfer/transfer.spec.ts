import { HttpClient, HttpEventType, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { inject, signal } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Me } from '../api/api-types';
import { UPLOAD_HTTP } from '../api/upload-http';
import { problemInterceptor } from '../problem/problem-interceptor';
import { Notices } from '../problem/notices';
import { Session } from '../session/session';
import { MAX_IMPORT_BYTES } from './import-file';
import { Transfer } from './transfer';

const PERMISSIONS: Record<'engineer' | 'viewer', Me['permissions']> = { engineer: ['models:read', 'models:write', 'compute'], viewer: ['models:read', 'compute'] };

/** A stand-in for the signed-in person of a role. */
function sessionOf(role: 'engineer' | 'viewer'): Partial<Session> {
  return { me: signal({ permissions: PERMISSIONS[role] } as Me), role: signal(role), can: (p) => PERMISSIONS[role].includes(p) };
}

/** A FileList of one file, as the file button or a drop hands it over. */
function filesOf(file: File): FileList {
  return { length: 1, item: (i: number) => (i === 0 ? file : null), 0: file } as unknown as FileList;
}

// the first test of a file also pays for loading Material on a busy machine: a generous time limit
describe('Transfer', { timeout: 20000 }, () => {
  let fixture: ComponentFixture<Transfer>;
  let http: HttpTestingController;
  let host: HTMLElement;
  let notices: { done: ReturnType<typeof vi.fn>; problem: ReturnType<typeof vi.fn> };
  const text = (selector: string) => (host.querySelector(selector)?.textContent ?? '').replace(/\s+/g, ' ').trim();
  const render = async () => {
    fixture.detectChanges();
    await fixture.whenStable();
    fixture.detectChanges();
  };

  async function open(role: 'engineer' | 'viewer'): Promise<void> {
    notices = { done: vi.fn(), problem: vi.fn() };
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([problemInterceptor])),
        provideHttpClientTesting(),
        // the upload client is XMLHttpRequest in the app; here it is the testing backend
        { provide: UPLOAD_HTTP, useFactory: () => inject(HttpClient) },
        { provide: Session, useValue: sessionOf(role) },
        { provide: Notices, useValue: notices },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Transfer);
    host = fixture.nativeElement as HTMLElement;
    fixture.detectChanges();
    http.expectOne('/api/v1/models/tags').flush({ items: [{ tag: 'conveyor', count: 2 }, { tag: 'web', count: 1 }] });
    await render();
  }

  function upload(file: File): TestRequest {
    fixture.componentInstance.take(filesOf(file));
    fixture.detectChanges();
    return http.expectOne('/api/v1/models/import');
  }

  afterEach(() => http.verify());

  it('shows the upload’s progress from its events, then a row per result: the created model’s link, the rejected row’s pointers and messages', async () => {
    await open('engineer');
    const request = upload(new File(['name,expression\nGood,1/(s+1)\nBad,1/(s+\n'], 'belt-loops.csv', { type: 'text/csv' }));
    expect(request.request.method).toBe('POST');
    expect((request.request.body as FormData).get('file')).toBeInstanceOf(File);
    expect(request.request.reportProgress).toBe(true);

    request.event({ type: HttpEventType.UploadProgress, loaded: 25, total: 100 });
    await render();
    expect(host.querySelector('mat-progress-bar')?.getAttribute('aria-valuenow')).toBe('25');
    expect(text('.phase')).toBe('Uploading… 25 %');

    request.event({ type: HttpEventType.UploadProgress, loaded: 100, total: 100 });
    await render();
    expect(host.querySelector('mat-progress-bar')?.getAttribute('aria-valuenow')).toBe('100');
    expect(text('.phase')).toBe('Uploaded 100 %; the server is checking the rows…');
    expect(host.querySelector('table.result-table')).toBeNull();

    request.flush({
      format: 'csv',
      created: 1,
      rejected: 1,
      results: [
        { row: 1, status: 'created', id: 'm-new', name: 'Good' },
        { row: 2, status: 'rejected', name: 'Bad', errors: [{ pointer: '/plant/expression', detail: 'cannot be parsed: Unexpected end of expression (char 6)' }, { pointer: '/design/gain', detail: 'must be a finite number or null' }] },
      ],
    });
    await render();
    expect(text('.counts')).toContain('1 created');
    expect(text('.counts')).toContain('1 rejected');
    const rows = [...host.querySelectorAll<HTMLElement>('tr[data-status]')];
    expect(rows.map((r) => r.dataset['status'])).toEqual(['created', 'rejected']);
    expect(rows[0]?.querySelector('a')?.getAttribute('href')).toBe('/models/m-new');
    expect(rows[0]?.textContent).toContain('Good');
    const errors = [...(rows[1]?.querySelectorAll('.errors li') ?? [])].map((li) => [li.querySelector('.pointer')?.textContent, li.querySelector('.message')?.textContent]);
    expect(errors).toEqual([
      ['/plant/expression', 'cannot be parsed: Unexpected end of expression (char 6)'],
      ['/design/gain', 'must be a finite number or null'],
    ]);
    expect(notices.done).toHaveBeenCalledWith('1 created, 1 rejected');

    // only the rejected rows
    [...host.querySelectorAll<HTMLButtonElement>('.results mat-button-toggle button')].find((b) => b.textContent?.includes('Rejected'))!.click();
    await render();
    expect([...host.querySelectorAll<HTMLElement>('tr[data-status]')].map((r) => r.dataset['status'])).toEqual(['rejected']);
  });

  it('checks type and size on the page and sends nothing it would refuse', async () => {
    await open('engineer');
    fixture.componentInstance.take(filesOf(new File([new Uint8Array(MAX_IMPORT_BYTES + 1)], 'all-loops.csv')));
    await render();
    expect(text('.problem span')).toBe('all-loops.csv is 1.0 MiB; the import takes files up to 1.0 MiB. Split it into smaller files.');
    fixture.componentInstance.take(filesOf(new File(['x'], 'loops.xlsx')));
    await render();
    expect(text('.problem span')).toBe('loops.xlsx is not a .json bundle or a .csv file.');
    http.expectNone('/api/v1/models/import');
  });

  it('shows why the API could not read the file at the drop zone, without a snackbar', async () => {
    await open('engineer');
    upload(new File(['speed,gain\n1,2\n'], 'wrong.csv')).flush(
      { title: 'Invalid request', status: 400, detail: 'See errors.', errors: [{ pointer: '/file', detail: 'has unknown column(s) speed, gain; the columns are name, …' }] },
      { status: 400, statusText: 'Bad Request' },
    );
    await render();
    expect(text('.problem span')).toBe('wrong.csv has unknown column(s) speed, gain; the columns are name, …');
    expect(host.querySelector('mat-progress-bar')).toBeNull();
    expect(notices.problem).not.toHaveBeenCalled();
  });

  it('offers a viewer the export but no import, and says why', async () => {
    await open('viewer');
    expect(host.querySelector('[data-testid="drop-zone"]')).toBeNull();
    expect(host.querySelector('input[type="file"]')).toBeNull();
    expect(text('.no-import')).toContain('needs the models:write permission');
    expect(text('.no-import')).toContain('Your role (viewer)');
    fixture.componentInstance.take(filesOf(new File(['x'], 'm.csv')));
    http.expectNone('/api/v1/models/import');
    expect(host.querySelector('.export button')?.textContent).toContain('Download export');
  });

  it('downloads the export of one tag under the server’s file name and counts its models', async () => {
    await open('viewer');
    const saved: string[] = [];
    URL.createObjectURL = vi.fn(() => 'blob:http://localhost/export');
    URL.revokeObjectURL = vi.fn();
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      saved.push(this.download);
    });
    fixture.componentInstance['exportTag'].setValue('web');
    const done = fixture.componentInstance.downloadExport();
    const request = http.expectOne((r) => r.url === '/api/v1/models/export');
    expect(request.request.params.get('tag')).toBe('web');
    expect(request.request.responseType).toBe('blob');
    request.flush(new Blob([JSON.stringify({ format: 'polewright-models', version: 1, models: [{ name: 'a' }, { name: 'b' }] })], { type: 'application/json' }), {
      headers: { 'Content-Disposition': 'attachment; filename="polewright-models-2026-12-02.json"' },
    });
    await done;
    await render();
    expect(saved).toEqual(['polewright-models-2026-12-02.json']);
    expect(text('.saved')).toBe('Saved polewright-models-2026-12-02.json: 2 models.');
    click.mockRestore();
  });
});
