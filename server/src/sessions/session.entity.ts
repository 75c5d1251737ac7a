import { EntitySchema } from 'typeorm';

/** A signed-in session; only the hash of its bearer token is kept. */
export interface SessionRecord {
  id: string;
  userId: string;
  tokenHash: string;
  createdAt: string;
  expiresAt: string;
  revokedAt: string | null;
}

/** Table `sessions`. */
export const SessionEntity = new EntitySchema<SessionRecord>({
  name: 'Session',
  tableName: 'sessions',
  columns: {
    id: { type: 'varchar', primary: true },
    userId: { name: 'user_id', type: 'varchar' },
    tokenHash: { name: 'token_hash', type: 'varchar', unique: true },
    createdAt: { name: 'created_at', type: 'varchar' },
    expiresAt: { name: 'expires_at', type: 'varchar' },
    revokedAt: { name: 'revoked_at', type: 'varchar', nullable: true },
  },
});
