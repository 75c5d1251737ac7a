import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit.service.js';
import type { Permission } from '../auth/permissions.js';
import type { Principal } from '../auth/principal.js';
import { hashToken, newToken } from '../auth/tokens.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { InputError, NotFoundError } from '../http/problem.js';
import type { components } from '../openapi/api-types.js';
import type { ApiKeyRecord } from './api-key.entity.js';
import { findApiKeyById, insertApiKey, updateApiKey } from './api-keys.repository.js';

/** An API key as the API shows it (never the secret or its hash). */
export type ApiKeyView = components['schemas']['ApiKey'];

/** The public view of a key record. */
export function apiKeyView(key: ApiKeyRecord): ApiKeyView {
  return {
    id: key.id,
    name: key.name,
    prefix: key.prefix,
    scopes: key.scopes as ApiKeyView['scopes'],
    createdBy: key.createdBy,
    createdAt: key.createdAt,
    expiresAt: key.expiresAt,
    revokedAt: key.revokedAt,
    lastUsedAt: key.lastUsedAt,
  };
}

/** Issues a key; the secret is returned here only, the database keeps its SHA-256. */
export async function issueApiKey(context: AppContext, actor: Principal, input: { name: string; scopes: Permission[]; expiresAt?: string }): Promise<{ key: ApiKeyRecord; secret: string }> {
  const at = now(context);
  let expiresAt: string | null = null;
  if (input.expiresAt !== undefined) {
    const t = Date.parse(input.expiresAt);
    if (!Number.isFinite(t)) throw InputError.at('/expiresAt', 'not a date-time');
    if (t <= at.getTime()) throw InputError.at('/expiresAt', 'must be in the future');
    expiresAt = new Date(t).toISOString();
  }
  const secret = newToken('api-key');
  const key: ApiKeyRecord = {
    id: randomUUID(),
    name: input.name,
    prefix: secret.slice(0, 12),
    secretHash: hashToken(secret),
    scopes: [...new Set(input.scopes)],
    createdBy: actor.userId ?? '',
    createdAt: at.toISOString(),
    expiresAt,
    revokedAt: null,
    lastUsedAt: null,
    expiryNoticeSentAt: null,
  };
  await inTransaction(context.dataSource, async (manager) => {
    await insertApiKey(context, key, manager);
    await recordAudit(context, { action: 'api-key.created', actorId: actor.userId, targetType: 'api-key', targetId: key.id, detail: { name: key.name, scopes: key.scopes, expiresAt } }, manager);
  });
  return { key, secret };
}

/** Revokes a key at once (revoking a revoked key changes nothing). */
export async function revokeApiKey(context: AppContext, actor: Principal, id: string): Promise<void> {
  const key = await findApiKeyById(context, id);
  if (!key) throw new NotFoundError('The API key');
  if (key.revokedAt) return;
  await inTransaction(context.dataSource, async (manager) => {
    await updateApiKey(context, id, { revokedAt: now(context).toISOString() }, manager);
    await recordAudit(context, { action: 'api-key.revoked', actorId: actor.userId, targetType: 'api-key', targetId: id, detail: { name: key.name } }, manager);
  });
}
