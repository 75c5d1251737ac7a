import type { Request, Response } from 'express';
import { ValidationError } from '@polewright/locus-core';
import { describe, expect, it } from 'vitest';
import { ConflictError, InputError, NotFoundError, PreconditionFailedError, PreconditionRequiredError, sendProblem, statusOf, TooManyRequestsError } from './problem.js';

function capture(error: unknown) {
  const headers: Record<string, string> = {};
  const out = { status: 0, type: '', body: '' };
  const res = {
    locals: { requestId: 'req-1' },
    setHeader: (n: string, v: string) => void (headers[n] = v),
    status(code: number) {
      out.status = code;
      return this;
    },
    type(t: string) {
      out.type = t;
      return this;
    },
    send(b: string) {
      out.body = b;
      return this;
    },
  } as unknown as Response;
  sendProblem({ originalUrl: '/api/v1/locus?x=1' } as Request, res, error);
  return { ...out, json: JSON.parse(out.body), headers };
}

describe('problem+json mapping', () => {
  it("maps the engine's ValidationError to 400 with its JSON Pointers into the body", () => {
    const p = capture(new ValidationError([{ pointer: '/plant/denominator', detail: 'must not be all zeros' }]));
    expect(p.status).toBe(400);
    expect(p.type).toBe('application/problem+json');
    expect(p.json).toMatchObject({ status: 400, instance: '/api/v1/locus', requestId: 'req-1', errors: [{ pointer: '/plant/denominator', detail: 'must not be all zeros' }] });
  });

  it('maps each named error to its status', () => {
    expect(statusOf(InputError.at('/name', 'too long'))).toBe(400);
    expect(statusOf(new NotFoundError('The model'))).toBe(404);
    expect(statusOf(new ConflictError('deleted'))).toBe(409);
    expect(statusOf(new PreconditionFailedError('stale'))).toBe(412);
    expect(statusOf(new PreconditionRequiredError())).toBe(428);
    expect(statusOf({ name: 'MulterError', code: 'LIMIT_FILE_SIZE' })).toBe(413);
    expect(statusOf({ type: 'entity.too.large' })).toBe(413);
  });

  it("turns the validator's paths into pointers: body fields into the body, query and path parameters by name", () => {
    const p = capture({ status: 400, errors: [{ path: '/body/plant/gain', message: 'must be number' }, { path: '/query/page', message: 'must be >= 1' }, { path: '/params/token', message: 'too long' }] });
    expect(p.status).toBe(400);
    expect(p.json.errors).toEqual([
      { pointer: '/plant/gain', detail: 'must be number' },
      { pointer: '/query/page', detail: 'must be at least 1' },
      { pointer: '/path/token', detail: 'too long' },
    ]);
  });

  it('sets Retry-After on 429', () => {
    const p = capture(new TooManyRequestsError(17));
    expect(p.status).toBe(429);
    expect(p.headers['Retry-After']).toBe('17');
  });

  it('turns an unknown error into a generic 500 without its message or stack', () => {
    const p = capture(new Error('SQLITE_CORRUPT at /work/data/file.sqlite'));
    expect(p.status).toBe(500);
    expect(p.body).not.toContain('SQLITE');
    expect(p.json.detail).toBe('Something went wrong on the server.');
  });
});
