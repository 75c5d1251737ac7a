import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit.service.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { UnauthorizedError } from '../http/problem.js';
import { verifyPassword } from '../auth/password.js';
import { hashToken, newToken } from '../auth/tokens.js';
import type { UserRecord } from '../users/user.entity.js';
import { findUserByEmail } from '../users/users.repository.js';
import { insertSession, revokeSession } from './sessions.repository.js';

/** A new session: the bearer token (shown once) and when it expires. */
export interface IssuedSession {
  token: string;
  expiresAt: string;
  sessionId: string;
}

/** Opens a session for a user without checking a password (after sign-in, invitation, or in tests). */
export async function openSession(context: AppContext, userId: string): Promise<IssuedSession> {
  const token = newToken('session');
  const created = now(context);
  const expiresAt = new Date(created.getTime() + context.config.sessionTtlSeconds * 1000).toISOString();
  const sessionId = randomUUID();
  await inTransaction(context.dataSource, async (manager) => {
    await insertSession(context, { id: sessionId, userId, tokenHash: hashToken(token), createdAt: created.toISOString(), expiresAt, revokedAt: null }, manager);
    await recordAudit(context, { action: 'session.created', actorId: userId, targetType: 'session', targetId: sessionId }, manager);
  });
  return { token, expiresAt, sessionId };
}

/** Signs in with e-mail and password; a wrong pair (or an inactive user) is audited and refused with one message. */
export async function signIn(context: AppContext, email: string, password: string, ip: string | undefined): Promise<IssuedSession & { user: UserRecord }> {
  const user = await findUserByEmail(context, email);
  const ok = await verifyPassword(password, user?.passwordHash ?? null);
  if (!user || !ok || user.status !== 'active') {
    await recordAudit(context, { action: 'session.failed', actorId: user?.id ?? null, targetType: 'user', targetId: user?.id, detail: { email: email.toLowerCase(), ip: ip ?? null } });
    throw new UnauthorizedError('The e-mail or the password is wrong, or the account is not active.');
  }
  const session = await openSession(context, user.id);
  return { ...session, user };
}

/** Revokes the caller's session at once. */
export async function signOut(context: AppContext, sessionId: string, userId: string | null): Promise<void> {
  await inTransaction(context.dataSource, async (manager) => {
    await revokeSession(context, sessionId, now(context).toISOString(), manager);
    await recordAudit(context, { action: 'session.revoked', actorId: userId, targetType: 'session', targetId: sessionId }, manager);
  });
}
