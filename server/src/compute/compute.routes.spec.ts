import { closedLoop, designGains, locus, CAUTION } from '@polewright/locus-core';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { MAX_COMPUTE_BODY_BYTES } from './compute.service.js';

// a degree-8 loop of our own (not from the demo scenario)
const PLANT = { expression: '(s+1)*(s+3)/(s*(s+2)*(s+4)*(s+5)*(s^2+2*s+10)*(s^2+s+30))' };

describe('compute routes', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.close();
  });
  const post = (path: string, token = server.tokens.viewer) => request(server.baseUrl).post(`/api/v1${path}`).set('Authorization', `Bearer ${token}`);

  it('POST /locus answers exactly what the core computes for the same request', async () => {
    const body = { plant: PLANT, includeNegativeGains: true };
    const res = await post('/locus').send(body).expect(200);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(locus(body))));
    expect(res.body.caution).toBe(CAUTION);
    expect(res.body.branches).toHaveLength(8);
    // the worker's bytes go out as they are: exact length, no ETag hashed over a POST answer
    expect(Number(res.headers['content-length'])).toBe(Buffer.byteLength(res.text));
    expect(res.headers['etag']).toBeUndefined();
  });

  it('POST /closed-loop answers what the core computes, step response included', async () => {
    const body = { plant: { expression: '4/(s*(s+2))' }, gain: 3, step: { duration: 6, points: 61 } };
    const res = await post('/closed-loop').send(body).expect(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(closedLoop(body))));
    expect(res.body.step.time).toHaveLength(61);
    expect(res.body.stable).toBe(true);
  });

  it('POST /design answers what the core computes for targets and damping lines', async () => {
    const body = { plant: { expression: '1/(s*(s+1)*(s+5))' }, targets: { minDampingRatio: 0.5 }, dampingLines: [0.5] };
    const res = await post('/design').send(body).expect(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(designGains(body))));
    expect(res.body.gainRanges.length).toBeGreaterThan(0);
  });

  it('an improper plant is a 400 problem whose pointer is the engine’s', async () => {
    const res = await post('/locus').send({ plant: { numerator: [1, 0, 0], denominator: [1, 1] } }).expect(400);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(res.body.errors).toEqual([{ pointer: '/plant/numerator', detail: expect.stringContaining('proper') }]);
    expect(res.body.status).toBe(400);
  });

  it('an expression the engine cannot read names /plant/expression', async () => {
    const res = await post('/locus').send({ plant: { expression: '1/(s*(s+' } }).expect(400);
    expect(res.body.errors[0].pointer).toBe('/plant/expression');
  });

  it('a z-plant without its sampling period names /plant/sampleTime', async () => {
    const res = await post('/closed-loop').send({ plant: { expression: '0.5/(z-0.5)', domain: 'z' }, gain: 1 }).expect(400);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain('/plant/sampleTime');
  });

  it('design targets out of range are refused with the engine’s pointer', async () => {
    const res = await post('/design').send({ plant: PLANT, targets: { maxOvershootPct: 0 } });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].pointer).toBe('/targets/maxOvershootPct');
  });

  it('a body beyond the compute size limit is a 413 problem and no work is done', async () => {
    const padding = 'x'.repeat(MAX_COMPUTE_BODY_BYTES);
    const res = await post('/locus').send({ plant: { expression: `1/(s+1)`, domain: 's' }, gainRange: { max: 10 }, note: padding });
    expect(res.status).toBe(413);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
  });

  it('needs a token, and the compute permission', async () => {
    const res = await request(server.baseUrl).post('/api/v1/locus').send({ plant: PLANT });
    expect(res.status).toBe(401);
  });
});
