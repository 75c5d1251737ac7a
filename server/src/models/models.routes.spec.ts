import { locus } from '@polewright/locus-core';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';
import { loopLocus } from './model-locus.js';
import { scenarioLoops } from './models.seed.js';

const NEW_MODEL = {
  name: 'Spool winder tension (test loop)',
  description: 'A loop made up for this test.',
  tags: ['Web', 'tension', 'web'],
  plant: { expression: '2*(s+1)/(s*(s+4)*(s^2+2*s+5))' },
  compensator: null,
  design: { gain: 1.5, targets: null },
  comment: 'First cut',
};

describe('models routes', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.close();
  });
  const api = (token = server.tokens.engineer) => ({
    get: (path: string) => request(server.baseUrl).get(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
    post: (path: string) => request(server.baseUrl).post(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
    put: (path: string) => request(server.baseUrl).put(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
    delete: (path: string) => request(server.baseUrl).delete(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
  });
  const revisionsInDb = async (id: string) =>
    (await server.context.dataSource.query('SELECT revision, comment, content_hash FROM model_revisions WHERE model_id = ? ORDER BY revision', [id])) as { revision: number; comment: string; content_hash: string }[];
  const create = async (overrides: Record<string, unknown> = {}) => (await api().post('/models').send({ ...NEW_MODEL, ...overrides }).expect(201)).body;

  describe('demo seed', () => {
    it('holds every scenario loop, two of them at a retuned second revision, authored by the demo engineer', async () => {
      const res = await api().get('/models?sort=name&pageSize=50').expect(200);
      const loops = scenarioLoops();
      expect(res.body.total).toBe(loops.length);
      expect(res.body.items.map((m: { name: string }) => m.name).sort()).toEqual(loops.map((l) => l.name).sort());
      const retuned = res.body.items.filter((m: { revision: number }) => m.revision === 2);
      expect(retuned).toHaveLength(2);
      for (const model of res.body.items) {
        expect(model.createdBy).toMatchObject({ email: expect.stringContaining('@') });
        expect(typeof model.design.gain).toBe('number');
        // the seeded gain must lie inside the exact stable range the engine reports for the loop
        const ranges = locus({ plant: model.plant }).stableGainRanges;
        expect(ranges.some((r) => model.design.gain > r.from && (r.to === null || model.design.gain < r.to))).toBe(true);
      }
      const history = await api().get(`/models/${retuned[0].id}/revisions`).expect(200);
      expect(history.body.items.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
      expect(history.body.items[0].comment).toMatch(/gain/i);
    });
  });

  describe('GET /models', () => {
    it('searches name and description, filters by tag, sorts and pages with a total count', async () => {
      const byText = await api().get('/models?q=HOIST').expect(200);
      expect(byText.body.items.map((m: { name: string }) => m.name)).toEqual(['Hoist 2 hook position (lead compensated)']);
      const byTag = await api().get('/models?tag=dead-time').expect(200);
      expect(byTag.body.total).toBe(2);
      expect(byTag.body.items.every((m: { tags: string[] }) => m.tags.includes('dead-time'))).toBe(true);
      const asc = (await api().get('/models?sort=name&order=asc&pageSize=200').expect(200)).body.items.map((m: { name: string }) => m.name);
      const desc = (await api().get('/models?sort=name&order=desc&pageSize=200').expect(200)).body.items.map((m: { name: string }) => m.name);
      expect(desc).toEqual([...asc].reverse());
      expect([...asc].sort((a: string, b: string) => a.toLowerCase().localeCompare(b.toLowerCase()))).toEqual(asc);
      const page2 = await api().get('/models?sort=name&pageSize=2&page=2').expect(200);
      expect(page2.body).toMatchObject({ page: 2, pageSize: 2 });
      expect(page2.body.items.map((m: { name: string }) => m.name)).toEqual(asc.slice(2, 4));
      expect(page2.body.total).toBe(asc.length);
    });

    it('sorts by the times too, newest first by default', async () => {
      const items = (await api().get('/models?pageSize=200').expect(200)).body.items as { updatedAt: string }[];
      expect(items.map((m) => m.updatedAt)).toEqual(items.map((m) => m.updatedAt).sort().reverse());
      const created = (await api().get('/models?sort=createdAt&order=asc&pageSize=200').expect(200)).body.items as { createdAt: string }[];
      expect(created.map((m) => m.createdAt)).toEqual(created.map((m) => m.createdAt).sort());
    });

    it('refuses a bad page size or sort with the query field at fault', async () => {
      const size = await api().get('/models?pageSize=0').expect(400);
      expect(size.body.errors[0].pointer).toBe('/query/pageSize');
      const sort = await api().get('/models?sort=colour').expect(400);
      expect(sort.body.errors[0].pointer).toBe('/query/sort');
    });
  });

  describe('POST /models', () => {
    it('creates revision 1 with an ETag, normalised tags, author, and stores exactly that', async () => {
      const res = await api().post('/models').send(NEW_MODEL).expect(201);
      const model = res.body;
      expect(res.headers['etag']).toBe(`"${model.id}-r1"`);
      expect(res.headers['location']).toBe(`/api/v1/models/${model.id}`);
      expect(model).toMatchObject({ name: NEW_MODEL.name, tags: ['web', 'tension'], plant: NEW_MODEL.plant, compensator: null, design: NEW_MODEL.design, revision: 1, deletedAt: null });
      expect(model.createdBy).toEqual(model.updatedBy);
      expect(model.createdBy.email).toMatch(/@/);
      const stored = await revisionsInDb(model.id);
      expect(stored).toEqual([{ revision: 1, comment: 'First cut', content_hash: expect.stringMatching(/^[0-9a-f]{64}$/) }]);
      const read = await api().get(`/models/${model.id}`).expect(200);
      expect(read.body).toEqual(model);
      expect(read.headers['etag']).toBe(`"${model.id}-r1"`);
    });

    it('refuses a plant the engine refuses, naming /plant/…, and stores nothing', async () => {
      const before = (await server.context.dataSource.query('SELECT COUNT(*) AS n FROM models'))[0].n;
      const res = await api().post('/models').send({ ...NEW_MODEL, plant: { numerator: [1, 2, 3], denominator: [1, 1] } }).expect(400);
      expect(res.body.errors).toEqual([{ pointer: '/plant/numerator', detail: expect.stringContaining('proper') }]);
      const after = (await server.context.dataSource.query('SELECT COUNT(*) AS n FROM models'))[0].n;
      expect(after).toBe(before);
    });

    it('lists every field at fault: name, tag, unpaired compensator zero, design targets', async () => {
      const res = await api()
        .post('/models')
        .send({ ...NEW_MODEL, name: '   ', tags: ['ok', 'Not OK!'], compensator: { zeros: [{ re: -1, im: 2 }], poles: [], gain: 1 } })
        .expect(400);
      const pointers = res.body.errors.map((e: { pointer: string }) => e.pointer);
      expect(pointers).toEqual(expect.arrayContaining(['/name', '/tags/1', '/compensator/zeros/0']));
      const targets = await api().post('/models').send({ ...NEW_MODEL, design: { gain: 1, targets: { minDampingRatio: 1.5 } } }).expect(400);
      expect(targets.body.errors).toEqual(expect.arrayContaining([{ pointer: '/design/targets/minDampingRatio', detail: expect.any(String) }]));
    });

    it('refuses a compensator that makes the loop improper', async () => {
      const res = await api().post('/models').send({ ...NEW_MODEL, plant: { expression: '1/(s+1)' }, compensator: { zeros: [{ re: -1 }, { re: -2 }], poles: [], gain: 1 } }).expect(400);
      expect(res.body.errors[0].pointer).toBe('/compensator');
    });

    it('is not open to viewers', async () => {
      await api(server.tokens.viewer).post('/models').send(NEW_MODEL).expect(403);
    });
  });

  describe('GET /models/{id}', () => {
    it('is a 404 problem for an unknown id', async () => {
      const res = await api().get('/models/00000000-0000-4000-8000-000000000000').expect(404);
      expect(res.headers['content-type']).toMatch(/problem\+json/);
    });
  });

  describe('PUT /models/{id}', () => {
    it('needs If-Match (428), refuses a stale one (412) without changing anything, and saves a new revision', async () => {
      const model = await create();
      const change = { ...NEW_MODEL, design: { gain: 2.2, targets: null }, comment: 'Gain raised after site test' };
      const missing = await api().put(`/models/${model.id}`).send(change).expect(428);
      expect(missing.headers['content-type']).toMatch(/problem\+json/);
      const saved = await api().put(`/models/${model.id}`).set('If-Match', `"${model.id}-r1"`).send(change).expect(200);
      expect(saved.headers['etag']).toBe(`"${model.id}-r2"`);
      expect(saved.body).toMatchObject({ revision: 2, design: { gain: 2.2 }, createdAt: model.createdAt });
      const stale = await api().put(`/models/${model.id}`).set('If-Match', `"${model.id}-r1"`).send({ ...change, name: 'Overwritten' }).expect(412);
      expect(stale.body.detail).toContain('revision 2');
      const now = await api().get(`/models/${model.id}`).expect(200);
      expect(now.body.name).toBe(NEW_MODEL.name);
      expect((await revisionsInDb(model.id)).map((r) => r.comment)).toEqual(['First cut', 'Gain raised after site test']);
    });

    it('validates the new content like a create', async () => {
      const model = await create();
      const res = await api().put(`/models/${model.id}`).set('If-Match', `"${model.id}-r1"`).send({ ...NEW_MODEL, plant: { expression: 's^2/(s+1)' } }).expect(400);
      expect(res.body.errors[0].pointer).toBe('/plant/expression');
      expect(await revisionsInDb(model.id)).toHaveLength(1);
    });

    it('lets exactly one of two concurrent saves with the same If-Match through, and loses no revision', async () => {
      const model = await create();
      const tag = `"${model.id}-r1"`;
      const [a, b] = await Promise.all([
        api().put(`/models/${model.id}`).set('If-Match', tag).send({ ...NEW_MODEL, name: 'Writer A', comment: 'A' }),
        api().put(`/models/${model.id}`).set('If-Match', tag).send({ ...NEW_MODEL, name: 'Writer B', comment: 'B' }),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 412]);
      const winner = a.status === 200 ? a : b;
      const stored = await revisionsInDb(model.id);
      expect(stored.map((r) => r.revision)).toEqual([1, 2]);
      expect(stored[1].comment).toBe(winner.body.name === 'Writer A' ? 'A' : 'B');
      const current = await api().get(`/models/${model.id}`).expect(200);
      expect(current.body.name).toBe(winner.body.name);
      expect(current.body.revision).toBe(2);
    });

    it('lets many concurrent writers with fresh ETags each take their own revision in turn', async () => {
      const model = await create();
      let etag = `"${model.id}-r1"`;
      for (let i = 0; i < 3; i++) {
        const res = await api().put(`/models/${model.id}`).set('If-Match', etag).send({ ...NEW_MODEL, comment: `step ${i}` }).expect(200);
        etag = res.headers['etag'];
      }
      expect((await revisionsInDb(model.id)).map((r) => r.revision)).toEqual([1, 2, 3, 4]);
    });
  });

  describe('DELETE, restore and revisions', () => {
    it('soft-deletes (hidden, not gone), refuses changes until restored, and restores', async () => {
      const model = await create({ name: 'Short-lived loop' });
      await api().delete(`/models/${model.id}`).expect(204);
      await api().get(`/models/${model.id}`).expect(404);
      expect((await api().get('/models?q=Short-lived').expect(200)).body.total).toBe(0);
      const withDeleted = await api().get('/models?q=Short-lived&includeDeleted=true').expect(200);
      expect(withDeleted.body.items[0].deletedAt).toEqual(expect.any(String));
      await api().put(`/models/${model.id}`).set('If-Match', `"${model.id}-r1"`).send(NEW_MODEL).expect(409);
      await api().delete(`/models/${model.id}`).expect(404);
      // a browser's cached live copy is not revalidated across the delete (no 304), nor the deleted copy across the restore
      const deleted = await api().get(`/models/${model.id}?includeDeleted=true`).set('If-None-Match', `"${model.id}-r1"`).expect(200);
      expect(deleted.headers['etag']).toBe(`"${model.id}-r1-deleted"`);
      expect(deleted.body.deletedAt).toEqual(expect.any(String));
      const restored = await api().post(`/models/${model.id}/restore`).expect(200);
      expect(restored.body.deletedAt).toBeNull();
      const live = await api().get(`/models/${model.id}`).set('If-None-Match', `"${model.id}-r1-deleted"`).expect(200);
      expect(live.headers['etag']).toBe(`"${model.id}-r1"`);
      await api().post(`/models/${model.id}/restore`).expect(409);
      expect(await revisionsInDb(model.id)).toHaveLength(1);
      const rows = await server.context.dataSource.query("SELECT action FROM audit_events WHERE target_id = ? ORDER BY id", [model.id]);
      expect(rows.map((r: { action: string }) => r.action)).toEqual(['model.created', 'model.deleted', 'model.restored']);
    });

    it('serves each revision’s own content, and 404 for a revision that does not exist', async () => {
      const model = await create();
      await api().put(`/models/${model.id}`).set('If-Match', `"${model.id}-r1"`).send({ ...NEW_MODEL, plant: { expression: '3/(s*(s+2))' }, comment: 'Simpler plant' }).expect(200);
      const first = await api().get(`/models/${model.id}/revisions/1`).expect(200);
      const second = await api().get(`/models/${model.id}/revisions/2`).expect(200);
      expect(first.body.plant).toEqual(NEW_MODEL.plant);
      expect(second.body).toMatchObject({ revision: 2, comment: 'Simpler plant', plant: { expression: '3/(s*(s+2))' }, author: { email: expect.any(String) } });
      expect(first.body.contentHash).not.toBe(second.body.contentHash);
      await api().get(`/models/${model.id}/revisions/3`).expect(404);
      await api().get(`/models/${model.id}/revisions/0`).expect(400);
      const list = await api().get(`/models/${model.id}/revisions`).expect(200);
      expect(list.body.items.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
    });
  });

  describe('GET /models/{id}/locus', () => {
    it('is the engine’s locus of the current loop, cached by content and recomputed after a change', async () => {
      const model = await create();
      const first = await api().get(`/models/${model.id}/locus`).expect(200);
      expect(first.headers['x-locus-cache']).toBe('miss');
      expect(first.body).toEqual(JSON.parse(JSON.stringify(locus({ plant: NEW_MODEL.plant }))));
      const again = await api().get(`/models/${model.id}/locus`).expect(200);
      expect(again.headers['x-locus-cache']).toBe('hit');
      expect(again.text).toBe(first.text);
      expect(again.headers['etag']).toBe(first.headers['etag']);

      const compensator = { zeros: [{ re: -3, im: 0 }], poles: [{ re: -20, im: 0 }], gain: 4 };
      const changed = { ...NEW_MODEL, plant: { expression: '1/((s+1)*(s+2))', deadTime: 0.1 }, compensator };
      await api().put(`/models/${model.id}`).set('If-Match', `"${model.id}-r1"`).send(changed).expect(200);
      const after = await api().get(`/models/${model.id}/locus`).expect(200);
      expect(after.headers['x-locus-cache']).toBe('miss');
      expect(after.body).toEqual(JSON.parse(JSON.stringify(loopLocus({ plant: changed.plant, compensator }))));
      expect(after.body.warnings.map((w: { code: string }) => w.code)).toContain('dead-time-approximated');
      expect(after.body.normalizedPlant.denominator).toHaveLength(1 + 2 + 1 + 3); // plant, compensator pole, Padé order 3
    });

    it('answers If-None-Match with the current ETag by 304 without a body, and a stale one with the new result', async () => {
      const model = await create();
      const first = await api().get(`/models/${model.id}/locus`).expect(200);
      const etag = first.headers['etag'] as string;
      expect(etag).toMatch(/^"[0-9a-f]{64}"$/);
      const same = await api().get(`/models/${model.id}/locus`).set('If-None-Match', etag).expect(304);
      expect(same.text).toBe('');
      expect(same.headers['etag']).toBe(etag);
      await api().put(`/models/${model.id}`).set('If-Match', `"${model.id}-r1"`).send({ ...NEW_MODEL, plant: { expression: '2/((s+1)*(s+4))' } }).expect(200);
      const stale = await api().get(`/models/${model.id}/locus`).set('If-None-Match', etag).expect(200);
      expect(stale.headers['etag']).not.toBe(etag);
      expect(stale.body.normalizedPlant.denominator).toHaveLength(3);
    });

    it('is readable with an embed token for its model only, from its origin', async () => {
      const mine = await create();
      const other = await create();
      const origin = 'https://dashboards.quillfield.example';
      const issued = await api().post('/embed-tokens').send({ modelIds: [mine.id], origins: [origin], ttlSeconds: 600 }).expect(201);
      const embed = (path: string) => request(server.baseUrl).get(`/api/v1${path}`).set('Authorization', `Bearer ${issued.body.token}`).set('Origin', origin);
      const ok = await embed(`/models/${mine.id}/locus`).expect(200);
      expect(ok.body.caution).toEqual(expect.any(String));
      await embed(`/models/${mine.id}`).expect(200);
      await embed(`/models/${other.id}/locus`).expect(403);
      await embed('/models').expect(403);
    });

    it('is a 404 for a deleted model', async () => {
      const model = await create();
      await api().delete(`/models/${model.id}`).expect(204);
      await api().get(`/models/${model.id}/locus`).expect(404);
    });

    it('follows a delete, a restore and a change at once although it was just served from memory', async () => {
      const model = await create();
      const first = await api().get(`/models/${model.id}/locus`).expect(200);
      await api().get(`/models/${model.id}/locus`).expect(200);
      await api().delete(`/models/${model.id}`).expect(204);
      await api().get(`/models/${model.id}/locus`).expect(404);
      await api().post(`/models/${model.id}/restore`).expect(200);
      const back = await api().get(`/models/${model.id}/locus`).expect(200);
      expect(back.headers['etag']).toBe(first.headers['etag']);
      await api().put(`/models/${model.id}`).set('If-Match', `"${model.id}-r1"`).send({ ...NEW_MODEL, plant: { expression: '3/((s+2)*(s+5))' } }).expect(200);
      const changed = await api().get(`/models/${model.id}/locus`).expect(200);
      expect(changed.headers['etag']).not.toBe(first.headers['etag']);
      expect(changed.headers['x-locus-cache']).toBe('miss');
    });
  });
});
