/*
 * The server and its contract agree: every operation of openapi/openapi.yaml is implemented (a real
 * request with valid input answers 2xx/3xx, never "no such route" or 405), and no route exists outside
 * the document (the Express router stack, walked, gives exactly the document's operations). Each probe's
 * response is validated against the document as well.
 */
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/src/app.js';
import { loadApiDocument } from '../../server/src/openapi/api-document.js';
import { openSession } from '../../server/src/sessions/sessions.service.js';
import { startTestServer, type TestServer } from '../../server/src/testing/test-server.js';

const METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options', 'trace'] as const;
const PLANT = { expression: '5*(s+2)/(s*(s+1)*(s+8))' };

interface Ids {
  model: string;
  revision: number;
  spare: string;
  user: string;
  key: string;
  invitation: string;
}

/** One valid request per operation, run in this order (delete before restore) with a fresh admin session. */
const PROBES: Record<string, (api: ReturnType<typeof request>, ids: Ids) => request.Test> = {
  getHealth: (api) => api.get('/api/health'),
  getOpenApiDocument: (api) => api.get('/api/openapi.json'),
  getApiDocs: (api) => api.get('/api/docs/'),
  computeLocus: (api) => api.post('/api/v1/locus').send({ plant: PLANT }),
  computeClosedLoop: (api) => api.post('/api/v1/closed-loop').send({ plant: PLANT, gain: 3 }),
  computeDesign: (api) => api.post('/api/v1/design').send({ plant: PLANT, targets: { minDampingRatio: 0.4 } }),
  listModels: (api) => api.get('/api/v1/models'),
  createModel: (api) => api.post('/api/v1/models').send({ name: 'Contract probe', plant: PLANT }),
  importModels: (api) => api.post('/api/v1/models/import').attach('file', Buffer.from('name,expression\nContract import,1/(s+2)\n'), { filename: 'models.csv', contentType: 'text/csv' }),
  exportModels: (api) => api.get('/api/v1/models/export'),
  listModelTags: (api) => api.get('/api/v1/models/tags'),
  getModel: (api, ids) => api.get(`/api/v1/models/${ids.model}`),
  updateModel: (api, ids) => api.put(`/api/v1/models/${ids.model}`).set('If-Match', `"${ids.model}-r${ids.revision}"`).send({ name: 'Contract probe, changed', plant: PLANT }),
  deleteModel: (api, ids) => api.delete(`/api/v1/models/${ids.spare}`),
  restoreModel: (api, ids) => api.post(`/api/v1/models/${ids.spare}/restore`),
  listModelRevisions: (api, ids) => api.get(`/api/v1/models/${ids.model}/revisions`),
  getModelRevision: (api, ids) => api.get(`/api/v1/models/${ids.model}/revisions/1`),
  getModelLocus: (api, ids) => api.get(`/api/v1/models/${ids.model}/locus`),
  createSession: (api) => api.post('/api/v1/sessions').send({ email: 'vera.viewer@quillfield.example', password: 'quillfield-viewer-2026' }),
  deleteCurrentSession: (api) => api.delete('/api/v1/sessions/current'),
  getMe: (api) => api.get('/api/v1/me'),
  updateMe: (api) => api.patch('/api/v1/me').send({ name: 'Ada (renamed by the contract test)' }),
  listUsers: (api) => api.get('/api/v1/users?q=quillfield&role=viewer&status=active&sort=name&order=desc'),
  inviteUser: (api) => api.post('/api/v1/users').send({ email: 'contract.probe@quillfield.example', role: 'viewer' }),
  getUser: (api, ids) => api.get(`/api/v1/users/${ids.user}`),
  updateUser: (api, ids) => api.patch(`/api/v1/users/${ids.user}`).send({ name: 'Vera (renamed by the contract test)' }),
  getInvitation: (api, ids) => api.get(`/api/v1/invitations/${ids.invitation}`),
  acceptInvitation: (api, ids) => api.post(`/api/v1/invitations/${ids.invitation}/accept`).send({ name: 'Invited Probe', password: 'invited-probe-password' }),
  listApiKeys: (api) => api.get('/api/v1/api-keys'),
  createApiKey: (api) => api.post('/api/v1/api-keys').send({ name: 'contract', scopes: ['compute'] }),
  revokeApiKey: (api, ids) => api.delete(`/api/v1/api-keys/${ids.key}`),
  createEmbedToken: (api, ids) => api.post('/api/v1/embed-tokens').send({ modelIds: [ids.model], origins: ['https://intranet.quillfield.example'], ttlSeconds: 300 }),
  listAuditEvents: (api) => api.get('/api/v1/audit?action=session.'),
  getDevMailbox: (api) => api.get('/api/v1/dev/mailbox'),
};

interface Operation {
  operationId: string;
  method: string;
  path: string;
}

