import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openSession } from '../sessions/sessions.service.js';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { insertUser } from '../users/users.repository.js';
import { hashPassword } from './password.js';
import type { Principal } from './principal.js';
import { TokenCache, tokenCacheOf } from './token-cache.js';
import { hashToken } from './tokens.js';

const PAGE = 'https://intranet.quillfield.example';
const PLANT = { plant: { expression: '4/(s*(s+2)*(s+8))' } };

function principal(tokenId: string, userId: string): Principal {
  return { kind: 'session', userId, role: 'viewer', scopes: new Set(['models:read']), modelIds: null, origins: null, tokenId };
}

describe('TokenCache', () => {
  it('reuses an entry until its TTL and then forgets it', () => {
    const cache = new TokenCache(1000, 10);
    cache.set('h', { principal: principal('t', 'u'), expiresAt: null }, 0, cache.generation);
    expect(cache.get('h', 999)?.principal.tokenId).toBe('t');
    expect(cache.get('h', 1000)).toBeUndefined();
    expect(cache.size).toBe(0);
  });

  it('keeps at most its cap of entries, dropping the oldest', () => {
    const cache = new TokenCache(1000, 3);
    for (const n of [1, 2, 3, 4]) cache.set(`h${n}`, { principal: principal(`t${n}`, 'u'), expiresAt: null }, 0, cache.generation);
    expect(cache.size).toBe(3);
    expect(cache.get('h1', 0)).toBeUndefined();
    expect(cache.get('h4', 0)?.principal.tokenId).toBe('t4');
  });

  it('does not store a resolution that started before an invalidation', () => {
    const cache = new TokenCache(1000, 10);
    const started = cache.generation;
    cache.forget((p) => p.userId === 'u');
    cache.set('h', { principal: principal('t', 'u'), expiresAt: null }, 0, started);
    expect(cache.get('h', 0)).toBeUndefined();
  });
});

describe('token resolution cache on a server', () => {
  let server: TestServer;
  let offsetMs = 0;
  const clock = () => new Date(Date.now() + offsetMs);
  beforeAll(async () => {
    server = await startTestServer({ clock });
  });
  afterAll(() => server.close());

  const api = () => request(server.baseUrl);
  const isCached = (token: string) => tokenCacheOf(server.context).get(hashToken(token), clock().getTime()) !== undefined;

  it('refuses a cached API key at once after it is revoked', async () => {
    // a read that needs no compute worker: a worker's first start (seconds on a busy machine) could
    // outlast the cache's 5 s lifetime before isCached looks
    const issued = await api().post('/api/v1/api-keys').auth(server.tokens.admin, { type: 'bearer' }).send({ name: 'revoke probe', scopes: ['models:read'] });
    expect(issued.status).toBe(201);
    expect((await api().get('/api/v1/models/tags').auth(issued.body.secret, { type: 'bearer' })).status).toBe(200);
    expect(isCached(issued.body.secret)).toBe(true);
    expect((await api().delete(`/api/v1/api-keys/${issued.body.id}`).auth(server.tokens.admin, { type: 'bearer' })).status).toBe(204);
    const after = await api().get('/api/v1/models/tags').auth(issued.body.secret, { type: 'bearer' });
    expect(after.status).toBe(401);
    expect(after.body.detail).toMatch(/revoked/);
  });

  it('refuses a cached session at once after sign-out', async () => {
    const viewer = (await server.context.dataSource.query("SELECT id FROM users WHERE role = 'viewer'"))[0].id as string;
    const { token } = await openSession(server.context, viewer);
    expect((await api().get('/api/v1/me').auth(token, { type: 'bearer' })).status).toBe(200);
    expect(isCached(token)).toBe(true);
    expect((await api().delete('/api/v1/sessions/current').auth(token, { type: 'bearer' })).status).toBe(204);
    expect((await api().get('/api/v1/me').auth(token, { type: 'bearer' })).status).toBe(401);
  });

  it('applies a role change and a deactivation to cached sessions at once', async () => {
    const iso = new Date().toISOString();
    const id = randomUUID();
    await insertUser(server.context, { id, email: `cache.${id.slice(0, 8)}@quillfield.example`, name: 'Cache Probe', role: 'engineer', status: 'active', passwordHash: await hashPassword('cache-probe-password'), createdAt: iso, updatedAt: iso });
    const { token } = await openSession(server.context, id);
    const create = () => api().post('/api/v1/models').auth(token, { type: 'bearer' }).send({ name: 'Cache probe loop', plant: PLANT.plant });
    expect((await create()).status).toBe(201);
    expect(isCached(token)).toBe(true);
    expect((await api().patch(`/api/v1/users/${id}`).auth(server.tokens.admin, { type: 'bearer' }).send({ role: 'viewer' })).status).toBe(200);
    expect((await create()).status).toBe(403);
    expect((await api().get('/api/v1/me').auth(token, { type: 'bearer' })).status).toBe(200);
    expect((await api().patch(`/api/v1/users/${id}`).auth(server.tokens.admin, { type: 'bearer' }).send({ status: 'deactivated' })).status).toBe(200);
    expect((await api().get('/api/v1/me').auth(token, { type: 'bearer' })).status).toBe(401);
  });

  it('refuses an expired embed token even while its resolution is cached (injected clock)', async () => {
    const model = (await server.context.dataSource.query('SELECT id FROM models WHERE deleted_at IS NULL LIMIT 1'))[0].id as string;
    const issued = await api().post('/api/v1/embed-tokens').auth(server.tokens.viewer, { type: 'bearer' }).send({ modelIds: [model], origins: [PAGE], ttlSeconds: 60 });
    expect(issued.status).toBe(201);
    const expiresMs = Date.parse(issued.body.expiresAt);
    // one second before expiry: allowed, and now cached for longer than the token has left
    offsetMs = expiresMs - 1000 - Date.now();
    expect((await api().get(`/api/v1/models/${model}`).set('Origin', PAGE).auth(issued.body.token, { type: 'bearer' })).status).toBe(200);
    expect(isCached(issued.body.token)).toBe(true);
    offsetMs = expiresMs + 1000 - Date.now();
    expect(isCached(issued.body.token)).toBe(true);
    const late = await api().get(`/api/v1/models/${model}`).set('Origin', PAGE).auth(issued.body.token, { type: 'bearer' });
    expect(late.status).toBe(401);
    expect(late.body.detail).toMatch(/expired/);
    offsetMs = 0;
  });
});
