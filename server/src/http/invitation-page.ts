/*
 * The page behind the link of an invitation e-mail (`PUBLIC_URL/invitations/<token>`): a plain HTML form
 * (server/public/invitation/) that calls `POST /api/v1/invitations/{token}/accept` with fetch. It lives
 * outside /api and outside the OpenAPI document on purpose, like the other front ends. The Material console
 * may take this route over in a later issue; then drop this router and the exclusion in static-sites.ts.
 */
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { Router } from 'express';
import helmet from 'helmet';
import { REPO_ROOT } from '../config.js';
import type { AppContext } from '../context.js';
import { invitationState } from '../users/users.service.js';

/** The page's files, beside the sources (the built server finds them through REPO_ROOT as well). */
export const INVITATION_PAGE_FOLDER = 'server/public/invitation';

const ASSETS = ['invitation.js', 'invitation.css'];

/**
 * `GET /invitations/:token`: the sign-up page, with the invitation's state (`open`, `used`, `expired`,
 * `unknown`) in `data-invitation`, so a used or expired link says so before anyone types a password;
 * `GET /invitations/invitation.js|.css`: its script and stylesheet. The CSP allows no inline script.
 */
export function invitationPageRouter(context: AppContext, root = REPO_ROOT): Router {
  const folder = resolve(root, INVITATION_PAGE_FOLDER);
  const router = Router();
  const csp = helmet.contentSecurityPolicy({ directives: { upgradeInsecureRequests: null, scriptSrc: ["'self'"] } });
  for (const asset of ASSETS) router.get(`/invitations/${asset}`, csp, (_req, res) => res.sendFile(join(folder, asset)));
  router.get('/invitations/:token', csp, async (req, res) => {
    const token = req.params['token'] as string;
    // the page's relative links (invitation.css, ../api/v1/…) need the address without a trailing slash
    if (req.path.endsWith('/')) return res.redirect(301, `../${encodeURIComponent(token)}`);
    const state = await invitationState(context, token);
    const html = (await readFile(join(folder, 'index.html'), 'utf8')).replace('data-invitation="open"', `data-invitation="${state}"`);
    // the answer depends on the invitation's state: never reuse it from a cache
    res.set('Cache-Control', 'no-store').type('html').send(html);
  });
  return router;
}
