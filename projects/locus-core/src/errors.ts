/** One problem with one field of a request, as a JSON Pointer (RFC 6901) into the request body. */
export interface FieldIssue {
  /** JSON Pointer to the field at fault, e.g. `/plant/denominator/0`. */
  readonly pointer: string;
  /** Why the value is not accepted, in plain words. */
  readonly detail: string;
}

/** Thrown at the core's entry points when a request is malformed; lists every field at fault. */
export class ValidationError extends Error {
  override readonly name = 'ValidationError';
  /** The fields at fault (at least one). */
  readonly issues: readonly FieldIssue[];

  constructor(issues: readonly FieldIssue[]) {
    super(issues.map((i) => `${i.pointer}: ${i.detail}`).join('; '));
    this.issues = issues;
  }

  /** Shorthand for a single field at fault. */
  static at(pointer: string, detail: string): ValidationError {
    return new ValidationError([{ pointer, detail }]);
  }
}
