import { buildSync } from 'esbuild';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';

/*
 * Runs entry points of the core in a worker thread with a capped heap, so that a call that never
 * finishes (and keeps allocating) ends as a test failure — "exhausted" — instead of taking the whole
 * test process down. The cap is a memory bound, not a time limit: nothing here measures time.
 *
 * The core is bundled from source (the same TypeScript the other specs import) with esbuild. Errors
 * are classified inside the worker, where `instanceof ValidationError` still holds.
 */

const ENTRY = fileURLToPath(new URL('../../projects/locus-core/src/public-api.ts', import.meta.url));

/** What one call did. */
export type Outcome =
  | { readonly kind: 'result'; readonly value: unknown }
  | { readonly kind: 'validation'; readonly issues: readonly { pointer: string; detail: string }[] }
  | { readonly kind: 'error'; readonly name: string; readonly message: string; readonly stack: string }
  | { readonly kind: 'exhausted'; readonly message: string };

export interface BoundedCoreOptions {
  /** Load the expression parser (mathjs) in the worker; without it expression plants cannot be used. Default false. */
  readonly expressions?: boolean;
  /** Old-generation heap of the worker in MB. Default 96. */
  readonly heapMb?: number;
}

const WORKER_BODY = `
const { parentPort, workerData } = require('node:worker_threads');
const { createRequire } = require('node:module');
const load = new Function('module', 'exports', 'require', workerData.code);
const module = { exports: {} };
const realRequire = createRequire(workerData.entry);
// without expressions mathjs is not loaded (it is large): the core's slim instance (plant/math.ts) then gets
// functions that fail loudly, so an expression plant or a zero-order hold cannot pass unnoticed
const noParser = {
  create() {
    const missing = () => { throw new Error('expression plants are not loaded in this bounded worker'); };
    return { parse: missing, expm: missing, matrix: missing };
  },
};
load(module, module.exports, (id) => (id === 'mathjs' && !workerData.expressions ? noParser : realRequire(id)));
const core = module.exports;
parentPort.on('message', (message) => {
  let reply;
  try {
    const value = core[message.fn](...message.args);
    reply = { kind: 'result', value: message.keepValue ? value : null };
  } catch (error) {
    if (error instanceof core.ValidationError) {
      reply = { kind: 'validation', issues: error.issues.map((i) => ({ pointer: i.pointer, detail: i.detail })) };
    } else {
      const e = error ?? {};
      reply = { kind: 'error', name: String(e.name ?? typeof error), message: String(e.message ?? error), stack: String(e.stack ?? '') };
    }
  }
  try {
    parentPort.postMessage(reply);
  } catch (error) {
    parentPort.postMessage({ kind: 'error', name: 'DataCloneError', message: String(error), stack: '' });
  }
});
`;

/** A worker running the core, respawned after a call exhausts its heap. */
export class BoundedCore {
  private readonly code: string;
  private readonly heapMb: number;
  private readonly expressions: boolean;
  private worker: Worker | null = null;
  private pending = 0;

  /** Whether a call is still running (for example in a test that timed out). */
  get busy(): boolean {
    return this.pending > 0;
  }

  constructor(options: BoundedCoreOptions = {}) {
    const expressions = options.expressions ?? false;
    const output = buildSync({
      entryPoints: [ENTRY],
      bundle: true,
      platform: 'node',
      format: 'cjs',
      write: false,
      logLevel: 'silent',
      external: ['mathjs'],
    });
    this.code = output.outputFiles[0].text;
    this.expressions = expressions;
    this.heapMb = options.heapMb ?? 96;
  }

  /** Calls `fn(...args)` of the public API in the worker; `keepValue: false` returns the kind only. */
  call(fn: string, args: readonly unknown[], keepValue = true): Promise<Outcome> {
    const worker = (this.worker ??= new Worker(WORKER_BODY, {
      eval: true,
      workerData: { code: this.code, entry: ENTRY, expressions: this.expressions },
      resourceLimits: { maxOldGenerationSizeMb: this.heapMb, maxYoungGenerationSizeMb: 16 },
    }));
    this.pending++;
    return new Promise<Outcome>((resolve) => {
      const done = (outcome: Outcome): void => {
        this.pending--;
        worker.off('message', onMessage);
        worker.off('error', onError);
        resolve(outcome);
      };
      const onMessage = (reply: Outcome): void => done(reply);
      const onError = (error: Error & { code?: string }): void => {
        this.worker = null;
        void worker.terminate();
        done(
          error.code === 'ERR_WORKER_OUT_OF_MEMORY'
            ? { kind: 'exhausted', message: `${fn} kept allocating until the worker's ${this.heapMb} MB heap was exhausted (it does not finish)` }
            : { kind: 'error', name: error.name, message: error.message, stack: error.stack ?? '' },
        );
      };
      worker.on('message', onMessage);
      worker.on('error', onError);
      try {
        worker.postMessage({ fn, args, keepValue });
      } catch (error) {
        done({ kind: 'error', name: 'DataCloneError', message: String(error), stack: '' });
      }
    });
  }

  /** Stops the worker. */
  async close(): Promise<void> {
    const worker = this.worker;
    this.worker = null;
    this.pending = 0;
    if (worker) await worker.terminate();
  }
}

/** One line describing an outcome that was not a result, for failure messages. */
export function describeOutcome(outcome: Outcome): string {
  switch (outcome.kind) {
    case 'result':
      return 'returned a result';
    case 'validation':
      return `ValidationError ${JSON.stringify(outcome.issues)}`;
    case 'error':
      return `${outcome.name}: ${outcome.message}\n${outcome.stack}`;
    case 'exhausted':
      return outcome.message;
  }
}
