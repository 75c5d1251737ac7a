import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

const PAGE = 'https://intranet.quillfield.example';
const FOREIGN = 'https://elsewhere.example';

describe('embed tokens', () => {
  let server: TestServer;
  let modelA: string;
  let modelB: string;
  let offsetMs = 0;
  beforeAll(async () => {
    server = await startTestServer({ clock: () => new Date(Date.now() + offsetMs) });
    const rows = (await server.context.dataSource.query('SELECT id FROM models WHERE deleted_at IS NULL ORDER BY name')) as { id: string }[];
    [modelA, modelB] = [rows[0]?.id as string, rows[1]?.id as string];
  });
  afterAll(() => server.close());

  const api = () => request(server.baseUrl);
  const issue = (body: object, token = server.tokens.viewer) => api().post('/api/v1/embed-tokens').auth(token, { type: 'bearer' }).send(body);

  it('issues a read-only token bound to models and origins', async () => {
    const res = await issue({ modelIds: [modelA], origins: [PAGE], ttlSeconds: 600 });
    expect(res.status).toBe(201);
    expect(res.body.token).toMatch(/^pwe_/);
    expect(res.body).toMatchObject({ modelIds: [modelA], origins: [PAGE] });
    expect(Date.parse(res.body.expiresAt) - Date.now()).toBeGreaterThan(590_000);
  });

  it('reads its model from its origin, with CORS answering that origin only', async () => {
    const { body } = await issue({ modelIds: [modelA], origins: [PAGE], ttlSeconds: 600 });
    const res = await api().get(`/api/v1/models/${modelA}`).set('Origin', PAGE).auth(body.token, { type: 'bearer' });
    expect(res.status).toBe(200);
    expect(res.body.id).toBe(modelA);
    expect(res.headers['access-control-allow-origin']).toBe(PAGE);
    const locus = await api().get(`/api/v1/models/${modelA}/locus`).set('Origin', PAGE).auth(body.token, { type: 'bearer' });
    expect(locus.status).toBe(200);
  });

  it('refuses other models, the list, a foreign origin, no origin, and any write', async () => {
    const { body } = await issue({ modelIds: [modelA], origins: [PAGE], ttlSeconds: 600 });
    const as = (test: request.Test) => test.auth(body.token, { type: 'bearer' });
    expect((await as(api().get(`/api/v1/models/${modelB}`).set('Origin', PAGE))).status).toBe(403);
    expect((await as(api().get('/api/v1/models').set('Origin', PAGE))).status).toBe(403);
    const foreign = await as(api().get(`/api/v1/models/${modelA}`).set('Origin', FOREIGN));
    expect(foreign.status).toBe(403);
    // the refusal is readable there (embedRefusalCors), the model is not
    expect(foreign.headers['access-control-allow-origin']).toBe(FOREIGN);
    expect(foreign.body.id).toBeUndefined();
    expect((await as(api().get(`/api/v1/models/${modelA}`))).status).toBe(403);
    const before = (await api().get(`/api/v1/models/${modelA}`).auth(server.tokens.engineer, { type: 'bearer' })).body;
    const put = await as(api().put(`/api/v1/models/${modelA}`).set('Origin', PAGE).set('If-Match', `"${modelA}-r${before.revision}"`)).send({ ...before, name: 'changed by a widget' });
    expect(put.status).toBe(403);
    expect((await as(api().delete(`/api/v1/models/${modelA}`).set('Origin', PAGE))).status).toBe(403);
    const after = (await api().get(`/api/v1/models/${modelA}`).auth(server.tokens.engineer, { type: 'bearer' })).body;
    expect(after).toEqual(before);
  });

  it('expires after its lifetime', async () => {
    const { body } = await issue({ modelIds: [modelA], origins: [PAGE], ttlSeconds: 60 });
    offsetMs = 61_000;
    try {
      const res = await api().get(`/api/v1/models/${modelA}`).set('Origin', PAGE).auth(body.token, { type: 'bearer' });
      expect(res.status).toBe(401);
    } finally {
      offsetMs = 0;
    }
  });

  it('lets the element read the problem of a refused model or locus read from any origin, and nothing else', async () => {
    const { body } = await issue({ modelIds: [modelA], origins: [PAGE], ttlSeconds: 60 });
    offsetMs = 61_000;
    try {
      for (const path of [`/api/v1/models/${modelA}`, `/api/v1/models/${modelA}/locus`]) {
        const expired = await api().get(path).set('Origin', PAGE).auth(body.token, { type: 'bearer' });
        expect(expired.status).toBe(401);
        expect(expired.headers['content-type']).toMatch(/^application\/problem\+json/);
        expect(expired.body.detail).toMatch(/expired/);
        expect(expired.headers['access-control-allow-origin']).toBe(PAGE);
        expect(expired.headers['vary']).toMatch(/Origin/);
      }
    } finally {
      offsetMs = 0;
    }
    const unknown = await api().get(`/api/v1/models/${modelA}/locus`).set('Origin', FOREIGN).auth('pwe_' + 'A'.repeat(43), { type: 'bearer' });
    expect(unknown.status).toBe(401);
    expect(unknown.headers['access-control-allow-origin']).toBe(FOREIGN);
    const missing = await api().get('/api/v1/models/00000000-0000-4000-8000-000000000000').set('Origin', FOREIGN).auth(server.tokens.viewer, { type: 'bearer' });
    expect(missing.status).toBe(404);
    expect(missing.headers['access-control-allow-origin']).toBe(FOREIGN);
    // other routes and other methods stay closed to foreign pages, refused or not
    const revisions = await api().get(`/api/v1/models/${modelA}/revisions`).set('Origin', FOREIGN).auth(body.token, { type: 'bearer' });
    expect(revisions.status).toBe(403);
    expect(revisions.headers['access-control-allow-origin']).toBeUndefined();
    const del = await api().delete(`/api/v1/models/${modelA}`).set('Origin', FOREIGN);
    expect(del.status).toBe(401);
    expect(del.headers['access-control-allow-origin']).toBeUndefined();
  });

  it('answers the tokenless CORS preflight of a GET on a model route for any origin, and nothing else', async () => {
    const pre = await api().options(`/api/v1/models/${modelA}`).set('Origin', FOREIGN).set('Access-Control-Request-Method', 'GET').set('Access-Control-Request-Headers', 'authorization');
    expect(pre.status).toBe(204);
    expect(pre.headers['access-control-allow-origin']).toBe(FOREIGN);
    expect(pre.headers['access-control-allow-headers']).toMatch(/Authorization/);
    const write = await api().options(`/api/v1/models/${modelA}`).set('Origin', FOREIGN).set('Access-Control-Request-Method', 'PUT');
    expect(write.headers['access-control-allow-origin']).toBeUndefined();
    const users = await api().options('/api/v1/users').set('Origin', FOREIGN).set('Access-Control-Request-Method', 'GET');
    expect(users.headers['access-control-allow-origin']).toBeUndefined();
  });

  it('gives no CORS headers to session requests from another origin', async () => {
    const res = await api().get(`/api/v1/models/${modelA}`).set('Origin', FOREIGN).auth(server.tokens.viewer, { type: 'bearer' });
    expect(res.status).toBe(200);
    expect(res.headers['access-control-allow-origin']).toBeUndefined();
  });

  it('rejects a page URL instead of an origin, a too-short lifetime, and unknown models', async () => {
    const path = await issue({ modelIds: [modelA], origins: [PAGE, 'https://intranet.quillfield.example/plots/'], ttlSeconds: 600 });
    expect(path.status).toBe(400);
    expect(path.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/origins/1']);
    const ttl = await issue({ modelIds: [modelA], origins: [PAGE], ttlSeconds: 30 });
    expect(ttl.status).toBe(400);
    expect(ttl.body.errors[0].pointer).toBe('/ttlSeconds');
    const unknown = await issue({ modelIds: [modelA, 'no-such-model'], origins: [PAGE], ttlSeconds: 600 });
    expect(unknown.status).toBe(404);
    expect(unknown.body.detail).toContain('no-such-model');
    const count = (await server.context.dataSource.query('SELECT COUNT(*) AS n FROM embed_tokens')) as { n: number }[];
    const issuedSoFar = 5;
    expect(count[0]?.n).toBe(issuedSoFar);
  });

  it('cannot be used to issue another embed token', async () => {
    const { body } = await issue({ modelIds: [modelA], origins: [PAGE], ttlSeconds: 600 });
    const res = await issue({ modelIds: [modelA], origins: [PAGE], ttlSeconds: 600 }, body.token);
    expect([401, 403]).toContain(res.status);
  });
});
