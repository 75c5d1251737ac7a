import type { RequestHandler } from 'express';
import { ForbiddenError, UnauthorizedError } from '../http/problem.js';
import type { Permission, Requirement } from './permissions.js';
import type { Principal } from './principal.js';

/** Whether the caller may read this model: everyone with `models:read`, embed tokens only their own models. */
export function canReadModel(principal: Principal, modelId: string): boolean {
  if (!principal.scopes.has('models:read')) return false;
  return principal.kind !== 'embed' || (principal.modelIds ?? []).includes(modelId);
}

/** The request facts the rules look at besides the caller: its method and the bound `{id}`, if any. */
export interface AccessTarget {
  readonly method: string;
  readonly id: string | undefined;
}

function sessionRefusal(principal: Principal | undefined): Error | null {
  if (!principal) return new UnauthorizedError();
  return principal.kind === 'session' ? null : new ForbiddenError('Only a signed-in session can do this (not an API key or embed token).');
}

/** The caller as a signed-in session, or throws the 401/403 error (API keys and embed tokens are not people). */
export function requireSession(principal: Principal | undefined): Principal {
  const error = sessionRefusal(principal);
  if (error) throw error;
  return principal as Principal;
}

/**
 * The one place roles and scopes are enforced: the 401/403 error refusing `principal` what `requirement`
 * asks for on `target`, or null when it may go ahead. `public` lets everyone through; `session` needs a
 * signed-in person; a permission needs the role or scope. Embed tokens pass only `models:read` on GET/HEAD
 * operations whose `{id}` is one of their models (so never the model list, the export or any write).
 * The embed token's origin is checked when the token is resolved (resolve-token.ts), before this.
 */
export function refusal(principal: Principal | undefined, requirement: Requirement, target: AccessTarget): Error | null {
  if (requirement === 'public') return null;
  if (!principal) return new UnauthorizedError();
  if (requirement === 'session') return sessionRefusal(principal);
  if (!principal.scopes.has(requirement)) {
    return new ForbiddenError(principal.kind === 'session' ? `The ${principal.role} role does not allow this (needs ${requirement}).` : `This token lacks the ${requirement} scope.`);
  }
  if (principal.kind === 'embed') {
    const readOnly = target.method === 'GET' || target.method === 'HEAD';
    if (!readOnly || typeof target.id !== 'string' || !canReadModel(principal, target.id)) return new ForbiddenError('An embed token may only read the models it was issued for.');
  }
  return null;
}

const enforced = new WeakMap<RequestHandler, Permission>();

/**
 * Route middleware applying `refusal` for `permission` with the route's `:id`. The routers no longer
 * call it: `authorizeOperation` (authorize-operation.ts) applies the document's `x-polewright-permission`
 * before validation. A router that adds it back as a second line must ask for the same permission as the
 * document (tests/contract/operation-permissions.spec.ts checks with `enforcedPermission`).
 */
export function authorize(permission: Permission): RequestHandler {
  const handler: RequestHandler = (req, _res, next) => {
    const id = req.params['id'];
    next(refusal(req.principal, permission, { method: req.method, id: typeof id === 'string' ? id : undefined }) ?? undefined);
  };
  enforced.set(handler, permission);
  return handler;
}

/** The permission a route handler made by `authorize()` enforces (undefined for any other handler). */
export function enforcedPermission(handler: unknown): Permission | undefined {
  return typeof handler === 'function' ? enforced.get(handler as RequestHandler) : undefined;
}
