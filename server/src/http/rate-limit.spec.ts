import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { problemHandler } from './problem.js';
import { rateLimits } from './rate-limit.js';

/** A bare app with only the limiters; behind a trusted proxy so that tests can pose as several addresses. */
function appWith(perMinute: number) {
  const app = express();
  app.set('trust proxy', 1);
  for (const limiter of rateLimits(perMinute)) app.use(limiter);
  app.get('/probe', (_req, res) => res.json({ ok: true }));
  app.use(problemHandler(() => undefined));
  return app;
}

const TOKEN = 'pwk_' + 'Q'.repeat(43);

describe('rate limits', () => {
  it('count each IP address on its own', async () => {
    const app = appWith(2);
    for (let i = 0; i < 2; i++) expect((await request(app).get('/probe').set('X-Forwarded-For', '10.0.0.1')).status).toBe(200);
    expect((await request(app).get('/probe').set('X-Forwarded-For', '10.0.0.1')).status).toBe(429);
    expect((await request(app).get('/probe').set('X-Forwarded-For', '10.0.0.2')).status).toBe(200);
  });

  it('count one bearer token across addresses', async () => {
    const app = appWith(2);
    expect((await request(app).get('/probe').set('X-Forwarded-For', '10.0.1.1').auth(TOKEN, { type: 'bearer' })).status).toBe(200);
    expect((await request(app).get('/probe').set('X-Forwarded-For', '10.0.1.2').auth(TOKEN, { type: 'bearer' })).status).toBe(200);
    const third = await request(app).get('/probe').set('X-Forwarded-For', '10.0.1.3').auth(TOKEN, { type: 'bearer' });
    expect(third.status).toBe(429);
    expect(third.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(Number(third.headers['retry-after'])).toBeGreaterThan(0);
    // the same new address without the token is still within its own budget
    expect((await request(app).get('/probe').set('X-Forwarded-For', '10.0.1.3')).status).toBe(200);
  });

  it('are off at 0', async () => {
    const app = appWith(0);
    for (let i = 0; i < 20; i++) expect((await request(app).get('/probe')).status).toBe(200);
  });
});
