import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { recordAudit } from './audit.service.js';

describe('audit trail', () => {
  let server: TestServer;
  let t0: string;
  beforeAll(async () => {
    let tick = Date.parse('2026-11-30T08:00:00.000Z');
    server = await startTestServer({ clock: () => new Date((tick += 1000)) });
    t0 = new Date(tick + 1).toISOString(); // after every seeding event
    await recordAudit(server.context, { action: 'probe.updated', actorId: 'engineer-1', targetType: 'model', targetId: 'm-1' });
    await recordAudit(server.context, { action: 'probe-key.created', actorId: 'admin-1', targetType: 'api-key', targetId: 'k-1' });
    await recordAudit(server.context, { action: 'probe-key.revoked', actorId: 'admin-1', targetType: 'api-key', targetId: 'k-1' });
    await recordAudit(server.context, { action: 'probe.updated', actorId: 'engineer-2', targetType: 'model', targetId: 'm-2', detail: { revision: 2 } });
  });
  afterAll(() => server.close());

  const audit = (query: string, token = server.tokens.admin) => request(server.baseUrl).get(`/api/v1/audit${query}`).auth(token, { type: 'bearer' });
  const actions = (body: { items: { action: string }[] }) => body.items.map((e) => e.action);

  it('lists events newest first, with the sign-in sessions of the seeded users recorded too', async () => {
    const res = await audit('');
    expect(res.status).toBe(200);
    expect(res.body.items[0]).toMatchObject({ action: 'probe.updated', actorId: 'engineer-2', detail: { revision: 2 } });
    expect(actions(res.body)).toContain('session.created');
  });

  it('filters by exact action, by action prefix and by actor', async () => {
    expect(actions((await audit('?action=probe.updated')).body)).toEqual(['probe.updated', 'probe.updated']);
    expect(actions((await audit('?action=probe-key.')).body)).toEqual(['probe-key.revoked', 'probe-key.created']);
    expect((await audit('?action=probe-key')).body.total).toBe(0);
    const byActor = (await audit('?actorId=engineer-1')).body;
    expect(byActor.total).toBe(1);
    expect(byActor.items[0].targetId).toBe('m-1');
  });

  it('filters by time: from inclusive, to exclusive', async () => {
    const all = (await audit(`?from=${encodeURIComponent(t0)}`)).body.items as { at: string; action: string }[];
    expect(all.map((e) => e.action)).toEqual(['probe.updated', 'probe-key.revoked', 'probe-key.created', 'probe.updated']);
    const to = all[1]?.at as string;
    const window = (await audit(`?from=${encodeURIComponent(t0)}&to=${encodeURIComponent(to)}`)).body;
    expect(actions(window)).toEqual(['probe-key.created', 'probe.updated']);
  });

  it('pages', async () => {
    const first = (await audit('?pageSize=2&page=1')).body;
    const second = (await audit('?pageSize=2&page=2')).body;
    expect(first.items).toHaveLength(2);
    expect(first.total).toBe(second.total);
    expect(second.items[0].id).toBeLessThan(first.items[1].id);
  });

  it('rejects bad filters with 400 at the query parameter', async () => {
    const res = await audit('?from=yesterday');
    expect(res.status).toBe(400);
    expect(res.body.errors[0].pointer).toBe('/query/from');
    expect((await audit('?colour=blue')).status).toBe(400);
  });

  it('is for admins only', async () => {
    expect((await audit('', server.tokens.engineer)).status).toBe(403);
    expect((await request(server.baseUrl).get('/api/v1/audit')).status).toBe(401);
  });
});
