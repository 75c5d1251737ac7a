import { createHash } from 'node:crypto';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CONSOLE_SNIPPET_SCRIPTS, isPageNavigation, mountStaticSites } from './static-sites.js';

/** What a browser sends when it navigates to a page. */
const PAGE = 'text/html,application/xhtml+xml,application/xml;q=0.9,*/*;q=0.8';

const INLINE = "document.body.dataset.ready = 'yes';";

describe('static front ends', () => {
  let root: string;
  const logs: string[] = [];
  let app: express.Express;
  beforeAll(() => {
    root = mkdtempSync(join(tmpdir(), 'polewright-static-'));
    mkdirSync(join(root, 'dist', 'elements'), { recursive: true });
    writeFileSync(join(root, 'dist', 'elements', 'index.html'), `<html><body><script type="module" src="x.js"></script><script>${INLINE}</script></body></html>`);
    mkdirSync(join(root, 'dist', 'console', 'browser'), { recursive: true });
    writeFileSync(join(root, 'dist', 'console', 'browser', 'index.html'), '<html><body>console</body></html>');
    app = express();
    mountStaticSites(app, (m) => logs.push(m), root);
  });
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('serves dist/elements at /elements/ with its inline script allowed by hash only', async () => {
    const res = await request(app).get('/elements/');
    expect(res.status).toBe(200);
    const hash = createHash('sha256').update(INLINE).digest('base64');
    expect(res.headers['content-security-policy']).toContain(`script-src 'self' 'sha256-${hash}'`);
    const scriptSrc = /script-src ([^;]*)/.exec(res.headers['content-security-policy'] as string)?.[1];
    expect(scriptSrc).not.toContain('unsafe-inline');
  });

  it('lets pages of any origin load the element files (module scripts and fonts are CORS fetches), and only those', async () => {
    const element = await request(app).get('/elements/').set('Origin', 'https://wiki.quillfield.example');
    expect(element.headers['access-control-allow-origin']).toBe('*');
    const home = await request(app).get('/').set('Origin', 'https://wiki.quillfield.example');
    expect(home.headers['access-control-allow-origin']).toBeUndefined();
  });

  it("serves the console's index.html from its browser/ folder for client-side routes", async () => {
    expect((await request(app).get('/')).text).toContain('console');
    expect((await request(app).get('/models/abc').set('Accept', PAGE)).text).toContain('console');
  });

  it('answers only page navigations with the console: a missing file or a script’s request falls through', async () => {
    expect((await request(app).get('/models/abc').set('Accept', 'application/json')).status).toBe(404);
    expect((await request(app).get('/models/abc')).status).toBe(404);
    expect((await request(app).get('/chunk-missing.js').set('Accept', PAGE)).status).toBe(404);
    expect(isPageNavigation('/models/abc', PAGE)).toBe(true);
    expect(isPageNavigation('/favicon.ico', PAGE)).toBe(false);
  });

  it('hands the links of invitation e-mails (/invitations/<token>) to the console', async () => {
    const res = await request(app).get('/invitations/pwi_x').set('Accept', PAGE);
    expect(res.status).toBe(200);
    expect(res.text).toContain('console');
  });

  it("lets the console frame Blob URL documents and run its snippet's listener script, by hash only", async () => {
    const csp = (await request(app).get('/models/abc').set('Accept', PAGE)).headers['content-security-policy'] as string;
    expect(/frame-src ([^;]*)/.exec(csp)?.[1]?.trim()).toBe("'self' blob:");
    const hash = createHash('sha256').update(CONSOLE_SNIPPET_SCRIPTS[0] as string).digest('base64');
    expect(/script-src ([^;]*)/.exec(csp)?.[1]?.trim()).toBe(`'self' 'sha256-${hash}'`);
    expect(CONSOLE_SNIPPET_SCRIPTS[0]).toContain("addEventListener('pw-gain-change'");
    // the other front ends frame nothing but their own origin (helmet's default-src)
    expect((await request(app).get('/elements/')).headers['content-security-policy']).not.toContain('frame-src');
  });

  it('skips a missing folder with a log line', () => {
    expect(logs).toEqual(['static: demo/embed not built, /embed-demo not served']);
  });

  it('sends a visitor of / to the element gallery while the console is not built', async () => {
    const bare = mkdtempSync(join(tmpdir(), 'polewright-static-'));
    try {
      mkdirSync(join(bare, 'dist', 'elements'), { recursive: true });
      writeFileSync(join(bare, 'dist', 'elements', 'index.html'), '<html><body>gallery</body></html>');
      const withoutConsole = express();
      mountStaticSites(withoutConsole, () => undefined, bare);
      const res = await request(withoutConsole).get('/');
      expect(res.status).toBe(302);
      expect(res.headers['location']).toBe('/elements/');
    } finally {
      rmSync(bare, { recursive: true, force: true });
    }
  });
});