/** Express paths (`/api/v1/models/:id`) as document paths under the server `/api` (`/v1/models/{id}`). */
function documentPath(expressPath: string): string {
  return expressPath.replace(/^\/api/, '').replace(/:(\w+)/g, '{$1}');
}

interface Layer {
  rawPath?: string;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle: { stack?: Layer[] };
}

/** Every route of the app as "METHOD /document/path", walking mounted routers. */
function routesOf(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        if (typeof layer.route.path !== 'string') continue; // the console's client-side fallback (a RegExp, outside /api)
        const full = prefix + layer.route.path;
        for (const [method, on] of Object.entries(layer.route.methods)) if (on && method !== '_all') found.push(`${method.toUpperCase()} ${full}`);
      } else if (layer.handle.stack) {
        walk(layer.handle.stack, prefix + (layer.rawPath && layer.rawPath !== '/' ? layer.rawPath : ''));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return found.filter((r) => r.split(' ')[1]?.startsWith('/api')).map((r) => {
    const [method, path] = r.split(' ') as [string, string];
    return `${method} ${documentPath(path)}`;
  });
}

describe('the server implements exactly the OpenAPI document', () => {
  let server: TestServer;
  let operations: Operation[];
  beforeAll(async () => {
    // responses are checked against the document too: a drift between a handler and its schema is a 500 here
    server = await startTestServer({ env: { OPENAPI_VALIDATE_RESPONSES: '1' } });
    const doc = await loadApiDocument(server.config.openapiPath);
    operations = Object.entries(doc.paths ?? {}).flatMap(([path, item]) =>
      METHODS.filter((m) => (item as Record<string, unknown>)[m]).map((m) => ({ operationId: ((item as Record<string, { operationId?: string }>)[m]?.operationId ?? `${m} ${path}`) as string, method: m.toUpperCase(), path })),
    );
  });
  afterAll(() => server.close());

  it('has a probe for every operation, and every operation has a unique operationId', () => {
    const idsInDoc = operations.map((o) => o.operationId);
    expect(new Set(idsInDoc).size).toBe(idsInDoc.length);
    expect([...idsInDoc].sort()).toEqual(Object.keys(PROBES).sort());
  });

  it('has no route outside the document and no operation without a route', () => {
    const routes = [...new Set(routesOf(createApp(server.context)))].sort();
    const documented = operations.map((o) => `${o.method} ${o.path}`).sort();
    expect(routes).toEqual(documented);
  });

  it('answers every operation with valid input with 2xx or 3xx', async () => {
    const db = server.context.dataSource;
    const models = (await db.query('SELECT id, revision FROM models WHERE deleted_at IS NULL ORDER BY name')) as { id: string; revision: number }[];
    const viewer = (await db.query("SELECT id FROM users WHERE role = 'viewer'")) as { id: string }[];
    const adminId = ((await db.query("SELECT id FROM users WHERE role = 'admin'")) as { id: string }[])[0]?.id as string;
    const key = await request(server.baseUrl).post('/api/v1/api-keys').auth(server.tokens.admin, { type: 'bearer' }).send({ name: 'to revoke', scopes: ['compute'] });
    await request(server.baseUrl).post('/api/v1/users').auth(server.tokens.admin, { type: 'bearer' }).send({ email: 'invited.probe@quillfield.example', role: 'viewer' });
    const mail = server.context.mailer.captured?.find((m) => m.to.includes('invited.probe@quillfield.example'));
    const ids: Ids = {
      model: models[0]?.id as string,
      revision: models[0]?.revision as number,
      spare: models[1]?.id as string,
      user: viewer[0]?.id as string,
      key: key.body.id,
      invitation: (/(pwi_[A-Za-z0-9_-]+)/.exec(mail?.text ?? '') ?? [])[1] as string,
    };
    const answers: Record<string, number> = {};
    for (const [operationId, probe] of Object.entries(PROBES)) {
      const { token } = await openSession(server.context, adminId);
      const res = await probe(request(server.baseUrl), ids).set('Authorization', `Bearer ${token}`);
      answers[operationId] = res.status;
      expect(res.status, `${operationId}: ${res.text.slice(0, 300)}`).toBeLessThan(400);
    }
    expect(Object.keys(answers)).toHaveLength(operations.length);
  });

  it('answers a path outside the document with "no such route" and a wrong method with 405', async () => {
    const miss = await request(server.baseUrl).get('/api/v1/modelz').auth(server.tokens.admin, { type: 'bearer' });
    expect(miss.status).toBe(404);
    expect(miss.body.type).toBe('urn:polewright:problem:no-such-route');
    const wrong = await request(server.baseUrl).patch('/api/v1/api-keys').auth(server.tokens.admin, { type: 'bearer' }).send({});
    expect(wrong.status).toBe(405);
  });
});
