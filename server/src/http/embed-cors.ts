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
