import { closedLoop, locus, ValidationError } from '@polewright/locus-core';
import { build } from 'esbuild';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../config.js';
import { type ComputePool, createComputePool, workerEntry } from './compute-pool.js';

const PLANT = { expression: '(s+1)*(s+3)/(s*(s+2)*(s+4)*(s+5)*(s^2+2*s+10)*(s^2+s+30))' };

/** What the pool must answer for a good request, a bad one and several at once. */
async function exercise(pool: ComputePool): Promise<void> {
  const bytes = await pool.run('locus', { plant: PLANT });
  expect(JSON.parse(bytes.toString('utf8'))).toEqual(JSON.parse(JSON.stringify(locus({ plant: PLANT }))));
  const error = await pool.run('locus', { plant: { numerator: [1, 2, 3], denominator: [1, 1] } }).catch((e: unknown) => e);
  expect(error).toBeInstanceOf(ValidationError);
  expect((error as ValidationError).issues.length).toBeGreaterThan(0);
  expect((error as ValidationError).issues[0]?.pointer).toMatch(/^\/plant/);
  const gains = [0.5, 1, 2, 4, 8];
  const answers = await Promise.all(gains.map((gain) => pool.run('closed-loop', { plant: PLANT, gain })));
  answers.forEach((answer, i) => expect(JSON.parse(answer.toString())).toEqual(JSON.parse(JSON.stringify(closedLoop({ plant: PLANT, gain: gains[i] as number })))));
}

describe('compute pool', () => {
  const cleanup: (() => Promise<void> | void)[] = [];
  afterAll(async () => {
    for (const step of cleanup.reverse()) await step();
  });

  it('picks the .mjs tsx shim beside the sources and compute-worker.js beside the built module', () => {
    expect(workerEntry('file:///repo/server/src/compute/compute-pool.ts').pathname).toBe('/repo/server/src/compute/compute-worker-tsx.mjs');
    expect(workerEntry('file:///repo/dist/server/compute/compute-pool.js').pathname).toBe('/repo/dist/server/compute/compute-worker.js');
  });

  it('runs the engine in worker threads from the TypeScript sources, ValidationError re-created with its pointers', async () => {
    const pool = createComputePool(2);
    cleanup.push(() => pool.close());
    expect(pool.size).toBe(2);
    await exercise(pool);
  });

  it('runs from compiled JavaScript too (the dist/server path: no tsx in the worker)', async () => {
    // compile the pool and what its workers import, as tsc would, into a folder below node_modules (so
    // that @polewright/locus-core resolves by package name from there)
    const out = resolve(REPO_ROOT, 'node_modules', '.cache', `polewright-compute-pool-spec-${process.pid}`);
    cleanup.push(() => rmSync(out, { recursive: true, force: true }));
    const src = join(REPO_ROOT, 'server', 'src');
    const files = ['compute/compute-pool.ts', 'compute/compute-worker.ts', 'compute/compute-tasks.ts', 'models/loop-locus.ts'];
    mkdirSync(out, { recursive: true });
    writeFileSync(join(out, 'package.json'), '{ "type": "module" }\n');
    await build({ entryPoints: files.map((f) => join(src, f)), outdir: out, outbase: src, format: 'esm', platform: 'node', bundle: false, logLevel: 'silent' });
    const compiled = (await import(/* @vite-ignore */ pathToFileURL(join(out, 'compute', 'compute-pool.js')).href)) as typeof import('./compute-pool.js');
    const entry = compiled.workerEntry(pathToFileURL(join(out, 'compute', 'compute-pool.js')).href);
    expect(entry.pathname.endsWith('/compute/compute-worker.js')).toBe(true);
    const pool = createComputePool(1, entry);
    cleanup.push(() => pool.close());
    await exercise(pool);
  });

  it('hands each worker a running and a waiting task, matches every answer to its task, and a dying worker rejects only the task it was running', async () => {
    // a stand-in worker speaking the pool's protocol: echoes the payload as JSON bytes, exits on "exit"
    const folder = mkdtempSync(join(tmpdir(), 'polewright-pool-spec-'));
    cleanup.push(() => rmSync(folder, { recursive: true, force: true }));
    const echo = join(folder, 'echo-worker.mjs');
    writeFileSync(echo, [
      "import { parentPort } from 'node:worker_threads';",
      "parentPort.on('message', ({ id, payload }) => {",
      "  if (payload === 'exit') process.exit(3);",
      '  const bytes = new TextEncoder().encode(JSON.stringify(payload));',
      '  parentPort.postMessage({ id, ok: true, bytes }, [bytes.buffer]);',
      '});',
    ].join('\n'));
    const pool = createComputePool(1, pathToFileURL(echo));
    cleanup.push(() => pool.close());
    const many = await Promise.all([1, 2, 3, 4, 5, 6].map((n) => pool.run('locus', { n })));
    expect(many.map((bytes) => JSON.parse(bytes.toString()))).toEqual([1, 2, 3, 4, 5, 6].map((n) => ({ n })));
    // "a" runs, "exit" waits in the same worker, "b" waits in the pool's queue and then behind "exit":
    // the worker's death rejects "exit" alone, "b" runs on the replacement
    const [a, dead, b] = await Promise.allSettled([pool.run('locus', 'a'), pool.run('locus', 'exit'), pool.run('locus', 'b')]);
    expect(a).toEqual({ status: 'fulfilled', value: Buffer.from('"a"') });
    expect(dead.status === 'rejected' && String(dead.reason)).toMatch(/stopped \(exit code 3\)/);
    expect(b).toEqual({ status: 'fulfilled', value: Buffer.from('"b"') });
  });

  it('rejects work after close and leaves no worker running', async () => {
    const pool = createComputePool(1);
    pool.warm();
    await pool.run('locus', { plant: { expression: '1/(s+1)' } });
    await pool.close();
    await expect(pool.run('locus', { plant: { expression: '1/(s+1)' } })).rejects.toThrow(/closed/);
  });
});
