import type { Request, RequestHandler } from 'express';
import type { OpenAPIV3_1 } from 'openapi-types';
import { RouteNotFoundError } from '../http/problem.js';
import { type ApiOperation, matchOperation, type OperationTable, operationTable } from './api-operations.js';
import { refusal } from './authorize.js';

const authorized = new WeakMap<Request, ApiOperation>();

/**
 * Authorisation before validation: matches the request to its operation in the OpenAPI document and
 * applies that operation's `x-polewright-permission` with `refusal()` (roles, API-key scopes, embed tokens
 * only on GET/HEAD of a model they are bound to), so a caller who may not use an operation gets 401/403
 * before its body is parsed or validated, never a 400 listing the fields of a route it cannot call.
 *
 * Why match here rather than reuse the validator's match: express-openapi-validator matches and
 * validates in one middleware, so its match is only known after the body has been judged. The document's
 * paths are turned into segment patterns once (api-operations.ts), matched as Express matches the feature
 * routers; a request no operation matches goes on unauthorised to the validator, which answers 404/405,
 * and `requireAuthorizedOperation` keeps any such request from reaching a router.
 */
export function authorizeOperation(document: Promise<OpenAPIV3_1.Document>): RequestHandler {
  let table: OperationTable | undefined;
  let failure: unknown;
  const ready = document
    .then((doc) => {
      table = operationTable(doc);
    })
    .catch((error: unknown) => {
      failure = error;
    });
  const decide = (req: Request, next: (error?: unknown) => void, operations: OperationTable) => {
    const match = matchOperation(operations, req.method, req.originalUrl.split('?')[0] ?? '/');
    if (!match) return next();
    const refused = refusal(req.principal, match.operation.requirement, { method: req.method, id: match.params['id'] });
    if (refused) return next(refused);
    authorized.set(req, match.operation);
    next();
  };
  return (req, _res, next) => {
    // the bundled document is read once; requests before it is ready wait for it (fail closed on an error)
    if (table) return decide(req, next, table);
    void ready.then(() => (table ? decide(req, next, table) : next(failure)));
  };
}

/** The operation `authorizeOperation` let this request through for, if any. */
export function authorizedOperation(req: Request): ApiOperation | undefined {
  return authorized.get(req);
}

/**
 * Second line in front of the feature routers: a request that `authorizeOperation` did not match to an
 * operation and authorise never reaches a handler (404 no such route), whatever the validator made of it.
 */
export function requireAuthorizedOperation(): RequestHandler {
  return (req, _res, next) => {
    if (authorized.has(req)) return next();
    next(new RouteNotFoundError(req.method, req.originalUrl.split('?')[0] ?? '/'));
  };
}
