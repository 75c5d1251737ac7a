import { Router, type RequestHandler } from 'express';
import type { AppContext } from '../context.js';
import { checkComputeSize, compute } from './compute.service.js';

/** Refuses oversized compute bodies before any work is done. */
const sizeGuard: RequestHandler = (req, _res, next) => {
  checkComputeSize(req.headers['content-length']);
  next();
};

/**
 * `POST /locus`, `POST /closed-loop`, `POST /design` (mounted under `/api/v1`): the body is the core's
 * request object and the answer its result object, unchanged (typed against the document in
 * compute-tasks.ts). Needs the `compute` permission; the work runs in the compute worker pool.
 */
export function computeRouter(context: AppContext): Router {
  const router = Router();
  router.post('/locus', sizeGuard, async (req, res) => {
    res.type('application/json').send(await compute(context, 'locus', req.body));
  });
  router.post('/closed-loop', sizeGuard, async (req, res) => {
    res.type('application/json').send(await compute(context, 'closed-loop', req.body));
  });
  router.post('/design', sizeGuard, async (req, res) => {
    res.type('application/json').send(await compute(context, 'design', req.body));
  });
  return router;
}
