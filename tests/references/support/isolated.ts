import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { buildSync } from 'esbuild';
import type { LocusRequest, LocusResult } from '../../../projects/locus-core/src/public-api';

/**
 * Runs `locus(request)` in a separate Node process with a small heap and a time limit, so that an
 * engine call that never returns (a tracking loop that stops advancing) fails the one test that made
 * it instead of exhausting the memory of the whole test run. The engine sources are bundled once with
 * esbuild (already present as the bundler underneath Vite/Vitest and the Angular builder).
 * This is a containment measure, not a speed target: the limits are generous for a call that takes
 * well under a second.
 */
let bundled: string | null = null;

function engineBundle(): string {
  if (bundled !== null) return bundled;
  const directory = mkdtempSync(join(tmpdir(), 'polewright-references-'));
  const outfile = join(directory, 'engine.mjs');
  buildSync({
    entryPoints: [fileURLToPath(new URL('../../../projects/locus-core/src/public-api.ts', import.meta.url))],
    bundle: true,
    format: 'esm',
    platform: 'node',
    outfile,
    logLevel: 'silent',
  });
  bundled = outfile;
  return outfile;
}

export type IsolatedOutcome = { readonly result: LocusResult; readonly failure?: undefined } | { readonly result?: undefined; readonly failure: string };

const CHILD = (engine: string): string =>
  `import { locus } from ${JSON.stringify(engine)};
let text = '';
process.stdin.setEncoding('utf8');
process.stdin.on('data', (chunk) => (text += chunk));
process.stdin.on('end', () => {
  const requests = JSON.parse(text);
  process.stdout.write(JSON.stringify(requests.map((request) => locus(request))));
});`;

function runChild(requests: readonly LocusRequest[], timeoutMs: number, heapMb: number): { results: LocusResult[] } | { failure: string } {
  const run = spawnSync(process.execPath, [`--max-old-space-size=${heapMb}`, '--input-type=module', '-e', CHILD(pathToFileURL(engineBundle()).href)], {
    input: JSON.stringify(requests),
    encoding: 'utf8',
    timeout: timeoutMs,
    maxBuffer: 1024 * 1024 * 1024,
  });
  if (run.error) return { failure: `locus did not return within ${timeoutMs} ms (${run.error.message})` };
  if (run.status !== 0) {
    const reason = /heap out of memory/.test(run.stderr) ? `ran out of its ${heapMb} MB heap (a loop that never finishes?)` : run.stderr.split('\n').slice(0, 5).join(' | ');
    return { failure: `locus did not return (exit ${run.status ?? run.signal}): ${reason}` };
  }
  return { results: JSON.parse(run.stdout) as LocusResult[] };
}

/** `locus(request)` in a separate process; `failure` says why it did not return. */
export function locusInSeparateProcess(request: LocusRequest, limits: { timeoutMs?: number; heapMb?: number } = {}): IsolatedOutcome {
  const out = runChild([request], limits.timeoutMs ?? 45000, limits.heapMb ?? 256);
  return 'failure' in out ? { failure: out.failure } : { result: out.results[0] };
}

/**
 * Many `locus` calls in one separate process (fast when all return); when the batch does not finish,
 * each request is run on its own so that only the calls that do not return are reported as failures.
 */
export function locusManyInSeparateProcess(requests: readonly LocusRequest[]): IsolatedOutcome[] {
  const batch = runChild(requests, 120000, 1024);
  if (!('failure' in batch)) return batch.results.map((result) => ({ result }));
  return requests.map((request) => locusInSeparateProcess(request));
}
