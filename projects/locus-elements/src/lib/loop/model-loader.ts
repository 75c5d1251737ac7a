import { HttpClient, HttpErrorResponse, HttpHeaders } from '@angular/common/http';
import type { DesignTargets } from '@polewright/locus-core';
import { map, retry, throwError, timer, type Observable } from 'rxjs';
import { describeError } from './loop-message';
import { readModel, type LoopModel } from './loop-model';

/** Where a saved model lives: `GET {apiBase}/v1/models/{modelId}` with `Authorization: Bearer {token}`. */
export interface ApiModelRequest {
  readonly apiBase: string;
  readonly modelId: string;
  readonly token: string;
}

/** How often and how patiently a failed request is repeated (network errors, 5xx and 429 only). */
export interface RetryPolicy {
  /** Repeats after the first attempt. */
  readonly retries: number;
  /** Wait before the first repeat; each further repeat waits twice as long. */
  readonly baseDelayMs: number;
}

/** Three repeats after 0.4 s, 0.8 s and 1.6 s. */
export const DEFAULT_RETRY: RetryPolicy = { retries: 3, baseDelayMs: 400 };

/** A Model resource read into what the elements use. */
export interface LoadedModel {
  readonly model: LoopModel;
  /** The saved design gain, when there is one. */
  readonly gain: number | null;
  readonly targets: DesignTargets | null;
}

/** The URL of a model resource; a trailing slash on `apiBase` is tolerated. */
export function modelUrl(request: ApiModelRequest): string {
  return `${request.apiBase.replace(/\/+$/, '')}/v1/models/${encodeURIComponent(request.modelId)}`;
}

/**
 * Fetches one Model resource with the embed token, repeating with exponential backoff after network
 * failures and 5xx/429 answers; errors out with a readable `Error` (see `loadErrorMessage`).
 */
export function fetchModel(http: HttpClient, request: ApiModelRequest, policy: RetryPolicy = DEFAULT_RETRY): Observable<LoadedModel> {
  const headers = new HttpHeaders({ Authorization: `Bearer ${request.token}`, Accept: 'application/json' });
  return http.get<unknown>(modelUrl(request), { headers }).pipe(
    retry({
      count: policy.retries,
      delay: (error: unknown, attempt: number) => (isRetryable(error) ? timer(policy.baseDelayMs * 2 ** (attempt - 1)) : throwError(() => error)),
    }),
    map((body) => readResource(body)),
  );
}

/** Whether a failed request is worth repeating: no answer at all, a server fault, or too many requests. */
export function isRetryable(error: unknown): boolean {
  return error instanceof HttpErrorResponse && (error.status === 0 || error.status >= 500 || error.status === 429);
}

/** The message an element shows when loading fails, with the API's problem `title` and `detail` when given. */
export function loadErrorMessage(error: unknown, request: ApiModelRequest, policy: RetryPolicy = DEFAULT_RETRY): string {
  if (!(error instanceof HttpErrorResponse)) return describeError(error);
  const problem = problemText(error.error);
  const said = problem ? ` The API says: ${problem}` : '';
  switch (error.status) {
    case 0:
      return `The API at ${request.apiBase} could not be reached after ${policy.retries + 1} attempts (network error, or the request was blocked by the browser's cross-origin rules).`;
    case 401:
      return `The embed token was not accepted (401): it may have expired or been revoked; ask for a new token for this page.${said}`;
    case 403:
      return `This token may not read model ${request.modelId} from this page (403).${said}`;
    case 404:
      return `No model ${request.modelId} was found (404).${said}`;
    default:
      return error.status >= 500 || error.status === 429
        ? `The API could not answer (${error.status}) after ${policy.retries + 1} attempts.${said}`
        : `The API refused the request (${error.status}).${said}`;
  }
}

function readResource(body: unknown): LoadedModel {
  if (typeof body !== 'object' || body === null) throw new Error('The API answered with something that is not a model.');
  const record = body as Record<string, unknown>;
  const model = readModel({ plant: record['plant'], compensator: record['compensator'] ?? null, ...(typeof record['name'] === 'string' ? { name: record['name'] } : {}) });
  const design = (record['design'] ?? null) as { gain?: unknown; targets?: unknown } | null;
  const gain = typeof design?.gain === 'number' && Number.isFinite(design.gain) ? design.gain : null;
  const targets = typeof design?.targets === 'object' && design.targets !== null ? (design.targets as DesignTargets) : null;
  return { model, gain, targets };
}

function problemText(body: unknown): string {
  if (typeof body === 'string') return body.trim().slice(0, 300);
  if (typeof body !== 'object' || body === null) return '';
  const record = body as Record<string, unknown>;
  const title = typeof record['title'] === 'string' ? record['title'] : '';
  const detail = typeof record['detail'] === 'string' ? record['detail'] : '';
  if (title && detail) return `${title}: ${detail}`;
  return title || detail;
}
