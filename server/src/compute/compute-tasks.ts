/*
 * The work the compute workers do: the core's own functions, nothing re-implemented, answered as UTF-8
 * JSON bytes (serialised in the worker, so the event-loop thread only sends them).
 */
import { closedLoop, designGains, locus, type ClosedLoopRequest, type DesignRequest, type LocusRequest } from '@polewright/locus-core';
import { loopLocus } from '../models/loop-locus.js';
import type { LoopParts } from '@polewright/locus-core';
import type { components } from '../openapi/api-types.js';

type S = components['schemas'];

// the return types tie the core's results to the document's schemas: tsc fails when they drift apart
const TASKS = {
  locus: (body: unknown): S['LocusResult'] => locus(body as LocusRequest),
  'closed-loop': (body: unknown): S['ClosedLoopResult'] => closedLoop(body as ClosedLoopRequest),
  design: (body: unknown): S['DesignResult'] => designGains(body as DesignRequest),
  'loop-locus': (parts: unknown): S['LocusResult'] => loopLocus(parts as LoopParts),
} as const;

/** The tasks a compute worker runs: `locus`, `closedLoop`, `designGains` on a request body, a stored loop's locus. */
export type ComputeTask = keyof typeof TASKS;

const encoder = new TextEncoder();

/** Runs one task and answers its result as UTF-8 JSON; the core's ValidationError is thrown unchanged. */
export function runTask(task: ComputeTask, payload: unknown): Uint8Array {
  const run = TASKS[task];
  if (!run) throw new Error(`unknown compute task ${String(task)}`);
  return encoder.encode(JSON.stringify(run(payload)));
}

/** A thrown error as plain data that survives structured cloning (issues kept for ValidationError). */
export interface ErrorPayload {
  readonly name: string;
  readonly message: string;
  readonly issues?: readonly { pointer: string; detail: string }[];
}

/** Describes a thrown value as an `ErrorPayload`. */
export function describeError(error: unknown): ErrorPayload {
  if (error instanceof Error) {
    const issues = (error as { issues?: unknown }).issues;
    if (error.name === 'ValidationError' && Array.isArray(issues)) {
      return { name: error.name, message: error.message, issues: issues.map((i: { pointer: unknown; detail: unknown }) => ({ pointer: String(i.pointer), detail: String(i.detail) })) };
    }
    return { name: error.name, message: error.message };
  }
  return { name: 'Error', message: String(error) };
}
