import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

describe('the invitation page at /invitations/:token', () => {
  let server: TestServer;
  let clock = new Date('2026-12-02T08:00:00Z');
  beforeAll(async () => {
    server = await startTestServer({ clock: () => clock });
  });
  afterAll(() => server.close());

  const api = () => request(server.baseUrl);

  /** Invites a person through the API and returns the token from the captured e-mail. */
  async function invite(email: string): Promise<string> {
    const invited = await api().post('/api/v1/users').auth(server.tokens.admin, { type: 'bearer' }).send({ email, role: 'viewer' });
    expect(invited.status).toBe(201);
    const mail = server.context.mailer.captured?.find((m) => m.to.includes(email));
    return (/\/invitations\/(pwi_[A-Za-z0-9_-]+)/.exec(mail?.text ?? '') ?? [])[1] as string;
  }

  it('answers 200 HTML whose CSP allows scripts from the server only, and holds no inline script', async () => {
    const res = await api().get('/invitations/pwi_x');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    const scriptSrc = /script-src ([^;]*)/.exec(res.headers['content-security-policy'] as string)?.[1];
    expect(scriptSrc?.trim()).toBe("'self'");
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.text).toContain('<form id="accept-form"');
    const scripts = [...res.text.matchAll(/<script\b[^>]*>([\s\S]*?)<\/script>/gi)];
    expect(scripts.map((m) => m[0])).toEqual(['<script type="module" src="invitation.js"></script>']);
    expect(res.text).not.toMatch(/\son[a-z]+=/i);
  });

  it('serves its script and stylesheet beside it', async () => {
    const script = await api().get('/invitations/invitation.js');
    expect(script.status).toBe(200);
    expect(script.headers['content-type']).toMatch(/javascript/);
    expect(script.text).toContain('/accept');
    const style = await api().get('/invitations/invitation.css');
    expect(style.status).toBe(200);
    expect(style.headers['content-type']).toMatch(/^text\/css/);
  });

  it('tells the page whether the invitation is open, used, expired or unknown', async () => {
    const stateOf = async (token: string) => /data-invitation="(\w+)"/.exec((await api().get(`/invitations/${token}`)).text)?.[1];
    expect(await stateOf('pwi_x')).toBe('unknown');
    const token = await invite('page.open@quillfield.example');
    expect(await stateOf(token)).toBe('open');
    const accepted = await api().post(`/api/v1/invitations/${token}/accept`).send({ name: 'Page Open', password: 'page-open-password' });
    expect(accepted.status).toBe(201);
    expect(await stateOf(token)).toBe('used');

    const later = await invite('page.late@quillfield.example');
    clock = new Date(clock.getTime() + server.config.invitationTtlSeconds * 1000);
    expect(await stateOf(later)).toBe('expired');
    // the page and the API agree
    const refused = await api().post(`/api/v1/invitations/${later}/accept`).send({ name: 'Page Late', password: 'page-late-password' });
    expect(refused.status).toBe(409);
    expect(refused.body.detail).toMatch(/expired/);
  });

  it('sends an address with a trailing slash to the one without, so the relative links hold', async () => {
    const res = await api().get('/invitations/pwi_x/');
    expect(res.status).toBe(301);
    expect(new URL(res.headers['location'] as string, `${server.baseUrl}/invitations/pwi_x/`).pathname).toBe('/invitations/pwi_x');
  });

  it('leaves other paths below /invitations to the problem+json 404', async () => {
    const res = await api().get('/invitations/pwi_x/more');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  });
});
