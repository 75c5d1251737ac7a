/*
 * The compute routes' work: the core's own functions on the request body, nothing re-implemented, run in
 * the context's worker pool (compute-pool.ts). The core validates the body (throwing ValidationError with
 * pointers into it, re-created on this thread) and bounds its own work.
 */
import type { AppContext } from '../context.js';
import { PayloadTooLargeError } from '../http/errors.js';
import { type ComputeTask, runTask } from './compute-tasks.js';

/** Largest compute request body in bytes: a degree-60 plant with every option fits in a few kilobytes. */
export const MAX_COMPUTE_BODY_BYTES = 64 * 1024;

/** Throws `PayloadTooLargeError` when a declared body length is beyond `MAX_COMPUTE_BODY_BYTES`. */
export function checkComputeSize(contentLength: string | undefined): void {
  const length = Number(contentLength ?? 0);
  if (length > MAX_COMPUTE_BODY_BYTES) {
    throw new PayloadTooLargeError(`Compute requests may be at most ${MAX_COMPUTE_BODY_BYTES} bytes; this one has ${length}.`);
  }
}

/**
 * Runs a compute task (`locus`, `closed-loop`, `design`, `loop-locus`) and answers the result as JSON
 * bytes: in the context's worker pool, or on this thread when the context has none.
 */
export async function compute(context: AppContext, task: ComputeTask, payload: unknown): Promise<Buffer> {
  if (context.compute) return context.compute.run(task, payload);
  const bytes = runTask(task, payload);
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}
