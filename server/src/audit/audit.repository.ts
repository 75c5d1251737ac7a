import type { AppContext } from '../context.js';
import { AuditEventEntity, type AuditEventRecord } from './audit-event.entity.js';

/** Filters of the audit list. */
export interface AuditQuery {
  /** Exact action, or a prefix when it ends with "." (`api-key.`). */
  action?: string;
  actorId?: string;
  /** ISO time, inclusive. */
  from?: string;
  /** ISO time, exclusive. */
  to?: string;
  page: number;
  pageSize: number;
}

/** One page of audit events, newest first, with the total count of matches. */
export async function findAuditEvents(context: AppContext, q: AuditQuery): Promise<{ items: AuditEventRecord[]; total: number }> {
  const query = context.dataSource.manager.getRepository(AuditEventEntity).createQueryBuilder('e');
  if (q.action) {
    if (q.action.endsWith('.')) query.andWhere('substr(e.action, 1, :n) = :prefix', { n: q.action.length, prefix: q.action });
    else query.andWhere('e.action = :action', { action: q.action });
  }
  if (q.actorId) query.andWhere('e.actor_id = :actorId', { actorId: q.actorId });
  if (q.from) query.andWhere('e.at >= :from', { from: q.from });
  if (q.to) query.andWhere('e.at < :to', { to: q.to });
  const [items, total] = await query.orderBy('e.id', 'DESC').skip((q.page - 1) * q.pageSize).take(q.pageSize).getManyAndCount();
  return { items, total };
}
