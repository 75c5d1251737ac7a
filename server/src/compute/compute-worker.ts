/*
 * Entry of one compute worker thread (see compute-pool.ts): runs tasks posted by the pool and answers
 * with the JSON bytes (transferred, not copied) or a structured-clone-safe description of the error.
 */
import { parentPort } from 'node:worker_threads';
import { type ComputeTask, describeError, runTask } from './compute-tasks.js';

/** One message from the pool. */
export interface TaskMessage {
  readonly id: number;
  readonly task: ComputeTask;
  readonly payload: unknown;
}

const port = parentPort;
if (!port) throw new Error('compute-worker runs only as a worker thread');
port.on('message', ({ id, task, payload }: TaskMessage) => {
  try {
    const bytes = runTask(task, payload);
    port.postMessage({ id, ok: true, bytes }, [bytes.buffer as ArrayBuffer]);
  } catch (error) {
    port.postMessage({ id, ok: false, error: describeError(error) });
  }
});
