import { EntitySchema } from 'typeorm';

/** One audited event: who did what to which thing, when. */
export interface AuditEventRecord {
  id: number;
  at: string;
  action: string;
  actorId: string | null;
  targetType: string | null;
  targetId: string | null;
  detail: Record<string, unknown> | null;
}

/** Table `audit_events` (append-only). */
export const AuditEventEntity = new EntitySchema<AuditEventRecord>({
  name: 'AuditEvent',
  tableName: 'audit_events',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    at: { type: 'varchar' },
    action: { type: 'varchar' },
    actorId: { name: 'actor_id', type: 'varchar', nullable: true },
    targetType: { name: 'target_type', type: 'varchar', nullable: true },
    targetId: { name: 'target_id', type: 'varchar', nullable: true },
    detail: { type: 'simple-json', nullable: true },
  },
});
