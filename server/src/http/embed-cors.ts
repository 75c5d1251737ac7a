import type { RequestHandler } from 'express';

// Model routes an embed token may read: /api/v1/models/{id} and its sub-resources (locus, revisions, …).
const MODEL_ROUTE = /^\/api\/v1\/models\/[^/]+(\/[^?]*)?$/;
const READ_METHODS = new Set(['GET', 'HEAD']);

/**
 * CORS for embed tokens. A browser's preflight carries no token, so the preflight of a GET on a model
 * route is allowed from any origin (it reveals nothing); the real request then carries the embed token
 * and is answered with `Access-Control-Allow-Origin` only when its `Origin` is one of the token's origins
 * (the bearer strategy refuses other origins with 403). No other route answers cross-origin requests.
 */
export function embedPreflight(): RequestHandler {
  return (req, res, next) => {
    if (req.method !== 'OPTIONS') return next();
    const origin = req.headers.origin;
    const wanted = String(req.headers['access-control-request-method'] ?? '').toUpperCase();
    res.setHeader('Vary', 'Origin, Access-Control-Request-Method, Access-Control-Request-Headers');
    if (origin && READ_METHODS.has(wanted) && MODEL_ROUTE.test(req.originalUrl.split('?')[0] ?? '')) {
      res.setHeader('Access-Control-Allow-Origin', origin);
      res.setHeader('Access-Control-Allow-Methods', 'GET, HEAD');
      res.setHeader('Access-Control-Allow-Headers', 'Authorization, Accept, If-None-Match');
      res.setHeader('Access-Control-Max-Age', '600');
    }
    res.status(204).end();
  };
}

/** After authentication: echoes the Origin of a request made with an embed token bound to that origin. */
export function embedCorsHeaders(): RequestHandler {
  return (req, res, next) => {
    const origin = req.headers.origin;
    const principal = req.principal;
    res.vary('Origin');
    if (origin && principal?.kind === 'embed' && principal.origins?.includes(origin)) {
      res.setHeader('Access-Control-Allow-Origin', origin);
      res.setHeader('Access-Control-Expose-Headers', 'ETag, X-Request-Id');
    }
    next();
  };
}

// Only the two reads the browser element makes: the model and its locus (not the export or the tag list).
const ELEMENT_READ = /^\/api\/v1\/models\/(?!export$|import$|tags$)[^/]+(\/locus)?$/;
const REFUSALS = new Set([401, 403, 404, 429]);

/**
 * Lets the browser element read the problem body of a refused embed read (401 unknown or expired token,
 * 403, 404, 429), so it can say "token expired" instead of "blocked by cross-origin rules": on GET/HEAD of
 * `/api/v1/models/{id}` and `/api/v1/models/{id}/locus` carrying an `Origin`, an error answer gets
 * `Access-Control-Allow-Origin: <that origin>` and `Vary: Origin`. Safe because a refusal body reveals
 * nothing the caller did not send (its own token's state, the id it asked for, the origin it came from):
 * no model data, no other token's existence. Successful reads stay restricted to the token's own origins
 * (`embedCorsHeaders`); mounted before the rate limits so that their 429 is readable too.
 */
export function embedRefusalCors(): RequestHandler {
  return (req, res, next) => {
    const origin = req.headers.origin;
    if (!origin || !READ_METHODS.has(req.method) || !ELEMENT_READ.test(req.originalUrl.split('?')[0] ?? '')) return next();
    const writeHead = res.writeHead;
    res.writeHead = function (this: typeof res, ...args: Parameters<typeof writeHead>) {
      const status = typeof args[0] === 'number' ? args[0] : res.statusCode;
      if (REFUSALS.has(status) && !res.getHeader('Access-Control-Allow-Origin')) {
        res.setHeader('Access-Control-Allow-Origin', origin);
        res.vary('Origin');
      }
      return writeHead.apply(this, args);
    } as typeof writeHead;
    next();
  };
}
