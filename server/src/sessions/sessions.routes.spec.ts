import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../auth/password.js';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { insertUser } from '../users/users.repository.js';

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

  describe('PATCH /me', () => {
    /** A fresh active engineer (so that password changes leave the demo people alone), signed in twice. */
    async function person(password: string): Promise<{ id: string; email: string; token: string; other: string }> {
      const id = randomUUID();
      const email = `self.${id.slice(0, 8)}@quillfield.example`;
      const iso = new Date().toISOString();
      await insertUser(server.context, { id, email, name: 'Selma Self', role: 'engineer', status: 'active', passwordHash: await hashPassword(password), createdAt: iso, updatedAt: iso });
      const first = await signIn(email, password);
      const second = await signIn(email, password);
      expect([first.status, second.status]).toEqual([201, 201]);
      return { id, email, token: first.body.token, other: second.body.token };
    }
    const patchMe = (token: string, body: unknown) => request(server.baseUrl).patch('/api/v1/me').auth(token, { type: 'bearer' }).send(body as object);
    const me = (token: string) => request(server.baseUrl).get('/api/v1/me').auth(token, { type: 'bearer' });
    const auditOf = async (userId: string) =>
      (await server.context.dataSource.query('SELECT action, detail FROM audit_events WHERE target_id = ? AND action LIKE ? ORDER BY id', [userId, 'user.update-self%'])) as { action: string; detail: string }[];
    const storedUser = async (id: string) => ((await server.context.dataSource.query('SELECT name, password_hash FROM users WHERE id = ?', [id])) as { name: string; password_hash: string }[])[0];

    it('changes the name and answers the Me body; other sessions stay open', async () => {
      const p = await person('selma-first-password');
      const res = await patchMe(p.token, { name: '  Selma Varga  ' });
      expect(res.status, res.text).toBe(200);
      expect(res.body.user).toMatchObject({ id: p.id, email: p.email, name: 'Selma Varga', role: 'engineer', status: 'active' });
      expect(res.body.permissions).toEqual(['models:read', 'models:write', 'compute']);
      expect(res.body.session.id).toBe((await me(p.token)).body.session.id);
      expect((await storedUser(p.id))?.name).toBe('Selma Varga');
      expect((await me(p.other)).status).toBe(200);
      const audit = await auditOf(p.id);
      expect(audit.map((a) => a.action)).toEqual(['user.update-self']);
      expect(JSON.parse(audit[0]?.detail ?? 'null')).toEqual({ fields: ['name'], otherSessionsRevoked: false });
    });

    it('changes the password with the current one: other sessions end at once, this one stays, only the new password signs in', async () => {
      const p = await person('selma-first-password');
      // the other session has been used (its principal is in the token cache) before the change
      expect((await me(p.other)).status).toBe(200);
      const before = (await storedUser(p.id))?.password_hash;
      const res = await patchMe(p.token, { currentPassword: 'selma-first-password', newPassword: 'selma-second-password' });
      expect(res.status, res.text).toBe(200);
      expect(res.body.user.id).toBe(p.id);
      expect((await storedUser(p.id))?.password_hash).not.toBe(before);
      const other = await me(p.other);
      expect(other.status).toBe(401);
      expect(other.body.detail).toMatch(/signed out/);
      expect((await me(p.token)).status).toBe(200);
      expect((await signIn(p.email, 'selma-first-password')).status).toBe(401);
      expect((await signIn(p.email, 'selma-second-password')).status).toBe(201);
      const audit = await auditOf(p.id);
      expect(audit.map((a) => a.action)).toEqual(['user.update-self']);
      expect(JSON.parse(audit[0]?.detail ?? 'null')).toEqual({ fields: ['password'], otherSessionsRevoked: true });
      expect(audit[0]?.detail).not.toMatch(/selma-(first|second)-password/);
    });

    it('refuses a wrong current password with 400 at /currentPassword, changes nothing and audits the attempt', async () => {
      const p = await person('selma-first-password');
      const before = await storedUser(p.id);
      const res = await patchMe(p.token, { name: 'Not Applied', currentPassword: 'a-wrong-guess', newPassword: 'selma-second-password' });
      expect(res.status).toBe(400);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body.errors).toEqual([{ pointer: '/currentPassword', detail: expect.stringMatching(/current password/) }]);
      expect(await storedUser(p.id)).toEqual(before);
      expect((await me(p.other)).status).toBe(200);
      expect((await signIn(p.email, 'selma-first-password')).status).toBe(201);
      expect((await auditOf(p.id)).map((a) => a.action)).toEqual(['user.update-self.refused']);
    });

    it('asks for the current password with a new one, and for a new one with the current one', async () => {
      const p = await person('selma-first-password');
      const before = await storedUser(p.id);
      const missing = await patchMe(p.token, { newPassword: 'selma-second-password' });
      expect(missing.status).toBe(400);
      expect(missing.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/currentPassword']);
      const alone = await patchMe(p.token, { currentPassword: 'selma-first-password' });
      expect(alone.status).toBe(400);
      expect(alone.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/newPassword']);
      expect(await storedUser(p.id)).toEqual(before);
    });

    it('answers invalid bodies with 400 and the fields at fault, before anything is stored', async () => {
      const p = await person('selma-first-password');
      const before = await storedUser(p.id);
      const pointers = async (body: unknown) => {
        const res = await patchMe(p.token, body);
        expect(res.status, res.text).toBe(400);
        expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
        return (res.body.errors as { pointer: string }[]).map((e) => e.pointer);
      };
      expect(await pointers({})).toEqual(['']);
      expect(await pointers({ currentPassword: 'selma-first-password', newPassword: 'short' })).toContain('/newPassword');
      expect(await pointers({ name: 'x'.repeat(121) })).toContain('/name');
      expect(await pointers({ name: '' })).toContain('/name');
      expect(await pointers({ name: '   ' })).toEqual(['/name']);
      expect(await pointers({ name: 'Fine', role: 'admin' })).toContain('/role');
      expect(await storedUser(p.id)).toEqual(before);
      expect(await auditOf(p.id)).toEqual([]);
    });

    it('is for signed-in people only: no token → 401, an API key → 403, and nothing changes', async () => {
      const key = await request(server.baseUrl).post('/api/v1/api-keys').auth(server.tokens.admin, { type: 'bearer' }).send({ name: 'not a person', scopes: ['models:read', 'models:write', 'compute'] });
      expect(key.status).toBe(201);
      const adminBefore = (await server.context.dataSource.query("SELECT name, password_hash FROM users WHERE role = 'admin'")) as unknown[];
      const anonymous = await request(server.baseUrl).patch('/api/v1/me').send({ name: 'Nobody' });
      expect(anonymous.status).toBe(401);
      const byKey = await patchMe(key.body.secret, { name: 'A Key' });
      expect(byKey.status).toBe(403);
      expect(byKey.body.errors).toBeUndefined();
      expect(await server.context.dataSource.query("SELECT name, password_hash FROM users WHERE role = 'admin'")).toEqual(adminBefore);
    });
  });
});
