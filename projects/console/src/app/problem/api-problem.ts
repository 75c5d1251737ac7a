import { HttpErrorResponse } from '@angular/common/http';

/** One field at fault: a JSON Pointer into the request body (or `/query/<name>`) and the reason. */
export interface FieldProblem {
  readonly pointer: string;
  readonly detail: string;
}

/**
 * An RFC 9457 problem the API answered (or one made up for a failure that never reached it), as a typed
 * value: every failed API call in the console ends up as one of these.
 */
export class ApiProblem extends Error {
  override readonly name = 'ApiProblem';

  constructor(
    /** HTTP status; 0 when the server could not be reached. */
    readonly status: number,
    /** Fixed per kind of problem ("Invalid request", "Precondition failed"…). */
    readonly title: string,
    /** What went wrong this time. */
    readonly detail: string,
    /** Fields at fault (validation problems). */
    readonly errors: readonly FieldProblem[] = [],
    /** The server's request id, to quote when reporting a 500. */
    readonly requestId: string | null = null,
  ) {
    super(detail ? `${title}: ${detail}` : title);
  }

  /** Whether the problem names fields at fault. */
  get hasFieldErrors(): boolean {
    return this.errors.length > 0;
  }
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function fieldProblems(value: unknown): FieldProblem[] {
  if (!Array.isArray(value)) return [];
  return value
    .filter(isRecord)
    .map((e) => ({ pointer: typeof e['pointer'] === 'string' ? e['pointer'] : '', detail: typeof e['detail'] === 'string' ? e['detail'] : String(e['detail'] ?? '') }));
}

/** Parses a body that may be a problem+json object, a JSON string of one, or something else entirely. */
function problemBody(body: unknown): Record<string, unknown> | null {
  if (isRecord(body)) return body;
  if (typeof body === 'string') {
    try {
      const parsed: unknown = JSON.parse(body);
      return isRecord(parsed) ? parsed : null;
    } catch {
      return null;
    }
  }
  return null;
}

/** What to say when the server answered without a problem body. */
function fallbackTitle(status: number): string {
  if (status === 0) return 'Server not reachable';
  if (status >= 500) return 'Server error';
  return `Request failed (HTTP ${status})`;
}

/**
 * Turns whatever a failed call threw into an `ApiProblem`: a problem+json body keeps its title, detail and
 * field errors; a network failure (status 0) says the server could not be reached.
 */
export function toProblem(error: unknown): ApiProblem {
  if (error instanceof ApiProblem) return error;
  if (error instanceof HttpErrorResponse) {
    const body = problemBody(error.error);
    if (body && typeof body['title'] === 'string') {
      return new ApiProblem(
        typeof body['status'] === 'number' ? body['status'] : error.status,
        body['title'],
        typeof body['detail'] === 'string' ? body['detail'] : '',
        fieldProblems(body['errors']),
        typeof body['requestId'] === 'string' ? body['requestId'] : null,
      );
    }
    const detail = error.status === 0 ? 'Check the network connection and that the Polewright server is running.' : error.statusText || error.message;
    return new ApiProblem(error.status, fallbackTitle(error.status), detail);
  }
  return new ApiProblem(0, 'Unexpected error', error instanceof Error ? error.message : String(error));
}

/** One line for a snackbar or a banner: title, detail and, for server errors, the request id. */
export function problemSummary(problem: ApiProblem): string {
  const parts = [problem.title];
  if (problem.detail && problem.detail !== problem.title) parts.push(problem.detail);
  let text = parts.join(': ');
  if (problem.status >= 500 && problem.requestId) text += ` (request ${problem.requestId})`;
  return text;
}
