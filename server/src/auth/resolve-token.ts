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
import { type CachedToken, tokenCacheOf } from './token-cache.js';
import { hashToken, kindOf } from './tokens.js';

/** Last-used times (and `api-key.used` audit events) are written at most this often per key. */
const USE_RECORD_INTERVAL_MS = 60_000;

async function activeUser(context: AppContext, userId: string) {
  const user = await findUserById(context, userId);
  return user && user.status === 'active' ? user : null;
}

/** The token row and user checks, read from the database: what the cache keeps (see token-cache.ts). */
async function lookUp(context: AppContext, kind: 'session' | 'api-key' | 'embed', hash: string): Promise<Omit<CachedToken, 'staleAt'>> {
  if (kind === 'session') {
    const session = await findSessionByHash(context, hash);
    if (!session) throw new UnauthorizedError('The session token is not known.');
    if (session.revokedAt) throw new UnauthorizedError('The session has been signed out.');
    const user = await activeUser(context, session.userId);
    if (!user) throw new UnauthorizedError('The account of this session is not active.');
    const principal: Principal = { kind, userId: user.id, role: user.role, scopes: new Set(ROLE_PERMISSIONS[user.role]), modelIds: null, origins: null, tokenId: session.id };
    return { principal, expiresAt: session.expiresAt };
  }
  if (kind === 'api-key') {
    const key = await findApiKeyByHash(context, hash);
    if (!key) throw new UnauthorizedError('The API key is not known.');
    if (key.revokedAt) throw new UnauthorizedError('The API key has been revoked.');
    if (!(await activeUser(context, key.createdBy))) throw new UnauthorizedError('The admin who issued this API key is no longer active.');
    const principal: Principal = { kind, userId: key.createdBy, role: null, scopes: new Set<Permission>(key.scopes), modelIds: null, origins: null, tokenId: key.id };
    return { principal, expiresAt: key.expiresAt, lastUsedAt: key.lastUsedAt };
  }
  const embed = await findEmbedTokenByHash(context, hash);
  if (!embed) throw new UnauthorizedError('The embed token is not known.');
  const principal: Principal = { kind, userId: embed.createdBy, role: null, scopes: new Set<Permission>(['models:read']), modelIds: [...embed.modelIds], origins: [...embed.origins], tokenId: embed.id };
  return { principal, expiresAt: embed.expiresAt };
}

const EXPIRED: Record<Principal['kind'], string> = {
  session: 'The session has expired; sign in again.',
  'api-key': 'The API key has expired.',
  embed: 'The embed token has expired.',
};

/**
 * Resolves a bearer token of any kind to the caller, or throws UnauthorizedError (malformed, unknown,
 * expired, revoked, user inactive) or ForbiddenError (embed token used from an origin it is not bound to).
 * Resolutions are reused for a few seconds (token-cache.ts); expiry and origin are checked on every call.
 */
export async function resolveToken(context: AppContext, token: string, origin: string | undefined): Promise<Principal> {
  const kind = kindOf(token);
  if (kind === null || kind === 'invitation') throw new UnauthorizedError('The bearer token is malformed.');
  const hash = hashToken(token);
  const at = now(context);
  const iso = at.toISOString();
  const cache = tokenCacheOf(context);
  let entry: Omit<CachedToken, 'staleAt'> | undefined = cache.get(hash, at.getTime());
  if (!entry) {
    const generation = cache.generation;
    entry = await lookUp(context, kind, hash);
    cache.set(hash, entry, at.getTime(), generation);
    entry = cache.get(hash, at.getTime()) ?? entry;
  }
  const { principal } = entry;
  // the clock decides on every request, cached or not
  if (entry.expiresAt !== null && entry.expiresAt <= iso) {
    cache.delete(hash);
    throw new UnauthorizedError(EXPIRED[principal.kind]);
  }
  if (principal.kind === 'embed' && (!origin || !(principal.origins ?? []).includes(origin))) {
    throw new ForbiddenError(origin ? `This embed token is not valid on pages from ${origin}.` : 'An embed token works only from a browser page of one of its origins (Origin header, or Sec-Fetch-Site: same-origin on a page of this server).');
  }
  if (principal.kind === 'api-key') await recordKeyUse(context, entry, at);
  return principal;
}

/** Writes the key's last-used time and an `api-key.used` event, at most once per USE_RECORD_INTERVAL_MS. */
async function recordKeyUse(context: AppContext, entry: Omit<CachedToken, 'staleAt'>, at: Date): Promise<void> {
  const last = entry.lastUsedAt;
  if (last && at.getTime() - Date.parse(last) < USE_RECORD_INTERVAL_MS) return;
  const iso = at.toISOString();
  // mark first, so concurrent requests on the same cached entry do not all write
  entry.lastUsedAt = iso;
  const { tokenId, userId } = entry.principal;
  await inTransaction(context.dataSource, async (manager) => {
    await updateApiKey(context, tokenId, { lastUsedAt: iso }, manager);
    await recordAudit(context, { action: 'api-key.used', actorId: userId, targetType: 'api-key', targetId: tokenId }, manager);
  });
}
