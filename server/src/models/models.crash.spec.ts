/*
 * Durability: a server process killed with SIGKILL in the middle of imports loses nothing it acknowledged,
 * leaves no half-written import, and its database passes PRAGMA integrity_check.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import sqlite3 from 'sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../config.js';
import { DEMO_PEOPLE } from '../seed/demo-people.js';

const MAIN = resolve(REPO_ROOT, 'server', 'src', 'main.ts');
const ROWS_PER_IMPORT = 1000;

function freePort(): Promise<number> {
  return new Promise((done, fail) => {
    const probe = createServer();
    probe.once('error', fail);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => done(port));
    });
  });
}

async function startServer(databasePath: string, port: number): Promise<ChildProcess> {
  // node itself with tsx as a loader (not the tsx CLI, which would run the server in a grandchild that SIGKILL misses)
  const child = spawn(process.execPath, ['--import', 'tsx', MAIN], { cwd: REPO_ROOT, env: { ...process.env, DATABASE_PATH: databasePath, PORT: String(port), RATE_LIMIT_PER_MINUTE: '0', POLEWRIGHT_QUIET: '1', NODE_ENV: 'test', KEY_EXPIRY_CHECK_MS: '0' }, stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr?.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  for (let attempt = 0; attempt < 600; attempt++) {
    if (child.exitCode !== null) throw new Error(`server exited early: ${stderr}`);
    try {
      if ((await fetch(`http://127.0.0.1:${port}/api/health`)).ok) return child;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  child.kill('SIGKILL');
  throw new Error(`server did not come up: ${stderr}`);
}

function exited(child: ChildProcess): Promise<void> {
  return child.exitCode !== null || child.signalCode !== null ? Promise.resolve() : new Promise((done) => child.once('exit', () => done()));
}

function query<T>(databasePath: string, sql: string): Promise<T[]> {
  return new Promise((done, fail) => {
    const db = new sqlite3.Database(databasePath, (error) => {
      if (error) return fail(error);
      db.all(sql, (err, rows) => db.close(() => (err ? fail(err) : done(rows as T[]))));
    });
  });
}

function importCsv(tag: string): string {
  const lines = ['name,tags,expression,designGain'];
  for (let i = 0; i < ROWS_PER_IMPORT; i++) lines.push(`${tag} loop ${i},crash-test,${1 + i / 100}/(s*(s+${1 + (i % 7)})*(s+9)),0.5`);
  return lines.join('\n');
}

describe('a server killed with SIGKILL during imports', () => {
  const folder = mkdtempSync(join(tmpdir(), 'polewright-crash-'));
  const databasePath = join(folder, 'crash.sqlite');
  const children: ChildProcess[] = [];
  afterAll(async () => {
    for (const child of children) if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
    await Promise.all(children.map(exited));
    rmSync(folder, { recursive: true, force: true });
  });

  it('keeps every acknowledged write, never half an import, and passes integrity_check after restart', async () => {
    const port = await freePort();
    const first = await startServer(databasePath, port);
    children.push(first);
    const base = `http://127.0.0.1:${port}/api/v1`;
    const engineer = DEMO_PEOPLE.find((p) => p.role === 'engineer')!;
    const session = (await (await fetch(`${base}/sessions`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: engineer.email, password: engineer.password }) })).json()) as { token: string };
    const auth = { Authorization: `Bearer ${session.token}` };

    const acknowledgedCreates: string[] = [];
    const acknowledgedImports: { tag: string; ids: string[] }[] = [];
    const sentImports: string[] = [];
    let killed = false;
    const sendImport = async (tag: string) => {
      sentImports.push(tag);
      const form = new FormData();
      form.append('file', new Blob([importCsv(tag)], { type: 'text/csv' }), `${tag}.csv`);
      const res = await fetch(`${base}/models/import`, { method: 'POST', headers: auth, body: form });
      const body = (await res.json()) as { results: { id: string }[] };
      if (res.status === 200) acknowledgedImports.push({ tag, ids: body.results.map((r: { id: string }) => r.id) });
    };
    const createLoop = async () => {
      for (let i = 0; !killed; i++) {
        const res = await fetch(`${base}/models`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify({ name: `Acknowledged ${i}`, plant: { expression: `1/(s*(s+${i + 1}))` } }) });
        if (res.status === 201) acknowledgedCreates.push(((await res.json()) as { id: string }).id);
      }
    };

    // one import to completion (to learn how long one takes), then creates with three imports overlapping them
    // the first import absorbs start-up work (JIT, the compute workers loading), so time the second one
    await sendImport('warm-up');
    const started = Date.now();
    await sendImport('timed');
    const importTime = Date.now() - started;
    const creates = createLoop().catch(() => undefined);
    while (acknowledgedCreates.length < 3) await new Promise((r) => setTimeout(r, 2));
    const inFlight = ['batch-a', 'batch-b', 'batch-c'].map((tag) => sendImport(tag).catch(() => undefined));
    // the kill lands somewhere within the three imports' work (spread over runs: checking rows, writing,
    // committing), and at the latest when only one of them is still unanswered: a busy machine can make the
    // timed import slower than these three, which must not let all of them finish before the kill
    const killAt = Date.now() + importTime * (0.5 + Math.random());
    while (Date.now() < killAt && sentImports.length - acknowledgedImports.length > 1) await new Promise((r) => setTimeout(r, 2));
    const pending = sentImports.length - acknowledgedImports.length;
    killed = true;
    first.kill('SIGKILL');
    await exited(first);
    await Promise.all([creates, ...inFlight]);
    expect(first.signalCode).toBe('SIGKILL');
    expect(pending).toBeGreaterThan(0); // an import was sent and not yet answered when the process died

    expect(await query<{ integrity_check: string }>(databasePath, 'PRAGMA integrity_check')).toEqual([{ integrity_check: 'ok' }]);
    const stored = new Set((await query<{ id: string }>(databasePath, 'SELECT id FROM models')).map((r) => r.id));
    for (const id of acknowledgedCreates) expect(stored.has(id), `acknowledged create ${id}`).toBe(true);
    for (const done of acknowledgedImports) for (const id of done.ids) expect(stored.has(id), `acknowledged import ${done.tag}`).toBe(true);
    // an import is one transaction: each file's rows are all there or none
    const outcome: string[] = [];
    for (const tag of sentImports) {
      const [{ n }] = await query<{ n: number }>(databasePath, `SELECT COUNT(*) AS n FROM models WHERE name LIKE '${tag} loop %'`);
      expect([0, ROWS_PER_IMPORT], `rows of ${tag}`).toContain(n);
      outcome.push(`${tag}: ${n === 0 ? 'rolled back' : 'committed'}${acknowledgedImports.some((a) => a.tag === tag) ? ' (acknowledged)' : ''}`);
    }
    console.log(`after SIGKILL: ${outcome.join(', ')}; ${acknowledgedCreates.length} acknowledged creates kept`);
    const orphans = await query<{ n: number }>(databasePath, 'SELECT COUNT(*) AS n FROM models m WHERE NOT EXISTS (SELECT 1 FROM model_revisions r WHERE r.model_id = m.id AND r.revision = m.revision)');
    expect(orphans[0].n).toBe(0);

    const second = await startServer(databasePath, port);
    children.push(second);
    const again = (await (await fetch(`${base}/sessions`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: engineer.email, password: engineer.password }) })).json()) as { token: string };
    for (const id of acknowledgedCreates.slice(-3)) {
      const res = await fetch(`${base}/models/${id}`, { headers: { Authorization: `Bearer ${again.token}` } });
      expect(res.status).toBe(200);
    }
    second.kill('SIGTERM');
    await exited(second);
  }, 180_000);
});
