/*
 * The only place HTTP statuses are chosen: every error, ours or a library's, becomes an RFC 9457
 * `application/problem+json` body `{ type, title, status, detail, instance, errors? }`. Unknown errors
 * become a generic 500; their stack is logged with the request id and never sent.
 */
import type { ErrorRequestHandler, Request, Response } from 'express';
import { plainValidatorMessage } from './validator-message.js';
import {
  ConflictError,
  describeIssues,
  ForbiddenError,
  InputError,
  type InputIssue,
  NotFoundError,
  PayloadTooLargeError,
  PreconditionFailedError,
  PreconditionRequiredError,
  RouteNotFoundError,
  TooManyRequestsError,
  UnauthorizedError,
  UnsupportedMediaTypeError,
} from './errors.js';

export * from './errors.js';

/** The problem+json body. */
export interface Problem {
  type: string;
  title: string;
  status: number;
  detail: string;
  instance: string;
  requestId?: string;
  errors?: InputIssue[];
}

interface Kind {
  status: number;
  slug: string;
  title: string;
}

const KINDS = {
  badRequest: { status: 400, slug: 'invalid-request', title: 'The request is not valid' },
  unauthorized: { status: 401, slug: 'unauthorized', title: 'Authentication required' },
  forbidden: { status: 403, slug: 'forbidden', title: 'Not allowed' },
  notFound: { status: 404, slug: 'not-found', title: 'Not found' },
  noRoute: { status: 404, slug: 'no-such-route', title: 'No such route' },
  methodNotAllowed: { status: 405, slug: 'method-not-allowed', title: 'Method not allowed' },
  notAcceptable: { status: 406, slug: 'not-acceptable', title: 'Not acceptable' },
  conflict: { status: 409, slug: 'conflict', title: 'Conflict with the current state' },
  preconditionFailed: { status: 412, slug: 'precondition-failed', title: 'The resource has changed' },
  tooLarge: { status: 413, slug: 'payload-too-large', title: 'Request body too large' },
  unsupportedMedia: { status: 415, slug: 'unsupported-media-type', title: 'Unsupported media type' },
  preconditionRequired: { status: 428, slug: 'precondition-required', title: 'If-Match required' },
  tooManyRequests: { status: 429, slug: 'too-many-requests', title: 'Too many requests' },
  internal: { status: 500, slug: 'internal', title: 'Internal server error' },
} satisfies Record<string, Kind>;

// the only detail a 500 ever sends: the cause stays in the log
const INTERNAL_DETAIL = 'Something went wrong on the server.';

// the validator's 404 means no operation of the document matches the path
const BY_STATUS = new Map<number, Kind>(Object.values(KINDS).filter((k) => k !== KINDS.notFound).map((k) => [k.status, k]));

/** The status problem.ts gives an error (for libraries that need a number, e.g. a security handler). */
export function statusOf(error: unknown): number {
  return classify(error).kind.status;
}

interface Classified {
  kind: Kind;
  detail: string;
  errors?: InputIssue[];
  headers?: Record<string, string>;
}

/**
 * Validator paths look like `/body/plant/gain`, `/query/page` or `/params/token`; body fields become
 * pointers into the body, path parameters `/path/<name>` as the Problem schema documents them.
 */
function pointerOf(path: string): string {
  const slashed = path.startsWith('.') ? path.replace(/\./g, '/') : path;
  if (slashed === '/body') return '';
  if (slashed.startsWith('/body/')) return slashed.slice('/body'.length);
  if (slashed.startsWith('/params/')) return `/path/${slashed.slice('/params/'.length)}`;
  return slashed;
}

