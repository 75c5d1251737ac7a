import { Router, type RequestHandler } from 'express';
import { authorize } from '../auth/authorize.js';
import type { AppContext } from '../context.js';
import type { components } from '../openapi/api-types.js';
import { checkComputeSize, computeClosedLoop, computeDesign, computeLocus } from './compute.service.js';

type S = components['schemas'];

/** Refuses oversized compute bodies before any work is done. */
const sizeGuard: RequestHandler = (req, _res, next) => {
  checkComputeSize(req.headers['content-length']);
  next();
};

/**
 * `POST /locus`, `POST /closed-loop`, `POST /design` (mounted under `/api/v1`): the body is the core's
 * request object and the answer its result object, unchanged. Needs the `compute` permission.
 */
export function computeRouter(_context: AppContext): Router {
  const router = Router();
  router.post('/locus', authorize('compute'), sizeGuard, (req, res) => {
    const body: S['LocusResult'] = computeLocus(req.body);
    res.json(body);
  });
  router.post('/closed-loop', authorize('compute'), sizeGuard, (req, res) => {
    const body: S['ClosedLoopResult'] = computeClosedLoop(req.body);
    res.json(body);
  });
  router.post('/design', authorize('compute'), sizeGuard, (req, res) => {
    const body: S['DesignResult'] = computeDesign(req.body);
    res.json(body);
  });
  return router;
}
