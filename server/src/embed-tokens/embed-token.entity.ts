import { EntitySchema } from 'typeorm';

/** A short-lived read-only token for a widget on a page, bound to models and page origins. */
export interface EmbedTokenRecord {
  id: string;
  tokenHash: string;
  modelIds: string[];
  origins: string[];
  createdBy: string;
  createdAt: string;
  expiresAt: string;
}

/** Table `embed_tokens`. */
export const EmbedTokenEntity = new EntitySchema<EmbedTokenRecord>({
  name: 'EmbedToken',
  tableName: 'embed_tokens',
  columns: {
    id: { type: 'varchar', primary: true },
    tokenHash: { name: 'token_hash', type: 'varchar', unique: true },
    modelIds: { name: 'model_ids', type: 'simple-json' },
    origins: { type: 'simple-json' },
    createdBy: { name: 'created_by', type: 'varchar' },
    createdAt: { name: 'created_at', type: 'varchar' },
    expiresAt: { name: 'expires_at', type: 'varchar' },
  },
});
