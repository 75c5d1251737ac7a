/*
 * Who may call each operation is said once, in the document: every operation carries
 * `x-polewright-permission`, `public` exactly where `security: []` says no token is needed, the middleware
 * that applies it (server/src/auth/authorize-operation.ts) resolves each documented path to that very
 * operation, and no router enforces a permission of its own that differs from the document's.
 */
import express, { type Express, Router } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/src/app.js';
import { matchOperation, operationTable, PERMISSION_EXTENSION } from '../../server/src/auth/api-operations.js';
import { authorize, enforcedPermission } from '../../server/src/auth/authorize.js';
import { REQUIREMENTS } from '../../server/src/auth/permissions.js';
import { loadApiDocument } from '../../server/src/openapi/api-document.js';
import { startTestServer, type TestServer } from '../../server/src/testing/test-server.js';

const METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options', 'trace'] as const;

interface Operation {
  operationId: string;
  method: string;
  path: string;
  permission: unknown;
  security: unknown;
}

interface Layer {
  rawPath?: string;
  route?: { path: unknown; stack: { method?: string; handle: unknown }[] };
  handle: { stack?: Layer[] };
}

/** Every `authorize(...)` left in a route of the app, as "METHOD /document/path" → permission. */
function routerPermissions(app: Express): Map<string, string> {
  const found = new Map<string, string>();
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        if (typeof layer.route.path !== 'string') continue;
        const path = (prefix + layer.route.path).replace(/^\/api/, '').replace(/:(\w+)/g, '{$1}');
        for (const step of layer.route.stack) {
          const permission = enforcedPermission(step.handle);
          if (permission && step.method) found.set(`${step.method.toUpperCase()} ${path}`, permission);
        }
      } else if (layer.handle.stack) {
        walk(layer.handle.stack, prefix + (layer.rawPath && layer.rawPath !== '/' ? layer.rawPath : ''));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return found;
}

describe('each operation says once who may call it', () => {
  let server: TestServer;
  let operations: Operation[];
  beforeAll(async () => {
    server = await startTestServer();
    const doc = await loadApiDocument(server.config.openapiPath);
    operations = Object.entries(doc.paths ?? {}).flatMap(([path, item]) =>
      METHODS.flatMap((m) => {
        const op = (item as Record<string, Record<string, unknown> | undefined>)[m];
        return op ? [{ operationId: String(op['operationId']), method: m.toUpperCase(), path, permission: op[PERMISSION_EXTENSION], security: op['security'] }] : [];
      }),
    );
  });
  afterAll(() => server.close());

  it('every operation has x-polewright-permission with a known value', () => {
    expect(operations.length).toBeGreaterThan(0);
    const missing = operations.filter((o) => !(REQUIREMENTS as readonly unknown[]).includes(o.permission)).map((o) => `${o.operationId}: ${JSON.stringify(o.permission)}`);
    expect(missing).toEqual([]);
  });

  it('is public exactly where the document needs no token (security: [])', () => {
    for (const o of operations) {
      const open = Array.isArray(o.security) && o.security.length === 0;
      expect(o.permission === 'public', `${o.operationId}: ${String(o.permission)}, security ${JSON.stringify(o.security)}`).toBe(open);
    }
  });

  it('the middleware resolves every documented path to its own operation (literal paths before templates)', async () => {
    const table = operationTable(await loadApiDocument(server.config.openapiPath));
    for (const o of operations) {
      const concrete = '/api' + o.path.replace(/\{[^}]+\}/g, 'probe-1');
      const match = matchOperation(table, o.method, concrete);
      expect(match?.operation.operationId, `${o.method} ${concrete}`).toBe(o.operationId);
      expect(match?.operation.requirement).toBe(o.permission);
    }
  });

  it('no router enforces a permission other than the one the document declares', () => {
    // the walk does see an authorize() left in a router (the routers of this app no longer carry any)
    const probe = express();
    const inner = Router();
    inner.put('/models/:id', authorize('models:read'), (_req, res) => res.end());
    probe.use('/api/v1', inner);
    expect([...routerPermissions(probe)]).toEqual([['PUT /v1/models/{id}', 'models:read']]);

    const declared = new Map(operations.map((o) => [`${o.method} ${o.path}`, o.permission]));
    for (const [route, permission] of routerPermissions(createApp(server.context))) {
      expect(declared.get(route), route).toBe(permission);
    }
  });
});
