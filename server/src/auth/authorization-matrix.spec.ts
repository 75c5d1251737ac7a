/*
 * The authorisation matrix: every protected operation of the OpenAPI document × every kind of bad
 * credential → 401 or 403, and nothing stored changes. A new operation without a row here fails the
 * "covers every operation" test.
 */
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadApiDocument } from '../openapi/api-document.js';
import { openSession } from '../sessions/sessions.service.js';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { hashPassword } from './password.js';
import { API_KEY_SCOPES, type Permission, ROLE_PERMISSIONS, ROLES } from './permissions.js';
import { insertUser } from '../users/users.repository.js';

const PAGE = 'https://intranet.quillfield.example';
const FOREIGN = 'https://elsewhere.example';
const PLANT = { expression: '2*(s+1)/(s*(s+3)*(s+6))' };

/** What an operation needs: a permission, or a signed-in session of any role. */
type Need = Permission | 'session';

interface Row {
  operationId: string;
  need: Need;
  send: (api: request.Agent, ids: { a: string; b: string; revision: number; user: string; key: string }) => request.Test;
}

const ROWS: Row[] = [
  { operationId: 'computeLocus', need: 'compute', send: (api) => api.post('/api/v1/locus').send({ plant: PLANT }) },
  { operationId: 'computeClosedLoop', need: 'compute', send: (api) => api.post('/api/v1/closed-loop').send({ plant: PLANT, gain: 2 }) },
  { operationId: 'computeDesign', need: 'compute', send: (api) => api.post('/api/v1/design').send({ plant: PLANT }) },
  { operationId: 'listModels', need: 'models:read', send: (api) => api.get('/api/v1/models') },
  { operationId: 'createModel', need: 'models:write', send: (api) => api.post('/api/v1/models').send({ name: 'Matrix probe', plant: PLANT }) },
  {
    operationId: 'importModels',
    need: 'models:write',
    send: (api) => api.post('/api/v1/models/import').attach('file', Buffer.from('name,expression\nMatrix import,1/(s+1)\n'), { filename: 'models.csv', contentType: 'text/csv' }),
  },
  { operationId: 'exportModels', need: 'models:read', send: (api) => api.get('/api/v1/models/export') },
  { operationId: 'listModelTags', need: 'models:read', send: (api) => api.get('/api/v1/models/tags') },
  { operationId: 'getModel', need: 'models:read', send: (api, ids) => api.get(`/api/v1/models/${ids.b}`) },
  { operationId: 'updateModel', need: 'models:write', send: (api, ids) => api.put(`/api/v1/models/${ids.b}`).set('If-Match', `"${ids.b}-r${ids.revision}"`).send({ name: 'Changed by the matrix', plant: PLANT }) },
  { operationId: 'deleteModel', need: 'models:write', send: (api, ids) => api.delete(`/api/v1/models/${ids.b}`) },
  { operationId: 'restoreModel', need: 'models:write', send: (api, ids) => api.post(`/api/v1/models/${ids.b}/restore`) },
  { operationId: 'listModelRevisions', need: 'models:read', send: (api, ids) => api.get(`/api/v1/models/${ids.b}/revisions`) },
  { operationId: 'getModelRevision', need: 'models:read', send: (api, ids) => api.get(`/api/v1/models/${ids.b}/revisions/1`) },
  { operationId: 'getModelLocus', need: 'models:read', send: (api, ids) => api.get(`/api/v1/models/${ids.b}/locus`) },
  { operationId: 'deleteCurrentSession', need: 'session', send: (api) => api.delete('/api/v1/sessions/current') },
  { operationId: 'getMe', need: 'session', send: (api) => api.get('/api/v1/me') },
  { operationId: 'updateMe', need: 'session', send: (api) => api.patch('/api/v1/me').send({ name: 'Changed by the matrix' }) },
  { operationId: 'listUsers', need: 'admin', send: (api) => api.get('/api/v1/users') },
  { operationId: 'inviteUser', need: 'admin', send: (api) => api.post('/api/v1/users').send({ email: `matrix.${randomUUID().slice(0, 8)}@quillfield.example`, role: 'viewer' }) },
  { operationId: 'getUser', need: 'admin', send: (api, ids) => api.get(`/api/v1/users/${ids.user}`) },
  { operationId: 'updateUser', need: 'admin', send: (api, ids) => api.patch(`/api/v1/users/${ids.user}`).send({ role: 'admin' }) },
  { operationId: 'listApiKeys', need: 'admin', send: (api) => api.get('/api/v1/api-keys') },
  { operationId: 'createApiKey', need: 'admin', send: (api) => api.post('/api/v1/api-keys').send({ name: 'matrix', scopes: ['compute'] }) },
  { operationId: 'revokeApiKey', need: 'admin', send: (api, ids) => api.delete(`/api/v1/api-keys/${ids.key}`) },
  { operationId: 'createEmbedToken', need: 'models:read', send: (api, ids) => api.post('/api/v1/embed-tokens').send({ modelIds: [ids.b], origins: [PAGE], ttlSeconds: 600 }) },
  { operationId: 'listAuditEvents', need: 'admin', send: (api) => api.get('/api/v1/audit') },
  { operationId: 'getDevMailbox', need: 'admin', send: (api) => api.get('/api/v1/dev/mailbox') },
];

const METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options', 'trace'] as const;

/** Whether a signed-in person of this role may call an operation that needs `need`. */
function roleMay(role: (typeof ROLES)[number], need: Need): boolean {
  return need === 'session' || ROLE_PERMISSIONS[role].includes(need);
}

/** Requests the validator would refuse (400 with `pointer`): authorisation must answer first. */
interface InvalidRow {
  operationId: string;
  need: Need;
  pointer: string;
  send: (api: request.Agent, ids: { a: string; b: string; revision: number; user: string; key: string }) => request.Test;
}

const INVALID: InvalidRow[] = [
  { operationId: 'updateModel', need: 'models:write', pointer: '/name', send: (api, ids) => api.put(`/api/v1/models/${ids.b}`).set('If-Match', `"${ids.b}-r${ids.revision}"`).send({}) },
  { operationId: 'createModel', need: 'models:write', pointer: '/name', send: (api) => api.post('/api/v1/models').send({ name: 7, plant: PLANT }) },
  { operationId: 'computeLocus', need: 'compute', pointer: '/plant', send: (api) => api.post('/api/v1/locus').send({}) },
  { operationId: 'listUsers', need: 'admin', pointer: '/query/page', send: (api) => api.get('/api/v1/users?page=0') },
  { operationId: 'listUsers', need: 'admin', pointer: '/query/sort', send: (api) => api.get('/api/v1/users?sort=password') },
  { operationId: 'listModelTags', need: 'models:read', pointer: '/query/tag', send: (api) => api.get('/api/v1/models/tags?tag=web') },
  { operationId: 'updateMe', need: 'session', pointer: '/newPassword', send: (api) => api.patch('/api/v1/me').send({ currentPassword: 'whatever-it-is', newPassword: 'short' }) },
  { operationId: 'inviteUser', need: 'admin', pointer: '/role', send: (api) => api.post('/api/v1/users').send({ email: 'matrix.invalid@quillfield.example' }) },
  { operationId: 'updateUser', need: 'admin', pointer: '/role', send: (api, ids) => api.patch(`/api/v1/users/${ids.user}`).send({ role: 'overseer' }) },
  { operationId: 'createApiKey', need: 'admin', pointer: '/scopes', send: (api) => api.post('/api/v1/api-keys').send({ name: 'matrix' }) },
  { operationId: 'createEmbedToken', need: 'models:read', pointer: '/ttlSeconds', send: (api, ids) => api.post('/api/v1/embed-tokens').send({ modelIds: [ids.b], origins: [PAGE] }) },
];

