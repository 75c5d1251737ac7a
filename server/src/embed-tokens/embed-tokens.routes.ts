import { Router } from 'express';
import type { AppContext } from '../context.js';
import type { components } from '../openapi/api-types.js';
import { issueEmbedToken } from './embed-tokens.service.js';

type S = components['schemas'];

/** `POST /embed-tokens`: a short-lived read-only token for widgets, bound to models and origins (needs models:read). */
export function embedTokensRouter(context: AppContext): Router {
  const router = Router();
  router.post('/embed-tokens', async (req, res) => {
    const body: S['EmbedTokenCreated'] = await issueEmbedToken(context, req.principal!, req.body as S['EmbedTokenCreate']);
    res.status(201).json(body);
  });
  return router;
}
