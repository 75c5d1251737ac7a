import { Router } from 'express';
import type { AppContext } from '../context.js';
import { pagingOf } from '../http/paging.js';
import type { components } from '../openapi/api-types.js';
import { findAuditEvents } from './audit.repository.js';

function isoOrUndefined(value: unknown): string | undefined {
  return typeof value === 'string' && value !== '' ? new Date(value).toISOString() : undefined;
}

/** `GET /audit` (admin): filter by action (or prefix), actor and time; paged, newest first. */
export function auditRouter(context: AppContext): Router {
  const router = Router();
  router.get('/audit', async (req, res) => {
    const { page, pageSize } = pagingOf(req);
    const q = req.query;
    const { items, total } = await findAuditEvents(context, {
      action: typeof q['action'] === 'string' ? q['action'] : undefined,
      actorId: typeof q['actorId'] === 'string' ? q['actorId'] : undefined,
      from: isoOrUndefined(q['from']),
      to: isoOrUndefined(q['to']),
      page,
      pageSize,
    });
    const body: components['schemas']['AuditPage'] = { items, total, page, pageSize };
    res.json(body);
  });
  return router;
}
