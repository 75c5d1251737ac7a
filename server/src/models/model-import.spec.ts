import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { MAX_IMPORT_BYTES } from './models.routes.js';

const CSV = [
  'name,description,tags,expression,numerator,denominator,domain,sampleTime,deadTime,designGain,comment',
  'Kiln fan speed,Induced-draft fan of kiln 2,fan;speed,5/(s*(s+2)*(s+6)),,,,,,4.5,From the fan datasheet',
  'Bad expression,,fan,1/(s*(s+,,,,,,,',
  'Glue pump flow,Coefficient form,pump flow,,2 1,1 5 6 0,,,0.3,,',
  'Sampled without period,,sampled,,0.2,1 -0.8,z,,,,',
  ',Nameless row,,1/(s+1),,,,,,,',
  'Improper coefficients,,,,1 2 3,1 1,,,,,',
].join('\n');

describe('POST /models/import and GET /models/export', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.close();
  });
  const auth = (token = server.tokens.engineer) => ({ Authorization: `Bearer ${token}` });
  const upload = (content: string | Buffer, filename: string, token?: string) =>
    request(server.baseUrl).post('/api/v1/models/import').set(auth(token)).attach('file', Buffer.from(content), filename);
  const countModels = async () => Number((await server.context.dataSource.query('SELECT COUNT(*) AS n FROM models'))[0].n);

  it('imports the good rows of a CSV in one go and gives the reason for every bad row', async () => {
    const before = await countModels();
    const res = await upload(CSV, 'site-loops.csv').expect(200);
    expect(res.body).toMatchObject({ format: 'csv', created: 2, rejected: 4 });
    const byRow = Object.fromEntries(res.body.results.map((r: { row: number }) => [r.row, r]));
    expect(byRow[1]).toMatchObject({ status: 'created', name: 'Kiln fan speed', id: expect.any(String) });
    expect(byRow[2]).toMatchObject({ status: 'rejected', errors: [{ pointer: '/plant/expression', detail: expect.any(String) }] });
    expect(byRow[3]).toMatchObject({ status: 'created', name: 'Glue pump flow' });
    expect(byRow[4].errors.map((e: { pointer: string }) => e.pointer)).toContain('/plant/sampleTime');
    expect(byRow[5].errors.map((e: { pointer: string }) => e.pointer)).toContain('/name');
    expect(byRow[6].errors).toEqual([{ pointer: '/plant/numerator', detail: expect.stringContaining('proper') }]);
    expect(await countModels()).toBe(before + 2);

    const kiln = await request(server.baseUrl).get(`/api/v1/models/${byRow[1].id}`).set(auth()).expect(200);
    expect(kiln.body).toMatchObject({ tags: ['fan', 'speed'], plant: { expression: '5/(s*(s+2)*(s+6))' }, design: { gain: 4.5, targets: null }, revision: 1 });
    const pump = await request(server.baseUrl).get(`/api/v1/models/${byRow[3].id}`).set(auth()).expect(200);
    expect(pump.body.plant).toEqual({ numerator: [2, 1], denominator: [1, 5, 6, 0], deadTime: 0.3 });
    const history = await request(server.baseUrl).get(`/api/v1/models/${byRow[1].id}/revisions`).set(auth()).expect(200);
    expect(history.body.items[0].comment).toBe('From the fan datasheet');
    const audit = await server.context.dataSource.query("SELECT detail FROM audit_events WHERE action = 'model.imported'");
    expect(audit).toHaveLength(1);
  });

  it('round-trips: what export gives, import takes back as new models with the same content', async () => {
    const exported = await request(server.baseUrl).get('/api/v1/models/export').set(auth()).expect(200);
    expect(exported.headers['content-disposition']).toMatch(/^attachment; filename="polewright-models-\d{4}-\d{2}-\d{2}\.json"$/);
    const bundle = exported.body;
    expect(bundle).toMatchObject({ format: 'polewright-models', version: 1 });
    const before = await countModels();
    expect(bundle.models.length).toBe(before);
    const res = await upload(JSON.stringify(bundle), 'bundle.json').expect(200);
    expect(res.body).toMatchObject({ format: 'json', created: bundle.models.length, rejected: 0 });
    expect(await countModels()).toBe(2 * before);
    for (const [i, result] of res.body.results.entries()) {
      const copy = await request(server.baseUrl).get(`/api/v1/models/${result.id}`).set(auth()).expect(200);
      const original = bundle.models[i];
      expect(copy.body).toMatchObject({ name: original.name, description: original.description, tags: original.tags, plant: original.plant, compensator: original.compensator, design: original.design, revision: 1 });
      expect(copy.body.id).not.toBe(original.sourceId);
    }
  });

  it('keeps only the tagged models when export is given a tag', async () => {
    const res = await request(server.baseUrl).get('/api/v1/models/export?tag=sampled').set(auth()).expect(200);
    expect(res.body.models.length).toBeGreaterThan(0);
    expect(res.body.models.every((m: { tags: string[] }) => m.tags.includes('sampled'))).toBe(true);
  });

  it('rejects bad bundle entries one by one, pointing into the entry', async () => {
    const bundle = { format: 'polewright-models', version: 1, models: [{ name: 'Fine', plant: { expression: '1/(s+1)' } }, { name: 'No plant' }, 42] };
    const res = await upload(JSON.stringify(bundle), 'b.json').expect(200);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(['created', 'rejected', 'rejected']);
    expect(res.body.results[1].errors).toEqual([{ pointer: '/plant', detail: 'is required' }]);
    expect(res.body.results[2].errors[0].pointer).toBe('');
  });

  it('refuses a file that is not a bundle or readable CSV, storing nothing', async () => {
    const before = await countModels();
    const notJson = await upload('{ "format": ', 'x.json').expect(400);
    expect(notJson.body.errors[0].pointer).toBe('/file');
    const wrongColumns = await upload('title,plant\nA,1/(s+1)\n', 'x.csv').expect(400);
    expect(wrongColumns.body.errors[0].detail).toContain('unknown column');
    const ragged = await upload('name,expression\nA,1/(s+1),extra\n', 'x.csv').expect(400);
    expect(ragged.body.errors[0].pointer).toBe('/file');
    expect(await countModels()).toBe(before);
  });

  it('answers 413 for a file over the size limit, 415 for a body that is not multipart, 400 without a file', async () => {
    const big = await upload(Buffer.alloc(MAX_IMPORT_BYTES + 1, 0x20), 'big.csv');
    expect(big.status).toBe(413);
    expect(big.headers['content-type']).toMatch(/problem\+json/);
    const json = await request(server.baseUrl).post('/api/v1/models/import').set(auth()).send({ models: [] });
    expect(json.status).toBe(415);
    const none = await request(server.baseUrl).post('/api/v1/models/import').set(auth()).field('note', 'no file');
    expect(none.status).toBe(400);
  });

  it('is not open to viewers', async () => {
    await upload(CSV, 'site-loops.csv', server.tokens.viewer).expect(403);
  });
});
