import { createHash } from 'node:crypto';
import type { ServerResponse } from 'node:http';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { REPO_ROOT } from '../config.js';

/**
 * Inline scripts of documents the console writes itself: its embed screen runs the snippet it hands out in a
 * Blob URL frame, which inherits the console's policy, so the snippet's listener script is allowed by hash.
 * The same text, byte for byte, as `GAIN_LISTENER_SCRIPT` in projects/console/src/app/embed/embed-snippet.ts.
 */
export const CONSOLE_SNIPPET_SCRIPTS: readonly string[] = [
  `
  // every gain a reader sets in an element, with the loop key it belongs to
  document.addEventListener('pw-gain-change', (event) => {
    console.log('Polewright gain', event.detail.gain, 'on loop', event.detail.loop);
  });
`,
];

/** A site's additions: frames it may show, inline scripts it writes at run time, readable from any origin. */
interface SitePolicy {
  frameSrc?: string[];
  scripts?: readonly string[];
  /** `Access-Control-Allow-Origin: *`: other sites' pages load these files as module scripts and fonts (CORS fetches). */
  anyOrigin?: boolean;
}

/** Built front ends served by the API server, when they exist (CONTRACTS: build outputs and URLs). */
const SITES: { mount: string; folder: string; spa: boolean; policy?: SitePolicy }[] = [
  // pasted into pages of any site: `<script type="module">` and the @font-face files are fetched with CORS
  { mount: '/elements', folder: 'dist/elements', spa: false, policy: { anyOrigin: true } },
  { mount: '/embed-demo', folder: 'demo/embed', spa: false },
  // the console's embed screen previews its snippet in a frame whose document is a Blob URL
  { mount: '/', folder: 'dist/console', spa: true, policy: { frameSrc: ["'self'", 'blob:'], scripts: CONSOLE_SNIPPET_SCRIPTS } },
];

/** Whether a GET is a browser asking for a page (HTML accepted, no file extension), not for a missing file. */
export function isPageNavigation(path: string, accept: string | undefined): boolean {
  return (accept ?? '').includes('text/html') && !/\.[a-z0-9]+$/i.test(path);
}

/** The CSP hash source (`'sha256-…'`) of an inline script's text. */
function scriptHash(text: string): string {
  return `'sha256-${createHash('sha256').update(text).digest('base64')}'`;
}

/** CSP hashes (`'sha256-…'`) of the inline `<script>` blocks of a folder's HTML pages. */
export function inlineScriptHashes(folder: string): string[] {
  const hashes = new Set<string>();
  for (const file of readdirSync(folder).filter((f) => f.endsWith('.html'))) {
    const html = readFileSync(join(folder, file), 'utf8');
    for (const match of html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/gi)) {
      hashes.add(scriptHash(match[1] ?? ''));
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
    const scriptSrc = ["'self'", ...inlineScriptHashes(folder), ...(site.policy?.scripts ?? []).map(scriptHash)];
    // null leaves a directive out (helmet), so a site without frames keeps default-src for them
    const csp = helmet.contentSecurityPolicy({ directives: { upgradeInsecureRequests: null, scriptSrc, frameSrc: site.policy?.frameSrc ?? null } });
    // public files, no credentials: any page may read them
    const setHeaders = site.policy?.anyOrigin ? (res: ServerResponse) => res.setHeader('Access-Control-Allow-Origin', '*') : undefined;
    app.use(site.mount, csp, express.static(folder, { index: 'index.html', fallthrough: true, setHeaders }));
    if (site.spa && existsSync(join(folder, 'index.html'))) {
      // client-side routes of the console: a browser navigation (Accept: text/html) to any other path outside
      // /api gets its index.html, the links of invitation e-mails (/invitations/<token>) included; the console
      // shows its own "nothing here" for paths it does not know. Anything else (a missing file, a script's
      // request) stays a 404 problem.
      app.get(/^\/(?!api(\/|$)|elements(\/|$)|embed-demo(\/|$)).*/, csp, (req, res, next) => {
        if (!isPageNavigation(req.path, req.headers.accept)) return next();
        res.sendFile(join(folder, 'index.html'));
      });
    }
  }
}
