import type { EntityManager } from 'typeorm';
import type { QueryDeepPartialEntity } from 'typeorm/query-builder/QueryPartialEntity.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { AuditEventEntity, type AuditEventRecord } from './audit-event.entity.js';

/** What happened (actions like `session.created`, `api-key.revoked`, `model.updated`). */
export interface AuditInput {
  action: string;
  actorId: string | null;
  targetType?: string;
  targetId?: string;
  detail?: Record<string, unknown>;
}

/**
 * Appends one event to the audit trail. Pass the transaction's `manager` when recording inside
 * `inTransaction` (the event then commits or rolls back with the change it describes).
 */
export async function recordAudit(context: AppContext, event: AuditInput, manager?: EntityManager): Promise<void> {
  // simple-json column: TypeORM's deep-partial type does not follow an open record, hence the cast
  const row = {
    at: now(context).toISOString(),
    action: event.action,
    actorId: event.actorId,
    targetType: event.targetType ?? null,
    targetId: event.targetId ?? null,
    detail: event.detail ?? null,
  } as QueryDeepPartialEntity<AuditEventRecord>;
  if (manager) {
    await manager.getRepository(AuditEventEntity).insert(row);
    return;
  }
  await inTransaction(context.dataSource, (m) => m.getRepository(AuditEventEntity).insert(row).then(() => undefined));
}