function classify(error: unknown): Classified {
  if (error instanceof InputError) return { kind: KINDS.badRequest, detail: error.message, errors: [...error.issues] };
  if (error instanceof UnauthorizedError) return { kind: KINDS.unauthorized, detail: error.message, headers: { 'WWW-Authenticate': 'Bearer' } };
  if (error instanceof ForbiddenError) return { kind: KINDS.forbidden, detail: error.message };
  if (error instanceof NotFoundError) return { kind: KINDS.notFound, detail: error.message };
  if (error instanceof RouteNotFoundError) return { kind: KINDS.noRoute, detail: error.message };
  if (error instanceof ConflictError) return { kind: KINDS.conflict, detail: error.message };
  if (error instanceof PreconditionFailedError) return { kind: KINDS.preconditionFailed, detail: error.message };
  if (error instanceof PreconditionRequiredError) return { kind: KINDS.preconditionRequired, detail: error.message };
  if (error instanceof PayloadTooLargeError) return { kind: KINDS.tooLarge, detail: error.message };
  if (error instanceof UnsupportedMediaTypeError) return { kind: KINDS.unsupportedMedia, detail: error.message };
  if (error instanceof TooManyRequestsError) {
    return { kind: KINDS.tooManyRequests, detail: error.message, headers: { 'Retry-After': String(error.retryAfterSeconds) } };
  }
  if (typeof error !== 'object' || error === null) return { kind: KINDS.internal, detail: INTERNAL_DETAIL };
  const e = error as { name?: unknown; issues?: unknown; type?: unknown; status?: unknown; code?: unknown; errors?: unknown; message?: unknown; headers?: unknown };
  // the core's ValidationError: issues are JSON Pointers into the request body already
  if (e.name === 'ValidationError' && Array.isArray(e.issues)) {
    const issues = (e.issues as InputIssue[]).map((i) => ({ pointer: String(i.pointer), detail: String(i.detail) }));
    return { kind: KINDS.badRequest, detail: describeIssues(issues), errors: issues };
  }
  // body-parser (express.json)
  if (e.type === 'entity.too.large') return { kind: KINDS.tooLarge, detail: 'The JSON body is larger than allowed.' };
  if (e.type === 'entity.parse.failed') return { kind: KINDS.badRequest, detail: 'The body is not valid JSON.', errors: [{ pointer: '', detail: 'not valid JSON' }] };
  if (e.type === 'encoding.unsupported' || e.type === 'charset.unsupported') return { kind: KINDS.unsupportedMedia, detail: String(e.message) };
  // multer
  if (e.name === 'MulterError') {
    if (e.code === 'LIMIT_FILE_SIZE' || e.code === 'LIMIT_FIELD_VALUE') return { kind: KINDS.tooLarge, detail: 'The uploaded file is larger than allowed.' };
    return { kind: KINDS.badRequest, detail: String(e.message) };
  }
  // express-openapi-validator's HttpError family: { status, errors: [{ path, message }] }
  if (typeof e.status === 'number' && Array.isArray(e.errors)) {
    const kind = BY_STATUS.get(e.status) ?? (e.status >= 500 ? KINDS.internal : KINDS.badRequest);
    const items = e.errors as { path?: string; message?: string }[];
    const errors = kind.status === 400 ? items.map((i) => ({ pointer: pointerOf(String(i.path ?? '')), detail: plainValidatorMessage(String(i.message ?? 'invalid')) })) : undefined;
    const headers: Record<string, string> = {};
    const allow = (e.headers as { Allow?: string } | undefined)?.Allow;
    if (allow) headers['Allow'] = allow;
    if (kind.status === 401) headers['WWW-Authenticate'] = 'Bearer';
    const detail = kind.status === 500 ? INTERNAL_DETAIL : errors ? describeIssues(errors) : String(e.message ?? kind.title);
    return { kind, detail, errors, headers };
  }
  return { kind: KINDS.internal, detail: INTERNAL_DETAIL };
}

/** Writes a problem+json response. */
export function sendProblem(req: Request, res: Response, error: unknown): void {
  const { kind, detail, errors, headers } = classify(error);
  const requestId = res.locals['requestId'] as string | undefined;
  const body: Problem = { type: `urn:polewright:problem:${kind.slug}`, title: kind.title, status: kind.status, detail, instance: req.originalUrl.split('?')[0] ?? '/' };
  if (requestId) body.requestId = requestId;
  if (errors) body.errors = errors;
  for (const [name, value] of Object.entries(headers ?? {})) res.setHeader(name, value);
  res.status(kind.status).type('application/problem+json').send(JSON.stringify(body));
}

/** The app's one error handler. `log` receives unknown (500) errors in full. */
export function problemHandler(log: (message: string, error: unknown) => void): ErrorRequestHandler {
  return (error, req, res, next) => {
    if (res.headersSent) return next(error);
    if (statusOf(error) >= 500) log(`request ${String(res.locals['requestId'] ?? '?')} ${req.method} ${req.originalUrl} failed`, error);
    sendProblem(req, res, error);
  };
}
