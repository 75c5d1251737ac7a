import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

// The state `GET /invitations/{token}` reports over an invitation's life (the console's invitation page
// shows it before anyone types a password), on a test clock, and the accept call agreeing with it.
describe('the state of an invitation over time', () => {
  let server: TestServer;
  let clock = new Date('2026-12-02T08:00:00Z');
  beforeAll(async () => {
    server = await startTestServer({ clock: () => clock });
  });
  afterAll(() => server.close());

  const api = () => request(server.baseUrl);

  /** Invites a person through the API and returns the token of the link in the captured e-mail. */
  async function invite(email: string): Promise<string> {
    const invited = await api().post('/api/v1/users').auth(server.tokens.admin, { type: 'bearer' }).send({ email, role: 'viewer' });
    expect(invited.status).toBe(201);
    const mail = server.context.mailer.captured?.find((m) => m.to.includes(email));
    const link = /(\S+)\/invitations\/(pwi_[A-Za-z0-9_-]+)/.exec(mail?.text ?? '');
    expect(link?.[1]).toBe(server.config.publicUrl);
    return link?.[2] as string;
  }

  const stateOf = async (token: string) => (await api().get(`/api/v1/invitations/${token}`)).body.state as string;

  it('is open until accepted, then used; accepting again is a conflict', async () => {
    const token = await invite('state.used@quillfield.example');
    expect(await stateOf(token)).toBe('open');
    expect((await api().post(`/api/v1/invitations/${token}/accept`).send({ name: 'State Used', password: 'state-used-password' })).status).toBe(201);
    expect(await stateOf(token)).toBe('used');
    const again = await api().post(`/api/v1/invitations/${token}/accept`).send({ name: 'State Used', password: 'state-used-password' });
    expect(again.status).toBe(409);
    expect(again.body.detail).toMatch(/used already/);
  });

  it('is open one millisecond before its expiry and expired from the expiry on; accepting then is a conflict', async () => {
    const token = await invite('state.late@quillfield.example');
    const open = await api().get(`/api/v1/invitations/${token}`);
    expect(open.body).toMatchObject({ state: 'open', email: 'state.late@quillfield.example', role: 'viewer' });
    const expiresAt = Date.parse(open.body.expiresAt);
    expect(expiresAt - clock.getTime()).toBe(server.config.invitationTtlSeconds * 1000);
    clock = new Date(expiresAt - 1);
    expect(await stateOf(token)).toBe('open');
    clock = new Date(expiresAt);
    expect(await stateOf(token)).toBe('expired');
    const refused = await api().post(`/api/v1/invitations/${token}/accept`).send({ name: 'State Late', password: 'state-late-password' });
    expect(refused.status).toBe(409);
    expect(refused.body.detail).toMatch(/expired/);
    // nothing changed: the person is still waiting for an invitation
    const rows = (await server.context.dataSource.query('SELECT status FROM users WHERE email = ?', ['state.late@quillfield.example'])) as { status: string }[];
    expect(rows[0]?.status).toBe('invited');
  });
});
