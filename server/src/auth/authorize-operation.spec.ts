import express, { type Express } from 'express';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { problemHandler } from '../http/problem.js';
import { authorizedOperation, authorizeOperation, requireAuthorizedOperation } from './authorize-operation.js';
import type { Permission } from './permissions.js';
import type { Principal } from './principal.js';

const ok = { '200': { description: 'ok' } };
const DOCUMENT = {
  openapi: '3.1.0',
  info: { title: 'probe', version: '1' },
  servers: [{ url: '/api' }],
  paths: {
    '/v1/models/{id}': {
      get: { operationId: 'getModel', 'x-polewright-permission': 'models:read', responses: ok },
      put: { operationId: 'updateModel', 'x-polewright-permission': 'models:write', responses: ok },
    },
    '/v1/sign-in': { post: { operationId: 'signIn', security: [], 'x-polewright-permission': 'public', responses: ok } },
  },
} as unknown as OpenAPIV3_1.Document;

const PRINCIPALS: Record<string, Principal> = {
  viewer: { kind: 'session', userId: 'u1', role: 'viewer', scopes: new Set<Permission>(['models:read', 'compute']), modelIds: null, origins: null, tokenId: 's1' },
  engineer: { kind: 'session', userId: 'u2', role: 'engineer', scopes: new Set<Permission>(['models:read', 'models:write', 'compute']), modelIds: null, origins: null, tokenId: 's2' },
  embed: { kind: 'embed', userId: 'u2', role: null, scopes: new Set<Permission>(['models:read']), modelIds: ['m-1'], origins: ['https://page.example'], tokenId: 'e1' },
};

/**
 * The order of app.ts in small: a stand-in principal (header `x-as`), authorisation, the JSON body, then
 * a router behind the guard that answers what it saw. `/api/v1/undocumented` has a route but no operation.
 */
function appWith(document: Promise<OpenAPIV3_1.Document>): Express {
  const app = express();
  app.use((req, _res, next) => {
    const who = req.headers['x-as'];
    if (typeof who === 'string') req.principal = PRINCIPALS[who];
    next();
  });
  app.use('/api', authorizeOperation(document));
  app.use('/api', express.json());
  const router = express.Router();
  router.all('/{*rest}', (req, res) => {
    res.json({ operation: authorizedOperation(req)?.operationId, body: req.body ?? null });
  });
  app.use('/api/v1', requireAuthorizedOperation(), router);
  app.use(problemHandler(() => undefined));
  return app;
}

describe('authorizeOperation', () => {
  const app = appWith(Promise.resolve(DOCUMENT));

  it('lets the right caller through to the router with the operation it was authorised for', async () => {
    const res = await request(app).put('/api/v1/models/m-1').set('x-as', 'engineer').send({ name: 'x' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ operation: 'updateModel', body: { name: 'x' } });
  });

  it('refuses the wrong role before the body is even parsed', async () => {
    const res = await request(app).put('/api/v1/models/m-1').set('x-as', 'viewer').set('Content-Type', 'application/json').send('{ not json');
    expect(res.status).toBe(403);
    expect(res.body.detail).toMatch(/viewer role does not allow this \(needs models:write\)/);
  });

  it('answers 401 without a principal, and lets anyone call a public operation', async () => {
    expect((await request(app).get('/api/v1/models/m-1')).status).toBe(401);
    const open = await request(app).post('/api/v1/sign-in').send({});
    expect(open.status).toBe(200);
    expect(open.body.operation).toBe('signIn');
  });

  it('binds {id} for the embed rule: its own model only, and only to read', async () => {
    expect((await request(app).get('/api/v1/models/m-1').set('x-as', 'embed')).status).toBe(200);
    expect((await request(app).get('/api/v1/models/m-2').set('x-as', 'embed')).status).toBe(403);
    expect((await request(app).put('/api/v1/models/m-1').set('x-as', 'embed').send({})).status).toBe(403);
  });

  it('keeps a request that matches no operation from reaching a router (404)', async () => {
    const res = await request(app).get('/api/v1/undocumented').set('x-as', 'engineer');
    expect(res.status).toBe(404);
    expect(res.body.type).toBe('urn:polewright:problem:no-such-route');
  });

  it('fails closed when the document cannot be read or does not say what an operation needs', async () => {
    const broken = appWith(Promise.reject(new Error('openapi.yaml: not found')));
    expect((await request(broken).post('/api/v1/sign-in').send({})).status).toBe(500);
    const loose = structuredClone(DOCUMENT) as unknown as { paths: Record<string, Record<string, Record<string, unknown>>> };
    delete loose.paths['/v1/sign-in']?.['post']?.['x-polewright-permission'];
    const unsaid = appWith(Promise.resolve(loose as unknown as OpenAPIV3_1.Document));
    expect((await request(unsaid).get('/api/v1/models/m-1').set('x-as', 'engineer')).status).toBe(500);
  });
});
