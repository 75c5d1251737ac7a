import { recordAudit } from '../audit/audit.service.js';
import { findApiKeyByHash, updateApiKey } from '../api-keys/api-keys.repository.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { findEmbedTokenByHash } from '../embed-tokens/embed-tokens.repository.js';
import { ForbiddenError, UnauthorizedError } from '../http/problem.js';
import { findSessionByHash } from '../sessions/sessions.repository.js';
import { findUserById } from '../users/users.repository.js';
import { ROLE_PERMISSIONS, type Permission } from './permissions.js';
import type { Principal } from './principal.js';
import { hashToken, kindOf } from './tokens.js';

/** Last-used times (and `api-key.used` audit events) are written at most this often per key. */
const USE_RECORD_INTERVAL_MS = 60_000;

async function activeUser(context: AppContext, userId: string) {
  const user = await findUserById(context, userId);
  return user && user.status === 'active' ? user : null;
}

/**
 * Resolves a bearer token of any kind to the caller, or throws UnauthorizedError (malformed, unknown,
 * expired, revoked, user inactive) or ForbiddenError (embed token used from an origin it is not bound to).
 */
export async function resolveToken(context: AppContext, token: string, origin: string | undefined): Promise<Principal> {
  const kind = kindOf(token);
  if (kind === null || kind === 'invitation') throw new UnauthorizedError('The bearer token is malformed.');
  const hash = hashToken(token);
  const at = now(context);
  const iso = at.toISOString();

  if (kind === 'session') {
    const session = await findSessionByHash(context, hash);
    if (!session) throw new UnauthorizedError('The session token is not known.');
    if (session.revokedAt) throw new UnauthorizedError('The session has been signed out.');
    if (session.expiresAt <= iso) throw new UnauthorizedError('The session has expired; sign in again.');
    const user = await activeUser(context, session.userId);
    if (!user) throw new UnauthorizedError('The account of this session is not active.');
    return { kind, userId: user.id, role: user.role, scopes: new Set(ROLE_PERMISSIONS[user.role]), modelIds: null, origins: null, tokenId: session.id };
  }

  if (kind === 'api-key') {
    const key = await findApiKeyByHash(context, hash);
    if (!key) throw new UnauthorizedError('The API key is not known.');
    if (key.revokedAt) throw new UnauthorizedError('The API key has been revoked.');
    if (key.expiresAt && key.expiresAt <= iso) throw new UnauthorizedError('The API key has expired.');
    if (!(await activeUser(context, key.createdBy))) throw new UnauthorizedError('The admin who issued this API key is no longer active.');
    if (!key.lastUsedAt || at.getTime() - Date.parse(key.lastUsedAt) >= USE_RECORD_INTERVAL_MS) {
      await inTransaction(context.dataSource, async (manager) => {
        await updateApiKey(context, key.id, { lastUsedAt: iso }, manager);
        await recordAudit(context, { action: 'api-key.used', actorId: key.createdBy, targetType: 'api-key', targetId: key.id }, manager);
      });
    }
    return { kind, userId: key.createdBy, role: null, scopes: new Set<Permission>(key.scopes), modelIds: null, origins: null, tokenId: key.id };
  }

  const embed = await findEmbedTokenByHash(context, hash);
  if (!embed) throw new UnauthorizedError('The embed token is not known.');
  if (embed.expiresAt <= iso) throw new UnauthorizedError('The embed token has expired.');
  if (!origin || !embed.origins.includes(origin)) {
    throw new ForbiddenError(origin ? `This embed token is not valid on pages from ${origin}.` : 'An embed token works only from a browser page of one of its origins (Origin header).');
  }
  return { kind, userId: embed.createdBy, role: null, scopes: new Set<Permission>(['models:read']), modelIds: [...embed.modelIds], origins: [...embed.origins], tokenId: embed.id };
}
