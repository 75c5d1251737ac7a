import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

describe('sessions', () => {
  let server: TestServer;
  let offsetMs = 0;
  beforeAll(async () => {
    server = await startTestServer({ clock: () => new Date(Date.now() + offsetMs) });
  });
  afterAll(() => server.close());

  const signIn = (email: string, password: string) => request(server.baseUrl).post('/api/v1/sessions').send({ email, password });

  it('signs in with the right password and the token opens GET /me', async () => {
    const res = await signIn('Emil.Engineer@quillfield.example', 'quillfield-engineer-2026');
    expect(res.status).toBe(201);
    expect(res.body.token).toMatch(/^pws_/);
    expect(res.body.user).toMatchObject({ email: 'emil.engineer@quillfield.example', role: 'engineer', status: 'active' });
    expect(res.body.user.passwordHash).toBeUndefined();
    const me = await request(server.baseUrl).get('/api/v1/me').auth(res.body.token, { type: 'bearer' });
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('engineer');
    expect(me.body.permissions).toEqual(['models:read', 'models:write', 'compute']);
    expect(me.body.session.expiresAt).toBe(res.body.expiresAt);
  });

  it('stores only a hash of the session token', async () => {
    const res = await signIn('vera.viewer@quillfield.example', 'quillfield-viewer-2026');
    const rows = (await server.context.dataSource.query('SELECT token_hash FROM sessions')) as { token_hash: string }[];
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.some((r) => r.token_hash === res.body.token)).toBe(false);
    expect(rows.every((r) => /^[0-9a-f]{64}$/.test(r.token_hash))).toBe(true);
  });

  it('refuses a wrong password with 401 problem+json and audits the failed sign-in', async () => {
    const res = await signIn('ada.admin@quillfield.example', 'not-the-password');
    expect(res.status).toBe(401);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body).toMatchObject({ status: 401, title: 'Authentication required' });
    expect(res.body.token).toBeUndefined();
    const audit = await request(server.baseUrl).get('/api/v1/audit?action=session.failed').auth(server.tokens.admin, { type: 'bearer' });
    expect(audit.body.items[0].detail.email).toBe('ada.admin@quillfield.example');
  });

  it('refuses an unknown e-mail the same way', async () => {
    const res = await signIn('nobody@quillfield.example', 'whatever-it-is');
    expect(res.status).toBe(401);
  });

  it('answers a malformed body with 400 and the fields at fault', async () => {
    const res = await request(server.baseUrl).post('/api/v1/sessions').send({ email: 'not-an-email', extra: 1 });
    expect(res.status).toBe(400);
    const pointers = res.body.errors.map((e: { pointer: string }) => e.pointer);
    expect(pointers).toContain('/email');
    expect(pointers).toContain('/password');
    expect(pointers).toContain('/extra');
  });

  it('signs out: DELETE /sessions/current revokes the token at once', async () => {
    const { body } = await signIn('vera.viewer@quillfield.example', 'quillfield-viewer-2026');
    const out = await request(server.baseUrl).delete('/api/v1/sessions/current').auth(body.token, { type: 'bearer' });
    expect(out.status).toBe(204);
    const me = await request(server.baseUrl).get('/api/v1/me').auth(body.token, { type: 'bearer' });
    expect(me.status).toBe(401);
    expect(me.body.detail).toMatch(/signed out/);
  });

  it('expires a session after its lifetime', async () => {
    const { body } = await signIn('vera.viewer@quillfield.example', 'quillfield-viewer-2026');
    offsetMs = (server.config.sessionTtlSeconds + 1) * 1000;
    try {
      const me = await request(server.baseUrl).get('/api/v1/me').auth(body.token, { type: 'bearer' });
      expect(me.status).toBe(401);
      expect(me.body.detail).toMatch(/expired/);
    } finally {
      offsetMs = 0;
    }
  });
});
