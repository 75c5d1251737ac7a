import type { EntityManager } from 'typeorm';
import type { AppContext } from '../context.js';
import { EmbedTokenEntity, type EmbedTokenRecord } from './embed-token.entity.js';

/** Inserts an embed token. */
export async function insertEmbedToken(context: AppContext, token: EmbedTokenRecord, manager?: EntityManager): Promise<void> {
  await (manager ?? context.dataSource.manager).getRepository(EmbedTokenEntity).insert(token);
}

/** An embed token by its hash, or null. */
export async function findEmbedTokenByHash(context: AppContext, tokenHash: string): Promise<EmbedTokenRecord | null> {
  return context.dataSource.manager.getRepository(EmbedTokenEntity).findOneBy({ tokenHash });
}

/** Which of these ids are not live models (absent or deleted). Reads the models helper's `models` table. */
export async function missingModelIds(context: AppContext, ids: readonly string[]): Promise<string[]> {
  if (ids.length === 0) return [];
  const rows = (await context.dataSource.query(`SELECT "id" FROM "models" WHERE "deleted_at" IS NULL AND "id" IN (${ids.map(() => '?').join(', ')})`, [...ids])) as { id: string }[];
  const found = new Set(rows.map((r) => r.id));
  return ids.filter((id) => !found.has(id));
}
