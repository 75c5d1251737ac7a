import { EntitySchema } from 'typeorm';
import type { Permission } from '../auth/permissions.js';

/** An API key for scripts; only the hash of its secret is kept, plus a short prefix to recognise it. */
export interface ApiKeyRecord {
  id: string;
  name: string;
  /** The first characters of the secret (`pwk_ab12…`), safe to show. */
  prefix: string;
  secretHash: string;
  scopes: Permission[];
  createdBy: string;
  createdAt: string;
  expiresAt: string | null;
  revokedAt: string | null;
  lastUsedAt: string | null;
  /** When the issuer was told the key is about to expire (at most once). */
  expiryNoticeSentAt: string | null;
}

/** Table `api_keys`. */
export const ApiKeyEntity = new EntitySchema<ApiKeyRecord>({
  name: 'ApiKey',
  tableName: 'api_keys',
  columns: {
    id: { type: 'varchar', primary: true },
    name: { type: 'varchar' },
    prefix: { type: 'varchar' },
    secretHash: { name: 'secret_hash', type: 'varchar', unique: true },
    scopes: { type: 'simple-json' },
    createdBy: { name: 'created_by', type: 'varchar' },
    createdAt: { name: 'created_at', type: 'varchar' },
    expiresAt: { name: 'expires_at', type: 'varchar', nullable: true },
    revokedAt: { name: 'revoked_at', type: 'varchar', nullable: true },
    lastUsedAt: { name: 'last_used_at', type: 'varchar', nullable: true },
    expiryNoticeSentAt: { name: 'expiry_notice_sent_at', type: 'varchar', nullable: true },
  },
});
