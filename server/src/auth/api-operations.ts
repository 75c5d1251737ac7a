import type { OpenAPIV3_1 } from 'openapi-types';
import { isRequirement, type Requirement } from './permissions.js';

/** The OpenAPI extension on each operation naming what it requires. */
export const PERMISSION_EXTENSION = 'x-polewright-permission';

const METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options', 'trace'] as const;

/** One operation of the document, as the authorisation step sees it. */
export interface ApiOperation {
  readonly operationId: string;
  /** Upper case, as in `req.method`. */
  readonly method: string;
  /** The document's path key (`/v1/models/{id}`). */
  readonly path: string;
  readonly requirement: Requirement;
  /** The full request path split at `/`: a string is a literal (lower case), `{ param }` a template. */
  readonly segments: readonly (string | { readonly param: string })[];
}

/** A request matched to its operation, with the path parameters decoded. */
export interface OperationMatch {
  readonly operation: ApiOperation;
  readonly params: Readonly<Record<string, string>>;
}

/** The operations of a document by method, most specific path first. */
export interface OperationTable {
  readonly operations: readonly ApiOperation[];
  readonly byMethod: ReadonlyMap<string, readonly ApiOperation[]>;
}

function segmentsOf(fullPath: string): ApiOperation['segments'] {
  return fullPath.split('/').map((part) => {
    const template = /^\{([^}]+)\}$/.exec(part);
    return template ? { param: template[1] as string } : part.toLowerCase();
  });
}

// OpenAPI: a concrete path wins over a templated one (`/models/export` before `/models/{id}`); the first
// segment where two paths differ decides, as the feature routers list their literal routes first. Paths of
// different lengths never match the same request; ordering by length first keeps the comparison total.
function bySpecificity(a: ApiOperation, b: ApiOperation): number {
  if (a.segments.length !== b.segments.length) return a.segments.length - b.segments.length;
  for (let i = 0; i < a.segments.length; i++) {
    const literalA = typeof a.segments[i] === 'string';
    const literalB = typeof b.segments[i] === 'string';
    if (literalA !== literalB) return literalA ? -1 : 1;
  }
  return 0;
}

/**
 * Reads every operation of the bundled document with its `x-polewright-permission`, under the first
 * server's URL (`/api`). Throws, naming the operation, when one lacks the extension or has an unknown value,
 * so a document that does not say what an operation needs never serves it.
 */
export function operationTable(document: OpenAPIV3_1.Document): OperationTable {
  const base = (document.servers?.[0]?.url ?? '').replace(/\/+$/, '');
  const operations: ApiOperation[] = [];
  for (const [path, item] of Object.entries(document.paths ?? {})) {
    for (const method of METHODS) {
      const operation = (item as Record<string, (OpenAPIV3_1.OperationObject & Record<string, unknown>) | undefined>)[method];
      if (!operation) continue;
      const operationId = operation.operationId ?? `${method.toUpperCase()} ${path}`;
      const requirement = operation[PERMISSION_EXTENSION];
      if (!isRequirement(requirement)) throw new Error(`OpenAPI operation ${operationId} needs ${PERMISSION_EXTENSION} (one of models:read, models:write, compute, admin, session, public); it has ${JSON.stringify(requirement)}.`);
      operations.push({ operationId, method: method.toUpperCase(), path, requirement, segments: segmentsOf(base + path) });
    }
  }
  const byMethod = new Map<string, ApiOperation[]>();
  for (const operation of operations) byMethod.set(operation.method, [...(byMethod.get(operation.method) ?? []), operation]);
  for (const list of byMethod.values()) list.sort(bySpecificity);
  return { operations, byMethod };
}

function decoded(part: string): string | null {
  try {
    return decodeURIComponent(part);
  } catch {
    return null;
  }
}

function matchSegments(operation: ApiOperation, parts: readonly string[]): OperationMatch | null {
  if (operation.segments.length !== parts.length) return null;
  const params: Record<string, string> = {};
  for (let i = 0; i < parts.length; i++) {
    const want = operation.segments[i] as ApiOperation['segments'][number];
    const part = parts[i] as string;
    if (typeof want === 'string') {
      if (part.toLowerCase() !== want) return null;
    } else {
      const value = part === '' ? null : decoded(part);
      if (value === null) return null;
      params[want.param] = value;
    }
  }
  return { operation, params };
}

/**
 * The operation a request is, matched like the Express routers match it: literal segments without regard
 * to case, one trailing slash allowed, each `{param}` one non-empty segment (URL-decoded); HEAD falls back
 * to GET. Null when no operation has this method and path (the validator then answers 404 or 405).
 */
export function matchOperation(table: OperationTable, method: string, path: string): OperationMatch | null {
  const parts = (path.length > 1 && path.endsWith('/') ? path.slice(0, -1) : path).split('/');
  const methods = method === 'HEAD' ? ['HEAD', 'GET'] : [method];
  for (const m of methods) {
    for (const operation of table.byMethod.get(m) ?? []) {
      const match = matchSegments(operation, parts);
      if (match) return match;
    }
  }
  return null;
}
