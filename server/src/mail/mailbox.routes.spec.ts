import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

describe('development mailbox', () => {
  let server: TestServer | undefined;
  afterEach(async () => {
    await server?.close();
    server = undefined;
  });

  it('shows an admin the mail the fake SMTP server captured, newest first', async () => {
    server = await startTestServer();
    await server.context.mailer.send({ to: 'first@quillfield.example', subject: 'one', text: 'first body' });
    await server.context.mailer.send({ to: 'second@quillfield.example', subject: 'two', text: 'second body' });
    const res = await request(server.baseUrl).get('/api/v1/dev/mailbox').auth(server.tokens.admin, { type: 'bearer' });
    expect(res.status).toBe(200);
    expect(res.body.items.map((m: { subject: string }) => m.subject)).toEqual(['two', 'one']);
    expect(res.body.items[0]).toMatchObject({ to: ['second@quillfield.example'], text: expect.stringContaining('second body') });
  });

  it('is refused to non-admins', async () => {
    server = await startTestServer();
    const res = await request(server.baseUrl).get('/api/v1/dev/mailbox').auth(server.tokens.engineer, { type: 'bearer' });
    expect(res.status).toBe(403);
  });

  it('does not exist in production', async () => {
    server = await startTestServer({ env: { NODE_ENV: 'production' } });
    const res = await request(server.baseUrl).get('/api/v1/dev/mailbox').auth(server.tokens.admin, { type: 'bearer' });
    expect(res.status).toBe(404);
  });
});
