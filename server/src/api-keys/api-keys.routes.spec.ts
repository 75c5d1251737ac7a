import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { sendKeyExpiryNotices } from './key-expiry-notices.js';

const PLANT = { plant: { expression: '3*(s+2)/(s*(s+1)*(s+5))' } };

describe('API keys', () => {
  let server: TestServer;
  let offsetMs = 0;
  beforeAll(async () => {
    server = await startTestServer({ clock: () => new Date(Date.now() + offsetMs) });
  });
  afterAll(() => server.close());

  const api = () => request(server.baseUrl);
  const asAdmin = <T extends request.Test>(test: T) => test.auth(server.tokens.admin, { type: 'bearer' });
  const issue = (body: object) => asAdmin(api().post('/api/v1/api-keys')).send(body);

  it('issues a key whose secret is shown once and stored only as a hash', async () => {
    const res = await issue({ name: 'nightly tuning check', scopes: ['compute', 'models:read'] });
    expect(res.status).toBe(201);
    expect(res.body.secret).toMatch(/^pwk_[A-Za-z0-9_-]{43}$/);
    expect(res.body.prefix).toBe(res.body.secret.slice(0, 12));
    const rows = (await server.context.dataSource.query('SELECT * FROM api_keys WHERE id = ?', [res.body.id])) as Record<string, unknown>[];
    expect(JSON.stringify(rows)).not.toContain(res.body.secret);
    const list = await asAdmin(api().get('/api/v1/api-keys'));
    const listed = list.body.items.find((k: { id: string }) => k.id === res.body.id);
    expect(listed).toMatchObject({ name: 'nightly tuning check', scopes: ['compute', 'models:read'], revokedAt: null });
    expect(listed.secret).toBeUndefined();
    expect(JSON.stringify(list.body)).not.toContain(res.body.secret);
  });

  it('authenticates a script with the key, records its last use and audits it', async () => {
    const { body: key } = await issue({ name: 'bench rig', scopes: ['compute'] });
    const res = await api().post('/api/v1/locus').auth(key.secret, { type: 'bearer' }).send(PLANT);
    expect(res.status).toBe(200);
    const listed = (await asAdmin(api().get('/api/v1/api-keys'))).body.items.find((k: { id: string }) => k.id === key.id);
    expect(listed.lastUsedAt).not.toBeNull();
    const audit = await asAdmin(api().get(`/api/v1/audit?action=api-key.used`));
    expect(audit.body.items.some((e: { targetId: string }) => e.targetId === key.id)).toBe(true);
  });

  it('limits a key to its scopes: a compute-only key cannot read models (403)', async () => {
    const { body: key } = await issue({ name: 'compute only', scopes: ['compute'] });
    const res = await api().get('/api/v1/models').auth(key.secret, { type: 'bearer' });
    expect(res.status).toBe(403);
    expect(res.body.detail).toMatch(/models:read/);
  });

  it('revokes a key at once', async () => {
    const { body: key } = await issue({ name: 'to revoke', scopes: ['compute'] });
    expect((await asAdmin(api().delete(`/api/v1/api-keys/${key.id}`))).status).toBe(204);
    const res = await api().post('/api/v1/locus').auth(key.secret, { type: 'bearer' }).send(PLANT);
    expect(res.status).toBe(401);
    expect(res.body.detail).toMatch(/revoked/);
    const audit = await asAdmin(api().get('/api/v1/audit?action=api-key.revoked'));
    expect(audit.body.items[0].targetId).toBe(key.id);
  });

  it('stops a key when the admin who issued it is deactivated', async () => {
    const { body: invited } = await asAdmin(api().post('/api/v1/users')).send({ email: 'second.admin@quillfield.example', role: 'admin' });
    const text = server.context.mailer.captured?.find((m) => m.to.includes('second.admin@quillfield.example'))?.text ?? '';
    const invitation = (/(pwi_[A-Za-z0-9_-]+)/.exec(text) as RegExpExecArray)[1];
    const session = (await api().post(`/api/v1/invitations/${invitation}/accept`).send({ name: 'Second Admin', password: 'second-admin-password' })).body.token;
    const key = (await api().post('/api/v1/api-keys').auth(session, { type: 'bearer' }).send({ name: 'theirs', scopes: ['compute'] })).body;
    expect((await api().post('/api/v1/locus').auth(key.secret, { type: 'bearer' }).send(PLANT)).status).toBe(200);
    expect((await asAdmin(api().patch(`/api/v1/users/${invited.user.id}`)).send({ status: 'deactivated' })).status).toBe(200);
    const res = await api().post('/api/v1/locus').auth(key.secret, { type: 'bearer' }).send(PLANT);
    expect(res.status).toBe(401);
    expect(res.body.detail).toMatch(/no longer active/);
  });

  it('answers revoking an unknown key with 404', async () => {
    expect((await asAdmin(api().delete('/api/v1/api-keys/no-such-key'))).status).toBe(404);
  });

  it('refuses a key after its expiry', async () => {
    const expiresAt = new Date(Date.now() + 3600_000).toISOString();
    const { body: key } = await issue({ name: 'short lived', scopes: ['compute'], expiresAt });
    expect((await api().post('/api/v1/locus').auth(key.secret, { type: 'bearer' }).send(PLANT)).status).toBe(200);
    offsetMs = 2 * 3600_000;
    try {
      const res = await api().post('/api/v1/locus').auth(key.secret, { type: 'bearer' }).send(PLANT);
      expect(res.status).toBe(401);
      expect(res.body.detail).toMatch(/expired/);
    } finally {
      offsetMs = 0;
    }
  });

  it('rejects bad input with the field at fault: an admin scope, a past expiry, no name', async () => {
    const admin = await issue({ name: 'x', scopes: ['admin'] });
    expect(admin.status).toBe(400);
    expect(admin.body.errors[0].pointer).toBe('/scopes/0');
    const past = await issue({ name: 'x', scopes: ['compute'], expiresAt: '2001-01-01T00:00:00Z' });
    expect(past.status).toBe(400);
    expect(past.body.errors).toEqual([{ pointer: '/expiresAt', detail: 'must be in the future' }]);
    const noName = await issue({ scopes: ['compute'] });
    expect(noName.body.errors.map((e: { pointer: string }) => e.pointer)).toContain('/name');
  });

  it('is for admins only', async () => {
    const res = await api().post('/api/v1/api-keys').auth(server.tokens.engineer, { type: 'bearer' }).send({ name: 'x', scopes: ['compute'] });
    expect(res.status).toBe(403);
  });
});

