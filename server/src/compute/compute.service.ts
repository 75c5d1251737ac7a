/*
 * The compute routes' work: the core's own functions on the request body, nothing re-implemented. The core
 * validates the body (throwing ValidationError with pointers into it) and bounds its own work.
 */
import { closedLoop, designGains, locus, type ClosedLoopResult, type DesignResult, type LocusResult } from '@polewright/locus-core';
import type { ClosedLoopRequest, DesignRequest, LocusRequest } from '@polewright/locus-core';
import { PayloadTooLargeError } from '../http/errors.js';

/** Largest compute request body in bytes: a degree-60 plant with every option fits in a few kilobytes. */
export const MAX_COMPUTE_BODY_BYTES = 64 * 1024;

/** Throws `PayloadTooLargeError` when a declared body length is beyond `MAX_COMPUTE_BODY_BYTES`. */
export function checkComputeSize(contentLength: string | undefined): void {
  const length = Number(contentLength ?? 0);
  if (length > MAX_COMPUTE_BODY_BYTES) {
    throw new PayloadTooLargeError(`Compute requests may be at most ${MAX_COMPUTE_BODY_BYTES} bytes; this one has ${length}.`);
  }
}

/** `locus(body)` of the core. */
export function computeLocus(body: unknown): LocusResult {
  return locus(body as LocusRequest);
}

/** `closedLoop(body)` of the core. */
export function computeClosedLoop(body: unknown): ClosedLoopResult {
  return closedLoop(body as ClosedLoopRequest);
}

/** `designGains(body)` of the core. */
export function computeDesign(body: unknown): DesignResult {
  return designGains(body as DesignRequest);
}
