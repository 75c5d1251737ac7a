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

  describe('list filters and order', () => {
    type Listed = { id: string; email: string; name: string; role: string; status: string; createdAt: string };
    const list = async (query: string): Promise<{ items: Listed[]; total: number }> => {
      const res = await asAdmin(api().get(`/api/v1/users?${query}`));
      expect(res.status, res.text).toBe(200);
      return res.body;
    };
    const everyone = async () => (await list('pageSize=200')).items;
    const emails = (items: Listed[]) => items.map((u) => u.email);
    const byEmail = (a: Listed, b: Listed) => (a.email < b.email ? -1 : a.email > b.email ? 1 : 0);
    // SQLite's NOCASE folds ASCII letters only, as toLowerCase does for the ASCII names used here
    const byName = (a: Listed, b: Listed) => (a.name.toLowerCase() < b.name.toLowerCase() ? -1 : a.name.toLowerCase() > b.name.toLowerCase() ? 1 : byEmail(a, b));

    it('keeps the default: every user by e-mail', async () => {
      const all = await everyone();
      expect(all.length).toBeGreaterThanOrEqual(3);
      expect(emails(all)).toEqual(emails([...all].sort(byEmail)));
    });

    it('finds text in the e-mail or the name without regard to case, and takes % and _ literally', async () => {
      const all = await everyone();
      const byText = await list('q=VARGA');
      expect(emails(byText.items)).toEqual(emails(all.filter((u) => `${u.email} ${u.name}`.toLowerCase().includes('varga'))));
      expect(emails(byText.items)).toContain('emil.engineer@quillfield.example');
      const byMail = await list('q=Ada.Admin%40QUILLFIELD');
      expect(emails(byMail.items)).toEqual(['ada.admin@quillfield.example']);
      expect((await list('q=%25')).total).toBe(0);
      expect((await list('q=_')).total).toBe(0);
    });

    it('filters by role and status, together with the text', async () => {
      const invited = await asAdmin(api().post('/api/v1/users')).send({ email: 'filter.probe@quillfield.example', role: 'viewer', name: 'Filter Probe' });
      expect(invited.status).toBe(201);
      const all = await everyone();
      const viewers = await list('role=viewer');
      expect(emails(viewers.items)).toEqual(emails(all.filter((u) => u.role === 'viewer')));
      expect(viewers.total).toBe(viewers.items.length);
      expect(emails((await list('status=invited')).items)).toEqual(emails(all.filter((u) => u.status === 'invited')));
      expect(emails((await list('status=invited')).items)).toContain('filter.probe@quillfield.example');
      expect(emails((await list('status=active')).items)).not.toContain('filter.probe@quillfield.example');
      expect(emails((await list('q=probe&role=viewer&status=invited')).items)).toEqual(['filter.probe@quillfield.example']);
      expect((await list('q=probe&role=admin')).total).toBe(0);
    });

    it('sorts by name, e-mail or creation time, both ways, and pages the sorted list', async () => {
      const all = await everyone();
      expect(emails((await list('sort=name&pageSize=200')).items)).toEqual(emails([...all].sort(byName)));
      expect(emails((await list('sort=name&order=desc&pageSize=200')).items)).toEqual(emails([...all].sort((a, b) => byName(b, a))));
      expect(emails((await list('sort=email&order=desc&pageSize=200')).items)).toEqual(emails([...all].sort(byEmail).reverse()));
      const newestFirst = [...all].sort((a, b) => (a.createdAt > b.createdAt ? -1 : a.createdAt < b.createdAt ? 1 : byEmail(a, b)));
      expect(emails((await list('sort=createdAt&pageSize=200')).items)).toEqual(emails(newestFirst));
      const page = await list('sort=name&pageSize=2&page=2');
      expect(page.total).toBe(all.length);
      expect(emails(page.items)).toEqual(emails([...all].sort(byName).slice(2, 4)));
    });

    it('refuses an unknown sort, order, role, status or parameter with 400 at the query parameter', async () => {
      const pointers = async (query: string) => {
        const res = await asAdmin(api().get(`/api/v1/users?${query}`));
        expect(res.status, res.text).toBe(400);
        expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
        return (res.body.errors as { pointer: string }[]).map((e) => e.pointer);
      };
      expect(await pointers('sort=password')).toEqual(['/query/sort']);
      expect(await pointers('order=up')).toEqual(['/query/order']);
      expect(await pointers('role=owner')).toEqual(['/query/role']);
      expect(await pointers('status=gone')).toEqual(['/query/status']);
      expect(await pointers(`q=${'x'.repeat(201)}`)).toEqual(['/query/q']);
      expect(await pointers('email=ada')).toEqual(['/query/email']);
    });

    it('refuses the filtered list to an engineer (403) before looking at the query', async () => {
      const res = await api().get('/api/v1/users?sort=password').auth(server.tokens.engineer, { type: 'bearer' });
      expect(res.status).toBe(403);
      expect(res.body.errors).toBeUndefined();
    });
  });

  describe('GET /invitations/{token}', () => {
    const tokenFor = (email: string) => (/(pwi_[A-Za-z0-9_-]+)/.exec(server.context.mailer.captured?.find((m) => m.to.includes(email))?.text ?? '') ?? [])[1] as string;

    it('shows an invitation without a bearer token: open until accepted, then used', async () => {
      const invited = await asAdmin(api().post('/api/v1/users')).send({ email: 'shown.invitee@quillfield.example', role: 'engineer', name: 'Shown Invitee' });
      expect(invited.status).toBe(201);
      const token = tokenFor('shown.invitee@quillfield.example');
      const open = await api().get(`/api/v1/invitations/${token}`);
      expect(open.status, open.text).toBe(200);
      expect(open.headers['cache-control']).toBe('no-store');
      expect(open.body).toEqual({ state: 'open', email: 'shown.invitee@quillfield.example', name: 'Shown Invitee', role: 'engineer', expiresAt: invited.body.invitationExpiresAt });
      const accepted = await api().post(`/api/v1/invitations/${token}/accept`).send({ name: 'Shown At Last', password: 'shown-invitee-password' });
      expect(accepted.status).toBe(201);
      const used = await api().get(`/api/v1/invitations/${token}`);
      expect(used.status).toBe(200);
      expect(used.body).toMatchObject({ state: 'used', name: 'Shown At Last', role: 'engineer' });
    });

    it('answers an unknown token with 404 and an overlong one with 400 at /path/token, both problem+json', async () => {
      const unknown = await api().get('/api/v1/invitations/pwi_nobody-was-invited-with-this');
      expect(unknown.status).toBe(404);
      expect(unknown.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(unknown.body.type).toBe('urn:polewright:problem:not-found');
      const long = await api().get(`/api/v1/invitations/pwi_${'x'.repeat(100)}`);
      expect(long.status).toBe(400);
      expect(long.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(long.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/path/token']);
    });

    it('refuses a bad bearer token on it like anywhere else (401), though it needs none', async () => {
      const res = await api().get('/api/v1/invitations/pwi_x').set('Authorization', 'Bearer pws_short');
      expect(res.status).toBe(401);
    });
  });
});
