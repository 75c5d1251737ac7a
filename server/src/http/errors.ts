/*
 * The named errors services throw. They carry no HTTP knowledge: `problem.ts` alone turns them into
 * statuses and problem+json bodies.
 */

/** One field at fault, as a JSON Pointer into the request (body fields as `/name`, others as `/query/page`). */
export interface InputIssue {
  readonly pointer: string;
  readonly detail: string;
}

/** The fields at fault in one line: `/plant/gain: must be a number; /name: is required` (`/` for the whole body). */
export function describeIssues(issues: readonly InputIssue[]): string {
  return issues.map((i) => `${i.pointer || '/'}: ${i.detail}`).join('; ');
}

/** Base of the named errors below: each one's `name` is its class name (as stack traces and logs show it). */
export abstract class ServiceError extends Error {
  constructor(message?: string) {
    super(message);
    this.name = new.target.name;
  }
}

/** The thing asked for does not exist (or is not visible to the caller). */
export class NotFoundError extends ServiceError {
  constructor(readonly what: string) {
    super(`${what} was not found`);
  }
}

/** No route answers this path (as opposed to a resource that does not exist). */
export class RouteNotFoundError extends ServiceError {
  constructor(readonly method: string, readonly path: string) {
    super(`No route answers ${method} ${path}.`);
  }
}

/** The request clashes with the current state (duplicate e-mail, last admin, …). */
export class ConflictError extends ServiceError {}

/** A precondition (If-Match) does not hold: the resource changed meanwhile. */
export class PreconditionFailedError extends ServiceError {}

/** A conditional header (If-Match) is required and missing. */
export class PreconditionRequiredError extends ServiceError {
  constructor(detail = 'This request needs an If-Match header with the ETag of the current revision.') {
    super(detail);
  }
}

/** No valid credentials: missing, malformed, unknown, expired or revoked token, or wrong password. */
export class UnauthorizedError extends ServiceError {
  constructor(detail = 'A valid bearer token is required.') {
    super(detail);
  }
}

/** Valid credentials that do not allow this request (role, scope, model or origin). */
export class ForbiddenError extends ServiceError {
  constructor(detail = 'This token does not allow this request.') {
    super(detail);
  }
}

/** The body or upload is larger than allowed. */
export class PayloadTooLargeError extends ServiceError {
  constructor(detail = 'The request body is larger than allowed.') {
    super(detail);
  }
}

/** The body's media type is not one this route takes. */
export class UnsupportedMediaTypeError extends ServiceError {
  constructor(detail = 'This media type is not accepted here.') {
    super(detail);
  }
}

/** Too many requests in the current window; `retryAfterSeconds` says when to try again. */
export class TooManyRequestsError extends ServiceError {
  constructor(readonly retryAfterSeconds: number) {
    super(`Too many requests; retry after ${retryAfterSeconds} s.`);
  }
}

/** Bad input, with every field at fault. */
export class InputError extends ServiceError {
  constructor(readonly issues: readonly InputIssue[]) {
    super(describeIssues(issues));
  }

  /** Shorthand for one field at fault. */
  static at(pointer: string, detail: string): InputError {
    return new InputError([{ pointer, detail }]);
  }
}
