import { Router } from 'express';
import swaggerUi from 'swagger-ui-express';
import type { AppContext } from '../context.js';
import { now } from '../context.js';
import { devMailbox } from '../mail/mailer.js';
import { loadApiDocument } from '../openapi/api-document.js';
import type { components } from '../openapi/api-types.js';

const VERSION = '1.0.0';

/** `GET /api/health` (no auth; says whether the dev mailbox is there), `GET /api/openapi.json` (the bundled contract) and `GET /api/docs` (Swagger UI). */
export function healthRouter(context: AppContext): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    await context.dataSource.query('SELECT 1');
    // mailbox: whether GET /v1/dev/mailbox answers, so that a front end can leave out its mailbox page
    const mailbox = devMailbox(context.config, context.mailer) !== null;
    const body: components['schemas']['Health'] = { status: 'ok', version: VERSION, time: now(context).toISOString(), mailbox };
    res.json(body);
  });
  router.get('/openapi.json', async (_req, res) => {
    res.json(await loadApiDocument(context.config.openapiPath));
  });
  router.use('/docs', swaggerUi.serve);
  router.get('/docs', swaggerUi.setup(undefined, { swaggerOptions: { url: '/api/openapi.json' }, customSiteTitle: 'Polewright API' }));
  return router;
}
