import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../seed/demo-people.js';
import { scenarioLoops } from '../models/models.seed.js';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { DEMO_LOOP_KEYS } from './embed-demo.service.js';

const FOREIGN = 'https://elsewhere.example';

interface Session {
  token: string;
  expiresAt: string;
  apiBase: string;
  loops: { id: string; name: string; key: string }[];
}

describe('GET /embed-demo/session (the demo page host backend)', () => {
  let server: TestServer;
  let offsetMs = 0;
  beforeAll(async () => {
    server = await startTestServer({ clock: () => new Date(Date.now() + offsetMs) });
  });
  afterAll(() => server.close());

  const http = () => request(server.baseUrl);
  const embedRows = async () =>
    (await server.context.dataSource.query('SELECT origins, model_ids, created_by, expires_at FROM embed_tokens ORDER BY created_at')) as { origins: string; model_ids: string; created_by: string; expires_at: string }[];
  const session = async (): Promise<Session> => {
    const res = await http().get('/embed-demo/session').expect(200);
    expect(res.headers['cache-control']).toBe('no-store');
    return res.body as Session;
  };

  it('mints an embed token for the two line 3 loops that loads both models from a page of this server', async () => {
    const body = await session();
    const names = DEMO_LOOP_KEYS.map((key) => scenarioLoops().find((l) => l.key === key)?.name);
    expect(body.loops.map((l) => [l.key, l.name])).toEqual(DEMO_LOOP_KEYS.map((key, i) => [key, names[i]]));
    expect(body.apiBase).toBe('/api');
    expect(body.token).toMatch(/^pwe_/);
    expect(Date.parse(body.expiresAt) - Date.now()).toBeGreaterThan(3590_000);
    // what a browser sends from the demo page: no Origin (same-origin GET), Sec-Fetch-Site: same-origin
    for (const loop of body.loops) {
      const model = await http().get(`/api/v1/models/${loop.id}`).set('Sec-Fetch-Site', 'same-origin').auth(body.token, { type: 'bearer' });
      expect(model.status).toBe(200);
      expect(model.body).toMatchObject({ id: loop.id, name: loop.name, deletedAt: null });
      const locus = await http().get(`/api/v1/models/${loop.id}/locus`).set('Sec-Fetch-Site', 'same-origin').auth(body.token, { type: 'bearer' });
      expect(locus.status).toBe(200);
      expect(locus.body.stableGainRanges.length).toBeGreaterThan(0);
    }
    // bound to the page's own origin and PUBLIC_URL's, issued by the demo engineer, for one hour
    const [row] = await embedRows();
    const engineer = (await server.context.dataSource.query('SELECT id FROM users WHERE email = ?', [DEMO_PEOPLE.find((p) => p.role === 'engineer')?.email]))[0] as { id: string };
    expect(JSON.parse(row?.origins ?? '[]')).toEqual([server.baseUrl, new URL(server.config.publicUrl).origin]);
    expect(JSON.parse(row?.model_ids ?? '[]')).toEqual(body.loops.map((l) => l.id));
    expect(row?.created_by).toBe(engineer.id);
    expect(row?.expires_at).toBe(body.expiresAt);
  });

  it('gives a token that reads nothing else and works from no other page', async () => {
    const body = await session();
    const as = (test: request.Test) => test.auth(body.token, { type: 'bearer' });
    const other = (await server.context.dataSource.query('SELECT id FROM models WHERE id NOT IN (?, ?) LIMIT 1', body.loops.map((l) => l.id)))[0] as { id: string };
    expect((await as(http().get(`/api/v1/models/${other.id}`).set('Sec-Fetch-Site', 'same-origin'))).status).toBe(403);
    expect((await as(http().get(`/api/v1/models/${body.loops[0]?.id}`).set('Origin', FOREIGN))).status).toBe(403);
    expect((await as(http().get(`/api/v1/models/${body.loops[0]?.id}`))).status).toBe(403);
    expect((await as(http().get(`/api/v1/models/${body.loops[0]?.id}`).set('Sec-Fetch-Site', 'cross-site'))).status).toBe(403);
  });

  it('hands the same token out again while it has half an hour left, then mints a new one', async () => {
    const before = (await embedRows()).length;
    const first = await session();
    const again = await session();
    expect(again.token).toBe(first.token);
    expect((await embedRows()).length).toBe(before);
    offsetMs = 31 * 60_000;
    try {
      const later = await session();
      expect(later.token).not.toBe(first.token);
      expect((await embedRows()).length).toBe(before + 1);
      expect(Date.parse(later.expiresAt)).toBeGreaterThan(Date.parse(first.expiresAt));
    } finally {
      offsetMs = 0;
    }
  });

  it('answers a problem+json 404 naming the missing loop while a demo model is deleted, and works again once restored', async () => {
    const { loops } = await session();
    const full = loops[1] as Session['loops'][number];
    const api = (method: 'delete' | 'post', path: string) => http()[method](`/api/v1${path}`).auth(server.tokens.engineer, { type: 'bearer' });
    await api('delete', `/models/${full.id}`).expect(204);
    try {
      const res = await http().get('/embed-demo/session');
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body).toMatchObject({ status: 404, instance: '/embed-demo/session' });
      expect(res.body.detail).toContain(`"${full.name}"`);
      expect(res.body.detail).toContain('POLEWRIGHT_DEMO');
      expect(res.body.token).toBeUndefined();
    } finally {
      await api('post', `/models/${full.id}/restore`).expect(200);
    }
    expect((await session()).loops[1]?.id).toBe(full.id);
  });

  it('serves the demo page beside it, with no inline script', async () => {
    const res = await http().get('/embed-demo/').expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.text).toContain('/elements/polewright-elements.js');
    expect(/script-src ([^;]*)/.exec(String(res.headers['content-security-policy']))?.[1]).toBe("'self'");
  });
});

describe('GET /embed-demo/session with the demo turned off', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ env: { POLEWRIGHT_DEMO: 'off' } });
  });
  afterAll(() => server.close());

  it('answers a problem+json 404 that says the demo is needed, and mints nothing', async () => {
    const res = await request(server.baseUrl).get('/embed-demo/session');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body.detail).toMatch(/POLEWRIGHT_DEMO=off/);
    expect(res.body.detail).toMatch(/needs the seeded demo/);
    const [{ n }] = (await server.context.dataSource.query('SELECT COUNT(*) AS n FROM embed_tokens')) as { n: number }[];
    expect(n).toBe(0);
  });
});
