import type { EntityManager } from 'typeorm';
import { forgetToken, forgetUser } from '../auth/token-cache.js';
import type { AppContext } from '../context.js';
import { SessionEntity, type SessionRecord } from './session.entity.js';

function sessions(context: AppContext, manager?: EntityManager) {
  return (manager ?? context.dataSource.manager).getRepository(SessionEntity);
}

/** Inserts a session. */
export async function insertSession(context: AppContext, session: SessionRecord, manager?: EntityManager): Promise<void> {
  await sessions(context, manager).insert(session);
}

/** A session by the hash of its token, or null. */
export async function findSessionByHash(context: AppContext, tokenHash: string): Promise<SessionRecord | null> {
  return sessions(context).findOneBy({ tokenHash });
}

/** Revokes one session (and drops its cached principal at once). */
export async function revokeSession(context: AppContext, id: string, at: string, manager?: EntityManager): Promise<void> {
  await sessions(context, manager).update({ id }, { revokedAt: at });
  forgetToken(context, id);
}

/**
 * Revokes every open session of a user (on deactivation), or every one but `keep.except` (on a password
 * change: the session that made it stays open); drops the user's cached principals at once.
 */
export async function revokeSessionsOfUser(context: AppContext, userId: string, at: string, manager?: EntityManager, keep: { except?: string } = {}): Promise<void> {
  const query = sessions(context, manager).createQueryBuilder().update().set({ revokedAt: at }).where('user_id = :userId AND revoked_at IS NULL', { userId });
  if (keep.except !== undefined) query.andWhere('id <> :except', { except: keep.except });
  await query.execute();
  forgetUser(context, userId);
}

/** A session by id, or null. */
export async function findSessionById(context: AppContext, id: string): Promise<SessionRecord | null> {
  return sessions(context).findOneBy({ id });
}
