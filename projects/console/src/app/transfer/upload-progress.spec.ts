import { HttpEventType, HttpHeaders, HttpResponse } from '@angular/common/http';
import { type ImportResult, UPLOAD_START, uploadStep } from './upload-progress';

const RESULT: ImportResult = { format: 'csv', created: 1, rejected: 0, results: [{ row: 1, status: 'created', id: 'm-1', name: 'Belt' }] };

describe('uploadStep', () => {
  it('follows the share sent, then waits for the server’s check, then holds the result', () => {
    let state = uploadStep(UPLOAD_START, { type: HttpEventType.Sent });
    expect(state).toEqual(UPLOAD_START);
    state = uploadStep(state, { type: HttpEventType.UploadProgress, loaded: 333, total: 1000 });
    expect(state).toEqual({ phase: 'sending', percent: 33, result: null });
    state = uploadStep(state, { type: HttpEventType.UploadProgress, loaded: 1000, total: 1000 });
    expect(state).toEqual({ phase: 'checking', percent: 100, result: null });
    state = uploadStep(state, new HttpResponse({ body: RESULT, status: 200, headers: new HttpHeaders() }));
    expect(state).toEqual({ phase: 'done', percent: 100, result: RESULT });
  });

  it('keeps the share when the total is unknown, and a response means every byte arrived', () => {
    const state = uploadStep({ phase: 'sending', percent: 40, result: null }, { type: HttpEventType.UploadProgress, loaded: 900 });
    expect(state.percent).toBe(40);
    expect(uploadStep(state, new HttpResponse({ body: RESULT, status: 200 })).percent).toBe(100);
  });
});
