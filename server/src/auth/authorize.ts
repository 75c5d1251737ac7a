import type { RequestHandler } from 'express';
import { ForbiddenError, UnauthorizedError } from '../http/problem.js';
import type { Permission } from './permissions.js';
import type { Principal } from './principal.js';

/** Whether the caller may read this model: everyone with `models:read`, embed tokens only their own models. */
export function canReadModel(principal: Principal, modelId: string): boolean {
  if (!principal.scopes.has('models:read')) return false;
  return principal.kind !== 'embed' || (principal.modelIds ?? []).includes(modelId);
}

/**
 * Route middleware: the one place roles and scopes are enforced. 401 without a principal, 403 when its
 * role or scopes lack `permission`. Embed tokens pass only `models:read` on GET/HEAD routes whose `:id`
 * is one of their models (so never the model list, the export or any write).
 */
export function authorize(permission: Permission): RequestHandler {
  return (req, _res, next) => {
    const principal = req.principal;
    if (!principal) return next(new UnauthorizedError());
    if (!principal.scopes.has(permission)) {
      return next(new ForbiddenError(principal.kind === 'session' ? `The ${principal.role} role does not allow this (needs ${permission}).` : `This token lacks the ${permission} scope.`));
    }
    if (principal.kind === 'embed') {
      const id = req.params['id'];
      const readOnly = req.method === 'GET' || req.method === 'HEAD';
      if (!readOnly || typeof id !== 'string' || !canReadModel(principal, id)) return next(new ForbiddenError('An embed token may only read the models it was issued for.'));
    }
    next();
  };
}
