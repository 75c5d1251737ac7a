import type { OpenAPIV3_1 } from 'openapi-types';
import { describe, expect, it } from 'vitest';
import { matchOperation, operationTable } from './api-operations.js';

const ok = { '200': { description: 'ok' } };

/** A small document; the templated path is listed before the literal one on purpose. */
function documentWith(extra: Record<string, unknown> = {}): OpenAPIV3_1.Document {
  return {
    openapi: '3.1.0',
    info: { title: 'probe', version: '1' },
    servers: [{ url: '/api' }],
    paths: {
      '/v1/things/{id}': {
        get: { operationId: 'getThing', 'x-polewright-permission': 'models:read', responses: ok },
        put: { operationId: 'putThing', 'x-polewright-permission': 'models:write', responses: ok },
      },
      '/v1/things/export': { get: { operationId: 'exportThings', 'x-polewright-permission': 'admin', responses: ok } },
      '/v1/things/{id}/parts/{part}': { get: { operationId: 'getPart', 'x-polewright-permission': 'models:read', responses: ok } },
      '/health': { get: { operationId: 'health', security: [], 'x-polewright-permission': 'public', responses: ok } },
      ...extra,
    },
  } as unknown as OpenAPIV3_1.Document;
}

describe('matching a request to its operation', () => {
  const table = operationTable(documentWith());
  const idOf = (method: string, path: string) => matchOperation(table, method, path)?.operation.operationId ?? null;

  it('puts the server URL in front of every path and binds the path parameters', () => {
    const match = matchOperation(table, 'GET', '/api/v1/things/t-1/parts/7');
    expect(match?.operation.operationId).toBe('getPart');
    expect(match?.params).toEqual({ id: 't-1', part: '7' });
    expect(idOf('GET', '/v1/things/t-1')).toBeNull();
  });

  it('prefers a literal segment over a template, whatever the order in the document', () => {
    expect(idOf('GET', '/api/v1/things/export')).toBe('exportThings');
    expect(idOf('GET', '/api/v1/things/other')).toBe('getThing');
    // no PUT on the literal path: the templated operation with that method is the one Express would run
    expect(idOf('PUT', '/api/v1/things/export')).toBe('putThing');
  });

  it('matches like the Express routers: any case in literals, one trailing slash, HEAD as GET', () => {
    expect(idOf('GET', '/API/V1/Things/abc')).toBe('getThing');
    expect(matchOperation(table, 'GET', '/api/v1/things/AbC')?.params).toEqual({ id: 'AbC' });
    expect(idOf('GET', '/api/v1/things/abc/')).toBe('getThing');
    expect(idOf('HEAD', '/api/v1/things/abc')).toBe('getThing');
    expect(idOf('GET', '/api/health')).toBe('health');
  });

  it('decodes parameters and matches nothing for an empty or undecodable one', () => {
    expect(matchOperation(table, 'GET', '/api/v1/things/a%20b')?.params).toEqual({ id: 'a b' });
    expect(idOf('GET', '/api/v1/things/%E0%A4%A')).toBeNull();
    expect(idOf('GET', '/api/v1/things//parts/1')).toBeNull();
  });

  it('matches nothing for an unknown path or a method the path does not have', () => {
    expect(idOf('GET', '/api/v1/thingz/abc')).toBeNull();
    expect(idOf('DELETE', '/api/v1/things/abc')).toBeNull();
    expect(idOf('POST', '/api/health')).toBeNull();
  });

  it('refuses a document whose operation does not say what it needs, naming the operation', () => {
    expect(() => operationTable(documentWith({ '/v1/loose': { get: { operationId: 'loose', responses: ok } } }))).toThrow(/loose needs x-polewright-permission/);
    expect(() => operationTable(documentWith({ '/v1/odd': { post: { operationId: 'odd', 'x-polewright-permission': 'models:delete', responses: ok } } }))).toThrow(/odd needs x-polewright-permission/);
  });
});
