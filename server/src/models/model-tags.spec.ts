import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

const PLANT = { expression: '3*(s+2)/(s*(s+5)*(s+9))' };
const PAGE = 'https://intranet.quillfield.example';

describe('GET /models/tags', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(() => server.close());

  const as = (token: string) => ({
    get: (path: string) => request(server.baseUrl).get(`/api/v1${path}`).auth(token, { type: 'bearer' }),
    post: (path: string) => request(server.baseUrl).post(`/api/v1${path}`).auth(token, { type: 'bearer' }),
    delete: (path: string) => request(server.baseUrl).delete(`/api/v1${path}`).auth(token, { type: 'bearer' }),
  });
  const tags = async (): Promise<{ tag: string; count: number }[]> => {
    const res = await as(server.tokens.viewer).get('/models/tags');
    expect(res.status, res.text).toBe(200);
    return res.body.items;
  };
  /** The same counts worked out from the model list. */
  const countedFromList = async (): Promise<{ tag: string; count: number }[]> => {
    const list = await as(server.tokens.viewer).get('/models?pageSize=200');
    expect(list.body.total).toBeLessThanOrEqual(200);
    const counts = new Map<string, number>();
    for (const model of list.body.items as { tags: string[] }[]) for (const tag of new Set(model.tags)) counts.set(tag, (counts.get(tag) ?? 0) + 1);
    return [...counts].map(([tag, count]) => ({ tag, count })).sort((a, b) => (a.tag < b.tag ? -1 : a.tag > b.tag ? 1 : 0));
  };
  const issueKey = async (scopes: string[]) => {
    const res = await as(server.tokens.admin).post('/api-keys').send({ name: `tags ${scopes.join(' ')}`, scopes });
    expect(res.status).toBe(201);
    return res.body.secret as string;
  };

  it('counts each tag over the models that are not deleted, sorted by tag, for anyone who may read models', async () => {
    const items = await tags();
    expect(items.length).toBeGreaterThan(0);
    expect(items).toEqual(await countedFromList());
    expect((await as(await issueKey(['models:read'])).get('/models/tags')).body.items).toEqual(items);
  });

  it('follows creates and soft deletes, and is not mistaken for the model with the id "tags"', async () => {
    const made: string[] = [];
    for (const tagList of [['tags-probe', 'tags-probe-alone'], ['tags-probe']]) {
      const res = await as(server.tokens.engineer).post('/models').send({ name: `Tag probe ${made.length + 1}`, tags: tagList, plant: PLANT });
      expect(res.status, res.text).toBe(201);
      made.push(res.body.id);
    }
    const counted = (items: { tag: string; count: number }[], tag: string) => items.find((i) => i.tag === tag)?.count;
    let items = await tags();
    expect([counted(items, 'tags-probe'), counted(items, 'tags-probe-alone')]).toEqual([2, 1]);
    expect((await as(server.tokens.engineer).delete(`/models/${made[0]}`)).status).toBe(204);
    items = await tags();
    expect([counted(items, 'tags-probe'), counted(items, 'tags-probe-alone')]).toEqual([1, undefined]);
    expect(items).toEqual(await countedFromList());
    expect((await as(server.tokens.engineer).post(`/models/${made[0]}/restore`)).status).toBe(200);
    expect(counted(await tags(), 'tags-probe-alone')).toBe(1);
  });

  it('refuses query parameters with 400 at the parameter', async () => {
    const res = await as(server.tokens.viewer).get('/models/tags?tag=web');
    expect(res.status).toBe(400);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/query/tag']);
  });

  it('refuses callers without models:read: no token 401, a key without the scope 403, an embed token 403', async () => {
    expect((await request(server.baseUrl).get('/api/v1/models/tags')).status).toBe(401);
    const keyed = await as(await issueKey(['compute'])).get('/models/tags');
    expect(keyed.status).toBe(403);
    const model = (await as(server.tokens.viewer).get('/models?pageSize=1')).body.items[0].id as string;
    const embed = await as(server.tokens.viewer).post('/embed-tokens').send({ modelIds: [model], origins: [PAGE], ttlSeconds: 600 });
    expect(embed.status).toBe(201);
    const byEmbed = await request(server.baseUrl).get('/api/v1/models/tags').set('Origin', PAGE).auth(embed.body.token, { type: 'bearer' });
    expect(byEmbed.status).toBe(403);
    expect(byEmbed.headers['content-type']).toMatch(/^application\/problem\+json/);
    // the same token does read its own model: the refusal is about the tag list
    expect((await request(server.baseUrl).get(`/api/v1/models/${model}`).set('Origin', PAGE).auth(embed.body.token, { type: 'bearer' })).status).toBe(200);
  });
});
