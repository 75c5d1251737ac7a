import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from './config.js';

describe('main', () => {
  const folder = mkdtempSync(join(tmpdir(), 'polewright-main-'));
  afterAll(() => rmSync(folder, { recursive: true, force: true }));

  it('starts, prints the demo credentials and its address, answers, and exits 0 on SIGTERM', async () => {
    const child = spawn(process.execPath, ['--import', 'tsx', resolve(REPO_ROOT, 'server/src/main.ts')], {
      cwd: REPO_ROOT,
      env: { ...process.env, PORT: '0', DATABASE_PATH: join(folder, 'main.sqlite'), NODE_ENV: 'test', RATE_LIMIT_PER_MINUTE: '0', POLEWRIGHT_QUIET: '' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.stderr.on('data', (d: Buffer) => (out += d.toString()));
    const exited = new Promise<number | null>((done) => child.on('exit', (code) => done(code)));
    const url = await new Promise<string>((done, fail) => {
      const check = setInterval(() => {
        const m = /listening on (http:\/\/localhost:\d+)/.exec(out);
        if (m) {
          clearInterval(check);
          done(m[1] as string);
        }
      }, 50);
      void exited.then(() => {
        clearInterval(check);
        fail(new Error(`the server exited before listening:\n${out}`));
      });
    });
    expect(out).toContain('ada.admin@quillfield.example');
    expect(out).toContain('quillfield-engineer-2026');
    const health = await fetch(`${url}/api/health`);
    expect(health.status).toBe(200);
    child.kill('SIGTERM');
    expect(await exited).toBe(0);
    expect(out).toContain('SIGTERM: shutting down');
  });
});