describe('authorization matrix', () => {
  let server: TestServer;
  let ids: { a: string; b: string; revision: number; user: string; key: string };
  const tokens: Record<string, string> = {};

  const fingerprint = async (): Promise<string> => {
    const db = server.context.dataSource;
    const tables = ['users', 'invitations', 'sessions', 'embed_tokens', 'models', 'model_revisions'];
    const parts: unknown[] = [];
    for (const t of tables) parts.push(await db.query(`SELECT * FROM "${t}" ORDER BY rowid`));
    // last_used_at of a valid key with the wrong scope may move (the key was used); nothing else may
    parts.push(await db.query('SELECT id, name, scopes, revoked_at, expires_at FROM api_keys ORDER BY rowid'));
    return JSON.stringify(parts);
  };

  const issueKey = async (scopes: Permission[]): Promise<{ id: string; secret: string }> => {
    const res = await request(server.baseUrl).post('/api/v1/api-keys').auth(server.tokens.admin, { type: 'bearer' }).send({ name: `matrix ${scopes.join(' ')}`, scopes });
    expect(res.status).toBe(201);
    return { id: res.body.id, secret: res.body.secret };
  };

  beforeAll(async () => {
    server = await startTestServer();
    const api = request(server.baseUrl);
    const models = (await server.context.dataSource.query('SELECT id, revision FROM models WHERE deleted_at IS NULL ORDER BY name')) as { id: string; revision: number }[];
    const target = (await server.context.dataSource.query("SELECT id FROM users WHERE role = 'viewer'")) as { id: string }[];
    const spareKey = await issueKey(['compute']);
    ids = { a: models[0]?.id as string, b: models[1]?.id as string, revision: models[1]?.revision as number, user: target[0]?.id as string, key: spareKey.id };

    // an admin session that has expired
    const expired = await openSession(server.context, (await server.context.dataSource.query("SELECT id FROM users WHERE role = 'admin'"))[0].id);
    await server.context.dataSource.query('UPDATE sessions SET expires_at = ? WHERE id = ?', ['2001-01-01T00:00:00.000Z', expired.sessionId]);
    tokens['expired session'] = expired.token;
    // an admin session that was signed out
    const revoked = await openSession(server.context, (await server.context.dataSource.query("SELECT id FROM users WHERE role = 'admin'"))[0].id);
    expect((await api.delete('/api/v1/sessions/current').auth(revoked.token, { type: 'bearer' })).status).toBe(204);
    tokens['revoked session'] = revoked.token;
    // a key with every scope, revoked
    const revokedKey = await issueKey([...API_KEY_SCOPES]);
    expect((await api.delete(`/api/v1/api-keys/${revokedKey.id}`).auth(server.tokens.admin, { type: 'bearer' })).status).toBe(204);
    tokens['revoked key'] = revokedKey.secret;
    // a second admin, deactivated, with a session opened before
    const iso = new Date().toISOString();
    const formerId = randomUUID();
    await insertUser(server.context, { id: formerId, email: 'former.admin@quillfield.example', name: 'Former Admin', role: 'admin', status: 'active', passwordHash: await hashPassword('former-admin-password'), createdAt: iso, updatedAt: iso });
    tokens['deactivated user'] = (await openSession(server.context, formerId)).token;
    expect((await api.patch(`/api/v1/users/${formerId}`).auth(server.tokens.admin, { type: 'bearer' }).send({ status: 'deactivated' })).status).toBe(200);
    // an embed token bound to model a and the intranet page
    const embed = await api.post('/api/v1/embed-tokens').auth(server.tokens.viewer, { type: 'bearer' }).send({ modelIds: [ids.a], origins: [PAGE], ttlSeconds: 3600 });
    expect(embed.status).toBe(201);
    tokens['embed'] = embed.body.token;
  });
  afterAll(() => server.close());

  it('covers every protected operation of the document', async () => {
    const doc = await loadApiDocument(server.config.openapiPath);
    const protectedOps: string[] = [];
    for (const item of Object.values(doc.paths ?? {})) {
      for (const method of METHODS) {
        const op = (item as Record<string, { operationId?: string; security?: unknown[] } | undefined>)[method];
        if (op && !(Array.isArray(op.security) && op.security.length === 0)) protectedOps.push(op.operationId ?? `${method} ?`);
      }
    }
    expect(ROWS.map((r) => r.operationId).sort()).toEqual(protectedOps.sort());
  });

  const cases: { credential: string; expected: number; applies: (row: Row) => boolean; auth: (row: Row) => Promise<{ token?: string; header?: string; origin?: string }> }[] = [
    { credential: 'no token', expected: 401, applies: () => true, auth: async () => ({}) },
    { credential: 'malformed token', expected: 401, applies: () => true, auth: async () => ({ header: 'Bearer pws_short' }) },
    { credential: 'not a bearer header', expected: 401, applies: () => true, auth: async () => ({ header: 'Basic YWRhOnF1aWxsZmllbGQ=' }) },
    { credential: 'unknown token', expected: 401, applies: () => true, auth: async () => ({ token: 'pwk_' + 'A'.repeat(43) }) },
    { credential: 'expired session', expected: 401, applies: () => true, auth: async () => ({ token: tokens['expired session'] }) },
    { credential: 'revoked session', expected: 401, applies: () => true, auth: async () => ({ token: tokens['revoked session'] }) },
    { credential: 'revoked key', expected: 401, applies: () => true, auth: async () => ({ token: tokens['revoked key'] }) },
    { credential: 'deactivated user', expected: 401, applies: () => true, auth: async () => ({ token: tokens['deactivated user'] }) },
    {
      credential: 'key with the wrong scope',
      expected: 403,
      applies: () => true,
      auth: async (row) => {
        const scopes = API_KEY_SCOPES.filter((s) => s !== row.need);
        return { token: (await issueKey(scopes)).secret };
      },
    },
    ...ROLES.map((role) => ({
      credential: `${role} role`,
      expected: 403,
      applies: (row: Row) => row.need !== 'session' && !ROLE_PERMISSIONS[role].includes(row.need),
      auth: async () => ({ token: role === 'admin' ? server.tokens.admin : role === 'engineer' ? server.tokens.engineer : server.tokens.viewer }),
    })),
    { credential: 'embed token from its own origin', expected: 403, applies: () => true, auth: async () => ({ token: tokens['embed'], origin: PAGE }) },
    { credential: 'embed token from a foreign origin', expected: 403, applies: () => true, auth: async () => ({ token: tokens['embed'], origin: FOREIGN }) },
  ];

  for (const c of cases.filter((k) => ROWS.some(k.applies))) {
    describe(c.credential, () => {
      for (const row of ROWS.filter(c.applies)) {
        it(`${row.operationId} → ${c.expected}, nothing changed`, async () => {
          const auth = await c.auth(row);
          const before = await fingerprint();
          let test = row.send(request.agent(server.baseUrl), ids);
          if (auth.token) test = test.set('Authorization', `Bearer ${auth.token}`);
          if (auth.header) test = test.set('Authorization', auth.header);
          if (auth.origin) test = test.set('Origin', auth.origin);
          const res = await test;
          expect(res.status, `${row.operationId} with ${c.credential}: ${res.text}`).toBe(c.expected);
          expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
          // CORS answers the token's own origin; refusals of the element's two reads (model, locus) are
          // readable from any origin (http/embed-cors.ts: embedRefusalCors), nothing else is
          const elementRead = row.operationId === 'getModel' || row.operationId === 'getModelLocus';
          expect(res.headers['access-control-allow-origin']).toBe(auth.origin === PAGE || (auth.origin && elementRead) ? auth.origin : undefined);
          expect(await fingerprint()).toBe(before);
        });
      }
    });
  }

  it('the document declares the permission each row expects', async () => {
    const doc = await loadApiDocument(server.config.openapiPath);
    const declared: Record<string, unknown> = {};
    for (const item of Object.values(doc.paths ?? {})) {
      for (const method of METHODS) {
        const op = (item as Record<string, Record<string, unknown> | undefined>)[method];
        if (op) declared[String(op['operationId'])] = op['x-polewright-permission'];
      }
    }
    for (const row of [...ROWS, ...INVALID]) expect(declared[row.operationId], row.operationId).toBe(row.need);
  });

  describe('invalid requests are authorised before they are validated', () => {
    const send = async (row: InvalidRow, token: string | undefined, origin?: string) => {
      let test = row.send(request.agent(server.baseUrl), ids);
      if (token) test = test.set('Authorization', `Bearer ${token}`);
      if (origin) test = test.set('Origin', origin);
      return test;
    };
    for (const row of INVALID) {
      it(`${row.operationId}: no token → 401, not 400; nothing changed`, async () => {
        const before = await fingerprint();
        const res = await send(row, undefined);
        expect(res.status, res.text).toBe(401);
        expect(res.body.errors).toBeUndefined();
        expect(await fingerprint()).toBe(before);
      });
      const refused = ROLES.filter((role) => !roleMay(role, row.need));
      for (const role of refused) {
        it(`${row.operationId}: the ${role} role → 403, not 400; nothing changed`, async () => {
          const before = await fingerprint();
          const res = await send(row, server.tokens[role]);
          expect(res.status, res.text).toBe(403);
          expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
          expect(res.body.errors).toBeUndefined();
          expect(await fingerprint()).toBe(before);
        });
      }
      it(`${row.operationId}: a key without ${row.need === 'session' ? 'a session' : row.need} → 403, not 400; nothing changed`, async () => {
        const key = await issueKey(API_KEY_SCOPES.filter((s) => s !== row.need));
        const before = await fingerprint();
        const res = await send(row, key.secret);
        expect(res.status, res.text).toBe(403);
        expect(res.body.errors).toBeUndefined();
        expect(await fingerprint()).toBe(before);
      });
      it(`${row.operationId}: the embed token from its own origin → 403, not 400; nothing changed`, async () => {
        const before = await fingerprint();
        const res = await send(row, tokens['embed'], PAGE);
        expect(res.status, res.text).toBe(403);
        expect(res.body.errors).toBeUndefined();
        expect(await fingerprint()).toBe(before);
      });
      const allowed = ROLES.find((role) => roleMay(role, row.need)) as (typeof ROLES)[number];
      it(`${row.operationId}: the ${allowed} role → 400 with the pointer ${row.pointer}; nothing changed`, async () => {
        const before = await fingerprint();
        const res = await send(row, server.tokens[allowed]);
        expect(res.status, res.text).toBe(400);
        expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
        expect((res.body.errors as { pointer: string }[]).map((e) => e.pointer)).toContain(row.pointer);
        expect(await fingerprint()).toBe(before);
      });
    }

    it('a body that is not JSON at all: the viewer gets 403 (never read), the engineer 400 at the body', async () => {
      const id = ids.b;
      const put = (token: string) =>
        request(server.baseUrl).put(`/api/v1/models/${id}`).set('If-Match', `"${id}-r${ids.revision}"`).set('Content-Type', 'application/json').auth(token, { type: 'bearer' }).send('{"name": ');
      const before = await fingerprint();
      const viewer = await put(server.tokens.viewer);
      expect(viewer.status, viewer.text).toBe(403);
      const engineer = await put(server.tokens.engineer);
      expect(engineer.status, engineer.text).toBe(400);
      expect(engineer.body.errors).toEqual([{ pointer: '', detail: 'not valid JSON' }]);
      expect(await fingerprint()).toBe(before);
    });
  });

  it('the embed token does read its own model from its own origin (the matrix is not refusing everything)', async () => {
    const res = await request(server.baseUrl).get(`/api/v1/models/${ids.a}`).set('Origin', PAGE).auth(tokens['embed'] as string, { type: 'bearer' });
    expect(res.status).toBe(200);
    const foreign = await request(server.baseUrl).get(`/api/v1/models/${ids.a}`).set('Origin', FOREIGN).auth(tokens['embed'] as string, { type: 'bearer' });
    expect(foreign.status).toBe(403);
  });
});
