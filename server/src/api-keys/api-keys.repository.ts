import type { EntityManager } from 'typeorm';
import { IsNull, LessThanOrEqual } from 'typeorm';
import { forgetToken } from '../auth/token-cache.js';
import type { AppContext } from '../context.js';
import { ApiKeyEntity, type ApiKeyRecord } from './api-key.entity.js';

function keys(context: AppContext, manager?: EntityManager) {
  return (manager ?? context.dataSource.manager).getRepository(ApiKeyEntity);
}

/** Inserts a key. */
export async function insertApiKey(context: AppContext, key: ApiKeyRecord, manager?: EntityManager): Promise<void> {
  await keys(context, manager).insert(key);
}

/** A key by id, or null. */
export async function findApiKeyById(context: AppContext, id: string): Promise<ApiKeyRecord | null> {
  return keys(context).findOneBy({ id });
}

/** A key by the hash of its secret, or null. */
export async function findApiKeyByHash(context: AppContext, secretHash: string): Promise<ApiKeyRecord | null> {
  return keys(context).findOneBy({ secretHash });
}

/** Every key, newest first. */
export async function listApiKeys(context: AppContext): Promise<ApiKeyRecord[]> {
  return keys(context).find({ order: { createdAt: 'DESC' } });
}

// bookkeeping fields that do not change what a key may do (its cached principal stays valid)
const BOOKKEEPING = new Set(['lastUsedAt', 'expiryNoticeSentAt']);

/** Changes some fields of a key; any change beyond bookkeeping (revoke, expiry, scopes) drops its cached principal at once. */
export async function updateApiKey(context: AppContext, id: string, changes: Partial<Omit<ApiKeyRecord, 'id'>>, manager?: EntityManager): Promise<void> {
  await keys(context, manager).update({ id }, changes);
  if (Object.keys(changes).some((field) => !BOOKKEEPING.has(field))) forgetToken(context, id);
}

/** Live keys (not revoked, with an expiry) expiring at or before `before` whose issuer has not been told yet. */
export async function findKeysNeedingNotice(context: AppContext, before: string): Promise<ApiKeyRecord[]> {
  return keys(context).find({ where: { revokedAt: IsNull(), expiryNoticeSentAt: IsNull(), expiresAt: LessThanOrEqual(before) } });
}
