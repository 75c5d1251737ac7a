import { Router } from 'express';
import type { AppContext } from '../context.js';
import { NotFoundError } from '../http/problem.js';
import type { components } from '../openapi/api-types.js';
import { devMailbox } from './mailer.js';

/** `GET /dev/mailbox` (admin): mail captured by the local fake SMTP server, newest first; absent in production. */
export function mailboxRouter(context: AppContext): Router {
  const router = Router();
  router.get('/dev/mailbox', (_req, res) => {
    const captured = devMailbox(context.config, context.mailer);
    if (captured === null) throw new NotFoundError('The development mailbox (production, or mail goes to SMTP_URL)');
    const body: components['schemas']['Mailbox'] = { items: [...captured].reverse() };
    res.json(body);
  });
  return router;
}
