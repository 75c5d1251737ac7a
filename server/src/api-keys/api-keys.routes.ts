import { Router } from 'express';
import type { Permission } from '../auth/permissions.js';
import type { AppContext } from '../context.js';
import type { components } from '../openapi/api-types.js';
import { listApiKeys } from './api-keys.repository.js';
import { apiKeyView, issueApiKey, revokeApiKey } from './api-keys.service.js';

type S = components['schemas'];

/** Admin API keys: issue (secret shown once), list (never secrets), revoke. */
export function apiKeysRouter(context: AppContext): Router {
  const router = Router();
  router.get('/api-keys', async (_req, res) => {
    res.json({ items: (await listApiKeys(context)).map(apiKeyView) });
  });
  router.post('/api-keys', async (req, res) => {
    const input = req.body as S['ApiKeyCreate'];
    const { key, secret } = await issueApiKey(context, req.principal!, { name: input.name, scopes: input.scopes as Permission[], expiresAt: input.expiresAt });
    const body: S['ApiKeyCreated'] = { ...apiKeyView(key), secret };
    res.status(201).json(body);
  });
  router.delete('/api-keys/:id', async (req, res) => {
    await revokeApiKey(context, req.principal!, req.params['id'] as string);
    res.status(204).end();
  });
  return router;
}
