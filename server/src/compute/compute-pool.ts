/*
 * A small pool of node:worker_threads running the engine off the event-loop thread, so that every core
 * computes while the main thread keeps answering. A FIFO queue in front; each worker holds at most
 * PIPELINE_DEPTH tasks (the one it runs and the next, waiting in its own message queue), so that it starts
 * the next task the moment it posts an answer instead of idling until this thread, busy parsing and
 * sending, reads that answer and hands it more work. An idle worker is always preferred, so a second task
 * only waits behind a running one when every worker is busy. Workers start on first use (up to `size`);
 * a worker that dies is replaced: the task it was running is rejected, the one waiting in it goes back
 * to the front of the queue. Owned by the AppContext: created in createContext, closed in closeContext.
 */
import { Worker } from 'node:worker_threads';
import { ValidationError } from '@polewright/locus-core';
import type { ComputeTask, ErrorPayload } from './compute-tasks.js';
import type { TaskMessage } from './compute-worker.js';

/** Tasks handed to one worker at a time: the running one and the next (measured: 2 beats 1, see DEVELOPERS.md "Load"). */
export const PIPELINE_DEPTH = 2;

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
  /** The tasks this worker holds, by message id, in the order it runs them. */
  readonly jobs: Map<number, Job>;
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
    const slot: Slot = { worker: new Worker(entry), jobs: new Map() };
    const fail = (error: Error) => {
      const index = slots.indexOf(slot);
      if (index >= 0) slots.splice(index, 1);
      // a worker runs its tasks one at a time in order: the oldest was running, the others had not started
      const [running, ...waiting] = slot.jobs.values();
      slot.jobs.clear();
      running?.reject(error);
      if (closed) for (const job of waiting) job.reject(error);
      else {
        queue.unshift(...waiting);
        dispatch();
      }
    };
    slot.worker.on('message', (reply: Reply) => {
      const job = slot.jobs.get(reply.id);
      if (job) {
        slot.jobs.delete(reply.id);
        if (reply.ok) job.resolve(Buffer.from(reply.bytes.buffer, reply.bytes.byteOffset, reply.bytes.byteLength));
        else job.reject(errorFrom(reply.error));
      }
      // an idle worker does not keep the process alive
      if (slot.jobs.size === 0) slot.worker.unref();
      dispatch();
    });
    slot.worker.on('error', (error) => fail(error));
    slot.worker.on('exit', (code) => fail(new Error(`compute worker stopped (exit code ${code})`)));
    slots.push(slot);
    return slot;
  };

  /** An idle worker, else a new one while under the limit, else the least busy one with room. */
  const pick = (): Slot | undefined => {
    let best: Slot | undefined;
    for (const slot of slots) {
      if (slot.jobs.size === 0) return slot;
      if (slot.jobs.size < PIPELINE_DEPTH && (!best || slot.jobs.size < best.jobs.size)) best = slot;
    }
    return slots.length < limit ? spawn() : best;
  };

  const dispatch = (): void => {
    while (queue.length && !closed) {
      const slot = pick();
      if (!slot) return;
      const job = queue.shift() as Job;
      // a busy worker keeps the process alive
      if (slot.jobs.size === 0) slot.worker.ref();
      slot.jobs.set(job.message.id, job);
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
      for (const slot of slots) {
        for (const job of slot.jobs.values()) job.reject(stopped);
        slot.jobs.clear();
      }
      await Promise.all(slots.map((s) => s.worker.terminate()));
      slots.length = 0;
    },
  };
}
