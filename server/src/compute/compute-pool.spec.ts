import { closedLoop, locus, ValidationError } from '@polewright/locus-core';
import { build } from 'esbuild';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
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

  it('rejects work after close and leaves no worker running', async () => {
    const pool = createComputePool(1);
    pool.warm();
    await pool.run('locus', { plant: { expression: '1/(s+1)' } });
    await pool.close();
    await expect(pool.run('locus', { plant: { expression: '1/(s+1)' } })).rejects.toThrow(/closed/);
  });
});
