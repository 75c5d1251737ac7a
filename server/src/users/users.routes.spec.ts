import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

describe('users and invitations', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ env: { PUBLIC_URL: 'http://polewright.quillfield.example:4300' } });
  });
  afterAll(() => server.close());

  const api = () => request(server.baseUrl);
  const asAdmin = <T extends request.Test>(test: T) => test.auth(server.tokens.admin, { type: 'bearer' });
  const userIdOf = async (email: string) => ((await server.context.dataSource.query('SELECT id FROM users WHERE email = ?', [email])) as { id: string }[])[0]?.id as string;

  it('lists the seeded users for an admin, paged', async () => {
    const res = await asAdmin(api().get('/api/v1/users?page=1&pageSize=2'));
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(3);
    expect(res.body.items).toHaveLength(2);
    expect(res.body.items[0].email).toBe('ada.admin@quillfield.example');
  });

  it('refuses the user list to an engineer with 403', async () => {
    const res = await api().get('/api/v1/users').auth(server.tokens.engineer, { type: 'bearer' });
    expect(res.status).toBe(403);
  });

  it('invites by e-mail; the captured message carries a link whose token completes sign-up once', async () => {
    const invited = await asAdmin(api().post('/api/v1/users')).send({ email: 'Nils.Hoist@quillfield.example', role: 'engineer' });
    expect(invited.status).toBe(201);
    expect(invited.body.user).toMatchObject({ email: 'nils.hoist@quillfield.example', role: 'engineer', status: 'invited' });

    const mailbox = await asAdmin(api().get('/api/v1/dev/mailbox'));
    const mail = mailbox.body.items.find((m: { to: string[] }) => m.to.includes('nils.hoist@quillfield.example'));
    expect(mail.subject).toMatch(/invited/);
    const link = /http:\/\/polewright\.quillfield\.example:4300\/invitations\/(pwi_[A-Za-z0-9_-]+)/.exec(mail.text);
    expect(link).not.toBeNull();
    const token = (link as RegExpExecArray)[1];

    // an invited user cannot sign in before accepting
    expect((await api().post('/api/v1/sessions').send({ email: 'nils.hoist@quillfield.example', password: 'hoist-loop-password' })).status).toBe(401);

    const accepted = await api().post(`/api/v1/invitations/${token}/accept`).send({ name: 'Nils Hoist', password: 'hoist-loop-password' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user).toMatchObject({ name: 'Nils Hoist', status: 'active' });
    const me = await api().get('/api/v1/me').auth(accepted.body.token, { type: 'bearer' });
    expect(me.body.user.email).toBe('nils.hoist@quillfield.example');
    const signIn = await api().post('/api/v1/sessions').send({ email: 'nils.hoist@quillfield.example', password: 'hoist-loop-password' });
    expect(signIn.status).toBe(201);

    const again = await api().post(`/api/v1/invitations/${token}/accept`).send({ name: 'Someone Else', password: 'another-password' });
    expect(again.status).toBe(409);
  });

  it('answers an unknown invitation token with 404 and a short password with 400 at /password', async () => {
    expect((await api().post('/api/v1/invitations/pwi_unknown/accept').send({ name: 'X', password: 'long-enough-pw' })).status).toBe(404);
    const short = await api().post('/api/v1/invitations/pwi_unknown/accept').send({ name: 'X', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.errors[0].pointer).toBe('/password');
  });

  it('refuses a second user with the same e-mail (409) and a bad role (400 at /role)', async () => {
    expect((await asAdmin(api().post('/api/v1/users')).send({ email: 'vera.viewer@quillfield.example', role: 'viewer' })).status).toBe(409);
    const bad = await asAdmin(api().post('/api/v1/users')).send({ email: 'new.person@quillfield.example', role: 'owner' });
    expect(bad.status).toBe(400);
    expect(bad.body.errors.map((e: { pointer: string }) => e.pointer)).toContain('/role');
    expect(await userIdOf('new.person@quillfield.example')).toBeUndefined();
  });

  it('changes a role, and the new role applies to the open session at once', async () => {
    const viewerId = await userIdOf('vera.viewer@quillfield.example');
    const res = await asAdmin(api().patch(`/api/v1/users/${viewerId}`)).send({ role: 'engineer' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('engineer');
    const me = await api().get('/api/v1/me').auth(server.tokens.viewer, { type: 'bearer' });
    expect(me.body.permissions).toContain('models:write');
    await asAdmin(api().patch(`/api/v1/users/${viewerId}`)).send({ role: 'viewer' });
  });

  it('deactivates a user: their session stops working and they cannot sign in', async () => {
    const { body } = await asAdmin(api().post('/api/v1/users')).send({ email: 'temp.worker@quillfield.example', role: 'viewer' });
    const mailbox = await asAdmin(api().get('/api/v1/dev/mailbox'));
    const text: string = mailbox.body.items.find((m: { to: string[] }) => m.to.includes('temp.worker@quillfield.example')).text;
    const token = (/(pwi_[A-Za-z0-9_-]+)/.exec(text) as RegExpExecArray)[1];
    const session = (await api().post(`/api/v1/invitations/${token}/accept`).send({ name: 'Temp Worker', password: 'temporary-password' })).body.token;
    expect((await api().get('/api/v1/me').auth(session, { type: 'bearer' })).status).toBe(200);

    const off = await asAdmin(api().patch(`/api/v1/users/${body.user.id}`)).send({ status: 'deactivated' });
    expect(off.status).toBe(200);
    expect(off.body.status).toBe('deactivated');
    expect((await api().get('/api/v1/me').auth(session, { type: 'bearer' })).status).toBe(401);
    expect((await api().post('/api/v1/sessions').send({ email: 'temp.worker@quillfield.example', password: 'temporary-password' })).status).toBe(401);
  });

  it('keeps the last admin: an admin cannot deactivate or demote themselves', async () => {
    const adminId = await userIdOf('ada.admin@quillfield.example');
    const res = await asAdmin(api().patch(`/api/v1/users/${adminId}`)).send({ status: 'deactivated' });
    expect(res.status).toBe(409);
    expect((await asAdmin(api().get(`/api/v1/users/${adminId}`))).body.status).toBe('active');
  });

  it('answers an unknown user with 404 and an empty change with 400', async () => {
    expect((await asAdmin(api().get('/api/v1/users/no-such-user'))).status).toBe(404);
    const adminId = await userIdOf('ada.admin@quillfield.example');
    expect((await asAdmin(api().patch(`/api/v1/users/${adminId}`)).send({})).status).toBe(400);
  });
});
