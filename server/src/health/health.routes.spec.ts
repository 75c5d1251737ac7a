import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

describe('health, contract and docs', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(() => server.close());

  it('answers GET /api/health without a token', async () => {
    const res = await request(server.baseUrl).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('ok');
  });

  it('says the development mailbox is there when it is (not production, no SMTP_URL), as the mailbox route answers', async () => {
    const res = await request(server.baseUrl).get('/api/health');
    expect(res.body.mailbox).toBe(true);
    expect((await request(server.baseUrl).get('/api/v1/dev/mailbox').auth(server.tokens.admin, { type: 'bearer' })).status).toBe(200);
  });

  for (const [why, env] of [
    ['in production', { NODE_ENV: 'production' }],
    ['when mail goes to SMTP_URL', { SMTP_URL: 'smtp://127.0.0.1:9' }],
  ] as const) {
    it(`says there is no development mailbox ${why}, as the mailbox route answers`, async () => {
      const other = await startTestServer({ env });
      try {
        const res = await request(other.baseUrl).get('/api/health');
        expect(res.status).toBe(200);
        expect(res.body.mailbox).toBe(false);
        const mailbox = await request(other.baseUrl).get('/api/v1/dev/mailbox').auth(other.tokens.admin, { type: 'bearer' });
        expect(mailbox.status).toBe(404);
        expect(mailbox.headers['content-type']).toMatch(/^application\/problem\+json/);
      } finally {
        await other.close();
      }
    });
  }

  it('refuses a query parameter the document does not list with 400 at it', async () => {
    const res = await request(server.baseUrl).get('/api/health?mailbox=1');
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/query/mailbox']);
  });

  it('serves the contract bundled into one JSON document with no references to other files', async () => {
    const res = await request(server.baseUrl).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    expect(Object.keys(res.body.paths)).toContain('/v1/sessions');
    const refs = JSON.stringify(res.body).match(/"\$ref":"[^"]*"/g) ?? [];
    expect(refs.length).toBeGreaterThan(0);
    expect(refs.filter((r) => !r.startsWith('"$ref":"#/'))).toEqual([]);
  });

  it('serves Swagger UI at /api/docs', async () => {
    const res = await request(server.baseUrl).get('/api/docs/');
    expect(res.status).toBe(200);
    expect(res.text).toContain('swagger-ui');
    const init = await request(server.baseUrl).get('/api/docs/swagger-ui-init.js');
    expect(init.text).toContain('/api/openapi.json');
  });

  it('sends helmet headers, without upgrade-insecure-requests, and a request id', async () => {
    const res = await request(server.baseUrl).get('/api/health').set('X-Request-Id', 'probe-42');
    expect(res.headers['content-security-policy']).toBeDefined();
    expect(res.headers['content-security-policy']).not.toContain('upgrade-insecure-requests');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-request-id']).toBe('probe-42');
  });
});
