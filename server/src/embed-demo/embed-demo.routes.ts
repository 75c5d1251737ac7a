import { type Request, Router } from 'express';
import { ownOrigin } from '../auth/request-origin.js';
import type { AppContext } from '../context.js';
import { isOrigin } from '../embed-tokens/embed-tokens.service.js';
import { rateLimits } from '../http/rate-limit.js';
import { openDemoSession } from './embed-demo.service.js';

/**
 * The origins the demo page may be open on: the server's own as this request names it (the origin the
 * same-origin rule of auth/request-origin.ts gives the page's API reads) and the origin of PUBLIC_URL.
 * Anything that is not a bare origin (an odd Host header) is left out.
 */
export function pageOrigins(req: Request, publicUrl: string): string[] {
  const candidates = [ownOrigin(req) ?? '', URL.canParse(publicUrl) ? new URL(publicUrl).origin : ''];
  return [...new Set(candidates.filter(isOrigin))];
}

/**
 * `GET /embed-demo/session`, the demo page's stand-in for a host backend (outside /api, not in the
 * OpenAPI document): `{ token, expiresAt, apiBase, loops: [{ id, name, key }] }`, never cached; a
 * problem+json 404 when the seeded demo is not there. Mounted before the static /embed-demo folder.
 */
export function embedDemoRouter(context: AppContext): Router {
  const router = Router();
  // the route mints tokens without a token of its own: the per-address limit of the API applies to it too
  router.get('/embed-demo/session', ...rateLimits(context.config.rateLimitPerMinute), async (req, res) => {
    const session = await openDemoSession(context, pageOrigins(req, context.config.publicUrl));
    res.setHeader('Cache-Control', 'no-store');
    res.json(session);
  });
  return router;
}
