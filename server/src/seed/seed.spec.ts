import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { loadConfig } from '../config.js';
import { closeContext, createContext } from '../context.js';

describe('first run', () => {
  const folders: string[] = [];
  afterEach(() => {
    for (const f of folders.splice(0)) rmSync(f, { recursive: true, force: true });
  });
  const configFor = (env: Record<string, string>) => {
    const folder = mkdtempSync(join(tmpdir(), 'polewright-seed-'));
    folders.push(folder);
    return loadConfig({ POLEWRIGHT_QUIET: '1', KEY_EXPIRY_CHECK_MS: '0', ...env, DATABASE_PATH: join(folder, 'seed.sqlite') });
  };
  const users = async (config: ReturnType<typeof loadConfig>) => {
    const context = await createContext(config);
    const rows = (await context.dataSource.query('SELECT email, role, status FROM users ORDER BY email')) as { email: string; role: string; status: string }[];
    const models = ((await context.dataSource.query('SELECT COUNT(*) AS n FROM models')) as { n: number }[])[0]?.n;
    await closeContext(context);
    return { rows, models };
  };

  it('creates the admin from the environment and no demo when POLEWRIGHT_DEMO=off', async () => {
    const { rows, models } = await users(configFor({ POLEWRIGHT_DEMO: 'off', POLEWRIGHT_ADMIN_EMAIL: 'Site.Admin@quillfield.example', POLEWRIGHT_ADMIN_PASSWORD: 'site-admin-password' }));
    expect(rows).toEqual([{ email: 'site.admin@quillfield.example', role: 'admin', status: 'active' }]);
    expect(models).toBe(0);
  });

  it('needs both admin variables', async () => {
    const { rows } = await users(configFor({ POLEWRIGHT_DEMO: 'off', POLEWRIGHT_ADMIN_EMAIL: 'site.admin@quillfield.example' }));
    expect(rows).toEqual([]);
  });

  it('seeds one demo user per role and the demo models by default, once', async () => {
    const config = configFor({});
    const first = await users(config);
    expect(first.rows.map((r) => r.role).sort()).toEqual(['admin', 'engineer', 'viewer']);
    expect(first.rows.every((r) => r.email.endsWith('@quillfield.example'))).toBe(true);
    expect(first.models).toBeGreaterThanOrEqual(5);
    const second = await users(config);
    expect(second).toEqual(first);
  });

  it('prints the demo credentials at start-up', async () => {
    const lines: string[] = [];
    const context = await createContext({ ...configFor({}), quiet: false }, { log: (m) => lines.push(m) });
    await closeContext(context);
    const text = lines.join('\n');
    expect(text).toContain('ada.admin@quillfield.example');
    expect(text).toContain('quillfield-admin-2026');
    expect(text).toContain('quillfield-viewer-2026');
  });
});