describe('key-expiry notices', () => {
  let server: TestServer;
  let offsetMs = 0;
  beforeAll(async () => {
    server = await startTestServer({ clock: () => new Date(Date.now() + offsetMs) });
  });
  afterAll(() => server.close());

  const issue = (body: object) => request(server.baseUrl).post('/api/v1/api-keys').auth(server.tokens.admin, { type: 'bearer' }).send(body);

  it('mails the issuing admin once when a key is about to expire', async () => {
    const soon = new Date(Date.now() + 3 * 86_400_000).toISOString();
    const later = new Date(Date.now() + 30 * 86_400_000).toISOString();
    const { body: key } = await issue({ name: 'line 3 logger', scopes: ['models:read'], expiresAt: soon });
    await issue({ name: 'far future', scopes: ['models:read'], expiresAt: later });
    const before = server.context.mailer.captured?.length ?? 0;
    expect(await sendKeyExpiryNotices(server.context)).toBe(1);
    const mail = server.context.mailer.captured?.at(-1);
    expect(server.context.mailer.captured?.length).toBe(before + 1);
    expect(mail?.to).toEqual(['ada.admin@quillfield.example']);
    expect(mail?.subject).toContain('line 3 logger');
    expect(mail?.text).toContain(key.prefix);
    expect(await sendKeyExpiryNotices(server.context)).toBe(0);
    // the far one gets its notice once the clock is within the notice window
    offsetMs = 25 * 86_400_000;
    try {
      expect(await sendKeyExpiryNotices(server.context)).toBe(1);
    } finally {
      offsetMs = 0;
    }
  });
});
