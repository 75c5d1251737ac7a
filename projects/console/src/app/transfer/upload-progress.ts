import { type HttpEvent, HttpEventType } from '@angular/common/http';
import type { Schemas } from '../api/api-types';

/** The outcome of an import (`ImportResult`). */
export type ImportResult = Schemas['ImportResult'];

/** Where an upload stands: sending (with the share sent), checked by the server, or finished. */
export interface UploadState {
  readonly phase: 'sending' | 'checking' | 'done';
  /** Share of the file sent, 0–100. */
  readonly percent: number;
  readonly result: ImportResult | null;
}

/** The state before the first event. */
export const UPLOAD_START: UploadState = { phase: 'sending', percent: 0, result: null };

/**
 * The next state after an HTTP event of the upload: progress events move the share sent; when all of it is
 * sent the server checks the rows; the response holds the result (and means every byte arrived).
 */
export function uploadStep(state: UploadState, event: HttpEvent<ImportResult>): UploadState {
  switch (event.type) {
    case HttpEventType.UploadProgress: {
      const percent = event.total ? Math.min(100, Math.round((100 * event.loaded) / event.total)) : state.percent;
      return { ...state, percent, phase: percent >= 100 ? 'checking' : 'sending' };
    }
    case HttpEventType.Response:
      return { phase: 'done', percent: 100, result: event.body };
    default:
      return state;
  }
}
