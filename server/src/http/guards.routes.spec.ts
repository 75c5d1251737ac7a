import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

function expectProblem(res: request.Response, status: number): void {
  expect(res.status).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  expect(res.body).toMatchObject({ status, type: expect.stringMatching(/^urn:polewright:problem:/), title: expect.any(String), detail: expect.any(String), instance: expect.any(String) });
  expect(res.text).not.toMatch(/\bat .*\.(ts|js):\d+/);
}

describe('guards: every error is problem+json', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ env: { JSON_BODY_LIMIT: '2kb' } });
  });
  afterAll(() => server.close());

  const api = () => request(server.baseUrl);

  it('404 for an unknown API route and for an unknown page', async () => {
    expectProblem(await api().get('/api/v1/no-such-thing').auth(server.tokens.admin, { type: 'bearer' }), 404);
    expectProblem(await api().get('/api/nothing-here'), 404);
    expectProblem(await api().get('/no-such-page'), 404);
    expectProblem(await api().get('/no-such-file.js').set('Accept', 'text/html,*/*'), 404);
  });

  it('405 with Allow for a known route and another method', async () => {
    const res = await api().put('/api/v1/sessions').send({});
    expectProblem(res, 405);
    expect(res.headers['allow']).toMatch(/POST/);
  });

  it('413 for a body over the limit', async () => {
    const res = await api().post('/api/v1/sessions').send({ email: 'a@quillfield.example', password: 'x'.repeat(4000) });
    expectProblem(res, 413);
  });

  it('415 for a body of another media type', async () => {
    const res = await api().post('/api/v1/sessions').set('Content-Type', 'text/plain').send('email=a');
    expectProblem(res, 415);
  });

  it('400 for malformed JSON', async () => {
    const res = await api().post('/api/v1/sessions').set('Content-Type', 'application/json').send('{"email": ');
    expectProblem(res, 400);
  });

  it('401 with WWW-Authenticate for a malformed Authorization header', async () => {
    const res = await api().get('/api/v1/me').set('Authorization', 'Basic YWRhOnB3');
    expectProblem(res, 401);
    expect(res.headers['www-authenticate']).toBe('Bearer');
  });

  it('500 with a generic body and no stack when the database is gone', async () => {
    const broken = await startTestServer();
    await broken.context.dataSource.destroy();
    const res = await request(broken.baseUrl).get('/api/health');
    expectProblem(res, 500);
    expect(res.body.detail).toBe('Something went wrong on the server.');
    expect(res.text).not.toMatch(/SQLITE|TypeORM|Error:/i);
    await broken.close();
  });
});

describe('rate limits', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer({ env: { RATE_LIMIT_PER_MINUTE: '3' } });
  });
  afterAll(() => server.close());

  it('answers past the limit with 429 problem+json and Retry-After', async () => {
    for (let i = 0; i < 3; i++) expect((await request(server.baseUrl).get('/api/health')).status).toBe(200);
    const res = await request(server.baseUrl).get('/api/health');
    expectProblem(res, 429);
    const retryAfter = Number(res.headers['retry-after']);
    expect(Number.isInteger(retryAfter)).toBe(true);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(60);
  });
});
