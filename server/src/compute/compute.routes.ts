import { Router, type RequestHandler, type Response } from 'express';
import type { AppContext } from '../context.js';
import { checkComputeSize, compute } from './compute.service.js';

/** Refuses oversized compute bodies before any work is done. */
const sizeGuard: RequestHandler = (req, _res, next) => {
  checkComputeSize(req.headers['content-length']);
  next();
};

/**
 * Sends the worker's JSON bytes as they are. Not `res.send`: that would hash every answer (~70 KB for a
 * degree-8 locus) into an ETag, which nobody can revalidate a POST with.
 */
function sendJson(res: Response, bytes: Buffer): void {
  res.status(200).set({ 'Content-Type': 'application/json; charset=utf-8', 'Content-Length': String(bytes.length) }).end(bytes);
}

/**
 * `POST /locus`, `POST /closed-loop`, `POST /design` (mounted under `/api/v1`): the body is the core's
 * request object and the answer its result object, unchanged (typed against the document in
 * compute-tasks.ts). Needs the `compute` permission; the work runs in the compute worker pool.
 */
export function computeRouter(context: AppContext): Router {
  const router = Router();
  router.post('/locus', sizeGuard, async (req, res) => {
    sendJson(res, await compute(context, 'locus', req.body));
  });
  router.post('/closed-loop', sizeGuard, async (req, res) => {
    sendJson(res, await compute(context, 'closed-loop', req.body));
  });
  router.post('/design', sizeGuard, async (req, res) => {
    sendJson(res, await compute(context, 'design', req.body));
  });
  return router;
}
