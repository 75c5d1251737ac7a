import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../testing/test-server.js';

const PAGE = 'https://intranet.quillfield.example';
const FOREIGN = 'https://elsewhere.example';

// Browsers send no Origin on a same-origin GET, only Sec-Fetch-Site: same-origin (a header pages cannot
// set), or, on plain HTTP off localhost where they send no fetch metadata, at most a Referer. An embed token
// on a page of the server itself is checked against the server's own origin then.
describe('the origin an embed token is checked against', () => {
  let server: TestServer;
  let model: string;
  beforeAll(async () => {
    server = await startTestServer();
    model = ((await server.context.dataSource.query('SELECT id FROM models WHERE deleted_at IS NULL ORDER BY name LIMIT 1')) as { id: string }[])[0]?.id as string;
  });
  afterAll(() => server.close());

  const issue = async (origins: string[]): Promise<string> => {
    const res = await request(server.baseUrl).post('/api/v1/embed-tokens').auth(server.tokens.engineer, { type: 'bearer' }).send({ modelIds: [model], origins, ttlSeconds: 600 });
    expect(res.status).toBe(201);
    return res.body.token as string;
  };
  const read = (token: string, headers: Record<string, string>) => {
    let test = request(server.baseUrl).get(`/api/v1/models/${model}`).auth(token, { type: 'bearer' });
    for (const [name, value] of Object.entries(headers)) test = test.set(name, value);
    return test;
  };

  it("accepts a same-origin request without Origin when the token lists the server's own origin", async () => {
    const token = await issue([PAGE, server.baseUrl]);
    const res = await read(token, { 'Sec-Fetch-Site': 'same-origin' });
    expect(res.status).toBe(200);
    expect(res.body.id).toBe(model);
    // nothing cross-origin to allow: no CORS answer
    expect(res.headers['access-control-allow-origin']).toBeUndefined();
    // the same page sending its Origin (as browsers do on other methods) is accepted alike
    expect((await read(token, { Origin: server.baseUrl })).status).toBe(200);
  });

  it("refuses the same-origin request when the token does not list the server's origin", async () => {
    const token = await issue([PAGE]);
    const res = await read(token, { 'Sec-Fetch-Site': 'same-origin' });
    expect(res.status).toBe(403);
    expect(res.body.detail).toBe(`This embed token is not valid on pages from ${server.baseUrl}.`);
    // the server's origin is the Host the request names: another host is another origin
    expect((await read(await issue([server.baseUrl]), { 'Sec-Fetch-Site': 'same-origin', Host: 'polewright.other.example:4300' })).status).toBe(403);
  });

  it('still refuses a request with neither Origin nor a same-origin Sec-Fetch-Site (nor a Referer)', async () => {
    const token = await issue([server.baseUrl]);
    const bare = await read(token, {});
    expect(bare.status).toBe(403);
    expect(bare.body.detail).toMatch(/Origin header, or Sec-Fetch-Site: same-origin/);
    for (const site of ['none', 'same-site', 'cross-site']) expect((await read(token, { 'Sec-Fetch-Site': site })).status).toBe(403);
  });

  it("takes a Referer on the server's own origin as same-origin only where the browser sent no Sec-Fetch-Site", async () => {
    const token = await issue([server.baseUrl]);
    const page = `${server.baseUrl}/embed-demo/`;
    expect((await read(token, { Referer: page })).status).toBe(200);
    expect((await read(await issue([PAGE]), { Referer: page })).status).toBe(403);
    expect((await read(token, { Referer: `${FOREIGN}/embed-demo/` })).status).toBe(403);
    expect((await read(token, { Referer: 'not a url' })).status).toBe(403);
    // fetch metadata, when present, is what the browser says: a cross-site request is not made same-origin by its Referer
    expect((await read(token, { Referer: page, 'Sec-Fetch-Site': 'cross-site' })).status).toBe(403);
  });

  it('still refuses a foreign Origin, whatever Sec-Fetch-Site says', async () => {
    const token = await issue([server.baseUrl]);
    const res = await read(token, { Origin: FOREIGN, 'Sec-Fetch-Site': 'same-origin' });
    expect(res.status).toBe(403);
    expect(res.body.detail).toBe(`This embed token is not valid on pages from ${FOREIGN}.`);
  });
});
