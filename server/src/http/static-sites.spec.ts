import { createHash } from 'node:crypto';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mountStaticSites } from './static-sites.js';

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

  it("serves the console's index.html from its browser/ folder for client-side routes", async () => {
    expect((await request(app).get('/')).text).toContain('console');
    expect((await request(app).get('/models/abc')).text).toContain('console');
  });

  it("leaves /invitations/… to the invitation page instead of the console's fallback", async () => {
    const res = await request(app).get('/invitations/pwi_x');
    expect(res.status).toBe(404);
    expect(res.text).not.toContain('console');
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
