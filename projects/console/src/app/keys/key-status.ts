import type { ApiKey } from './keys-api';

/** Whether a key works now: `active`, past its expiry (`expired`) or `revoked` (revocation wins). */
export type KeyStatus = 'active' | 'expired' | 'revoked';

/** The status of a key at a moment (`now`, epoch milliseconds). */
export function keyStatus(key: Pick<ApiKey, 'revokedAt' | 'expiresAt'>, now: number): KeyStatus {
  if (key.revokedAt) return 'revoked';
  if (key.expiresAt && Date.parse(key.expiresAt) <= now) return 'expired';
  return 'active';
}
