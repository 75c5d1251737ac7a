import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';

const SAFE_ID = /^[A-Za-z0-9._-]{1,64}$/;

/** Gives every request an id (the caller's `X-Request-Id` when it is safe, else a new UUID), echoed in the response. */
export function requestId(): RequestHandler {
  return (req, res, next) => {
    const incoming = req.headers['x-request-id'];
    const id = typeof incoming === 'string' && SAFE_ID.test(incoming) ? incoming : randomUUID();
    res.locals['requestId'] = id;
    res.setHeader('X-Request-Id', id);
    next();
  };
}
