/*
 * A small pool of node:worker_threads running the engine off the event-loop thread, so that every core
 * computes while the main thread keeps answering. One task per worker at a time, a FIFO queue in front;
 * workers start on first use (up to `size`) and a worker that dies is replaced. Owned by the AppContext:
 * created in createContext, closed in closeContext.
 */
import { Worker } from 'node:worker_threads';
import { ValidationError } from '@polewright/locus-core';
import type { ComputeTask, ErrorPayload } from './compute-tasks.js';
import type { TaskMessage } from './compute-worker.js';

/** Runs compute tasks in worker threads. */
export interface ComputePool {
  /** Number of worker threads the pool may run. */
  readonly size: number;
  /** Runs a task; resolves with its JSON bytes, rejects with the core's ValidationError (re-created) or an Error. */
  run(task: ComputeTask, payload: unknown): Promise<Buffer>;
  /** Starts every worker now instead of on first use (the server does, so its memory is steady from the start). */
  warm(): void;
  /** Stops every worker; queued and running tasks are rejected. */
  close(): Promise<void>;
}

interface Job {
  readonly message: TaskMessage;
  resolve(bytes: Buffer): void;
  reject(error: Error): void;
}

interface Slot {
  readonly worker: Worker;
  job: Job | null;
}

type Reply = { id: number; ok: true; bytes: Uint8Array } | { id: number; ok: false; error: ErrorPayload };

/**
 * The worker entry beside this module: `compute-worker.js` in dist/server; from the TypeScript sources
 * (Vitest, tsx) the `.mjs` shim that registers tsx inside the worker first.
 */
export function workerEntry(moduleUrl: string = import.meta.url): URL {
  return new URL(moduleUrl.endsWith('.ts') ? './compute-worker-tsx.mjs' : './compute-worker.js', moduleUrl);
}

/** Re-creates a worker's error on this thread: ValidationError keeps its issues (→ 400 with the pointers). */
export function errorFrom(payload: ErrorPayload): Error {
  if (payload.name === 'ValidationError' && payload.issues) return new ValidationError(payload.issues);
  return new Error(`compute worker: ${payload.message}`);
}

/** Starts a pool of at most `size` (≥ 1) worker threads running `entry`. */
export function createComputePool(size: number, entry: URL = workerEntry()): ComputePool {
  const limit = Math.max(1, Math.floor(size));
  const slots: Slot[] = [];
  const queue: Job[] = [];
  let nextId = 1;
  let closed = false;

  const spawn = (): Slot => {
    const slot: Slot = { worker: new Worker(entry), job: null };
    const fail = (error: Error) => {
      const index = slots.indexOf(slot);
      if (index >= 0) slots.splice(index, 1);
      slot.job?.reject(error);
      slot.job = null;
      if (!closed) dispatch();
    };
    slot.worker.on('message', (reply: Reply) => {
      const job = slot.job;
      slot.job = null;
      slot.worker.unref();
      if (job && job.message.id === reply.id) {
        if (reply.ok) job.resolve(Buffer.from(reply.bytes.buffer, reply.bytes.byteOffset, reply.bytes.byteLength));
        else job.reject(errorFrom(reply.error));
      }
      dispatch();
    });
    slot.worker.on('error', (error) => fail(error));
    slot.worker.on('exit', (code) => fail(new Error(`compute worker stopped (exit code ${code})`)));
    slots.push(slot);
    return slot;
  };

  const dispatch = (): void => {
    while (queue.length && !closed) {
      const slot = slots.find((s) => s.job === null) ?? (slots.length < limit ? spawn() : undefined);
      if (!slot) return;
      const job = queue.shift() as Job;
      slot.job = job;
      // a busy worker keeps the process alive; an idle one does not
      slot.worker.ref();
      slot.worker.postMessage(job.message);
    }
  };

  return {
    size: limit,
    run(task, payload) {
      if (closed) return Promise.reject(new Error('the compute pool is closed'));
      return new Promise<Buffer>((resolve, reject) => {
        queue.push({ message: { id: nextId++, task, payload }, resolve, reject });
        dispatch();
      });
    },
    warm() {
      // idle workers do not keep the process alive
      while (!closed && slots.length < limit) spawn().worker.unref();
    },
    async close() {
      closed = true;
      const stopped = new Error('the compute pool is closed');
      for (const job of queue.splice(0)) job.reject(stopped);
      await Promise.all(slots.map((s) => s.worker.terminate()));
      slots.length = 0;
    },
  };
}
