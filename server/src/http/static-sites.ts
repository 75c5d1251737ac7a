import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { REPO_ROOT } from '../config.js';

/** Built front ends served by the API server, when they exist (CONTRACTS: build outputs and URLs). */
const SITES: { mount: string; folder: string; spa: boolean }[] = [
  { mount: '/elements', folder: 'dist/elements', spa: false },
  { mount: '/embed-demo', folder: 'demo/embed', spa: false },
  { mount: '/', folder: 'dist/console', spa: true },
];

/** CSP hashes (`'sha256-…'`) of the inline `<script>` blocks of a folder's HTML pages. */
export function inlineScriptHashes(folder: string): string[] {
  const hashes = new Set<string>();
  for (const file of readdirSync(folder).filter((f) => f.endsWith('.html'))) {
    const html = readFileSync(join(folder, file), 'utf8');
    for (const match of html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/gi)) {
      hashes.add(`'sha256-${createHash('sha256').update(match[1] ?? '').digest('base64')}'`);
    }
  }
  return [...hashes];
}

/**
 * Mounts each present folder; a missing one is skipped with a log line. Inline scripts of the pages are
 * allowed by their hashes (the CSP stays `script-src 'self'` otherwise).
 */
export function mountStaticSites(app: Express, log: (message: string) => void, root = REPO_ROOT): void {
  for (const site of SITES) {
    // the Angular application builder writes its files into a browser/ subfolder
    const base = resolve(root, site.folder);
    const folder = existsSync(join(base, 'browser', 'index.html')) ? join(base, 'browser') : base;
    if (!existsSync(folder)) {
      log(`static: ${site.folder} not built, ${site.mount} not served`);
      // until the console is built, a person opening the server's address lands on the element gallery
      if (site.mount === '/' && existsSync(resolve(root, 'dist/elements'))) app.get('/', (_req, res) => res.redirect(302, '/elements/'));
      continue;
    }
    const csp = helmet.contentSecurityPolicy({ directives: { upgradeInsecureRequests: null, scriptSrc: ["'self'", ...inlineScriptHashes(folder)] } });
    app.use(site.mount, csp, express.static(folder, { index: 'index.html', fallthrough: true }));
    if (site.spa && existsSync(join(folder, 'index.html'))) {
      // client-side routes of the console: any other GET outside /api gets its index.html. /invitations/…
      // stays with the invitation page (http/invitation-page.ts) unless the console takes that route over.
      app.get(/^\/(?!api(\/|$)|elements(\/|$)|embed-demo(\/|$)|invitations(\/|$)).*/, csp, (_req, res) => res.sendFile(join(folder, 'index.html')));
    }
  }
}
