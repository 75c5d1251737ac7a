/*
 * The answers of the compute and models routes validate against the schemas the OpenAPI document gives
 * for them (JSON Schema 2020-12 through ajv, the validator express-openapi-validator itself uses).
 */
import $RefParser from '@apidevtools/json-schema-ref-parser';
import Ajv2020 from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

type Doc = { paths: Record<string, Record<string, { responses: Record<string, { content?: Record<string, { schema: object }> }> }>> };

describe('compute and models responses match the OpenAPI document', () => {
  let server: TestServer;
  let doc: Doc;
  const ajv = new (Ajv2020 as unknown as typeof Ajv2020.default)({ strict: false, allErrors: true });
  (addFormats as unknown as typeof addFormats.default)(ajv);

  beforeAll(async () => {
    server = await startTestServer();
    doc = (await $RefParser.dereference(server.config.openapiPath)) as unknown as Doc;
  });
  afterAll(async () => {
    await server.close();
  });

  /** Validates a response against the schema of `path`/`method`/its status; fails with ajv's reasons. */
  function expectDocumented(path: string, method: string, res: request.Response): void {
    const operation = doc.paths[path]?.[method];
    expect(operation, `${method} ${path} is in the document`).toBeDefined();
    const response = operation.responses[String(res.status)];
    expect(response, `${method} ${path} documents status ${res.status}`).toBeDefined();
    const type = String(res.headers['content-type']).split(';')[0];
    if (!response.content) return;
    const schema = response.content[type]?.schema;
    expect(schema, `${method} ${path} ${res.status} documents ${type}`).toBeDefined();
    const validate = ajv.compile(schema);
    const ok = validate(res.body);
    expect(ok, JSON.stringify(validate.errors?.slice(0, 5), null, 1)).toBe(true);
  }

  const auth = () => ({ Authorization: `Bearer ${server.tokens.engineer}` });
  const plant = { expression: '(s+1)*(s+3)/(s*(s+2)*(s+4)*(s+5)*(s^2+2*s+10)*(s^2+s+30))' };

  it('POST /v1/locus, /v1/closed-loop and /v1/design answer with their documented result schemas', async () => {
    expectDocumented('/v1/locus', 'post', await request(server.baseUrl).post('/api/v1/locus').set(auth()).send({ plant, includeNegativeGains: true }).expect(200));
    expectDocumented('/v1/locus', 'post', await request(server.baseUrl).post('/api/v1/locus').set(auth()).send({ plant: { expression: '0.5*(z+0.4)/((z-1)*(z-0.6))', domain: 'z', sampleTime: 0.01 } }).expect(200));
    expectDocumented('/v1/closed-loop', 'post', await request(server.baseUrl).post('/api/v1/closed-loop').set(auth()).send({ plant, gain: 20 }).expect(200));
    expectDocumented('/v1/closed-loop', 'post', await request(server.baseUrl).post('/api/v1/closed-loop').set(auth()).send({ plant, gain: 1e6 }).expect(200));
    expectDocumented('/v1/design', 'post', await request(server.baseUrl).post('/api/v1/design').set(auth()).send({ plant, targets: { minDampingRatio: 0.4 }, dampingLines: [0.5, 0.7] }).expect(200));
    expectDocumented('/v1/locus', 'post', await request(server.baseUrl).post('/api/v1/locus').set(auth()).send({ plant: { numerator: [1, 2, 3], denominator: [1, 1] } }).expect(400));
  });

  it('has teeth: a locus answer does not pass as a closed-loop result, nor a model without its revision', async () => {
    const res = await request(server.baseUrl).post('/api/v1/locus').set(auth()).send({ plant }).expect(200);
    const closedLoopSchema = doc.paths['/v1/closed-loop'].post.responses['200'].content!['application/json'].schema;
    expect(ajv.validate(closedLoopSchema, res.body)).toBe(false);
    const model = (await request(server.baseUrl).get('/api/v1/models?pageSize=1').set(auth()).expect(200)).body.items[0];
    const modelSchema = doc.paths['/v1/models/{id}'].get.responses['200'].content!['application/json'].schema;
    expect(ajv.validate(modelSchema, model)).toBe(true);
    const { revision: _revision, ...withoutRevision } = model;
    expect(ajv.validate(modelSchema, withoutRevision)).toBe(false);
    expect(ajv.validate(modelSchema, { ...model, design: { gain: 'high', targets: null } })).toBe(false);
  });

  it('every models operation answers with its documented schema', async () => {
    const list = await request(server.baseUrl).get('/api/v1/models?pageSize=3').set(auth()).expect(200);
    expectDocumented('/v1/models', 'get', list);
    const created = await request(server.baseUrl)
      .post('/api/v1/models')
      .set(auth())
      .send({ name: 'Contract loop', plant: { expression: '1/(s*(s+1))', deadTime: 0.2 }, compensator: { zeros: [{ re: -2, im: 0 }], poles: [{ re: -10, im: 0 }], gain: 5 }, design: { gain: 1, targets: { minDampingRatio: 0.5 } }, tags: ['contract'] })
      .expect(201);
    expectDocumented('/v1/models', 'post', created);
    const id = created.body.id as string;
    expectDocumented('/v1/models/{id}', 'get', await request(server.baseUrl).get(`/api/v1/models/${id}`).set(auth()).expect(200));
    const updated = await request(server.baseUrl).put(`/api/v1/models/${id}`).set(auth()).set('If-Match', created.headers['etag']).send({ name: 'Contract loop', plant: { expression: '2/(s*(s+1))' } }).expect(200);
    expectDocumented('/v1/models/{id}', 'put', updated);
    expectDocumented('/v1/models/{id}', 'put', await request(server.baseUrl).put(`/api/v1/models/${id}`).set(auth()).set('If-Match', created.headers['etag']).send({ name: 'x', plant }).expect(412));
    expectDocumented('/v1/models/{id}/revisions', 'get', await request(server.baseUrl).get(`/api/v1/models/${id}/revisions`).set(auth()).expect(200));
    expectDocumented('/v1/models/{id}/revisions/{revision}', 'get', await request(server.baseUrl).get(`/api/v1/models/${id}/revisions/1`).set(auth()).expect(200));
    expectDocumented('/v1/models/{id}/locus', 'get', await request(server.baseUrl).get(`/api/v1/models/${id}/locus`).set(auth()).expect(200));
    expectDocumented('/v1/models/{id}', 'delete', await request(server.baseUrl).delete(`/api/v1/models/${id}`).set(auth()).expect(204));
    expectDocumented('/v1/models/{id}/restore', 'post', await request(server.baseUrl).post(`/api/v1/models/${id}/restore`).set(auth()).expect(200));
    const exported = await request(server.baseUrl).get('/api/v1/models/export').set(auth()).expect(200);
    expectDocumented('/v1/models/export', 'get', exported);
    const imported = await request(server.baseUrl).post('/api/v1/models/import').set(auth()).attach('file', Buffer.from(JSON.stringify({ ...exported.body, models: [...exported.body.models.slice(0, 2), { name: 'broken' }] })), 'b.json').expect(200);
    expectDocumented('/v1/models/import', 'post', imported);
    expect(imported.body.rejected).toBe(1);
  });
});
