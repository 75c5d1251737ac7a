import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit.service.js';
import type { Role } from '../auth/permissions.js';
import type { Principal } from '../auth/principal.js';
import { hashPassword } from '../auth/password.js';
import { hashToken, newToken } from '../auth/tokens.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { ConflictError, NotFoundError } from '../http/problem.js';
import { type IssuedSession, openSession } from '../sessions/sessions.service.js';
import { revokeSessionsOfUser } from '../sessions/sessions.repository.js';
import type { InvitationRecord } from './invitation.entity.js';
import type { UserRecord, UserStatus } from './user.entity.js';
import {
  countUsers,
  findInvitationByHash,
  findUserByEmail,
  findUserById,
  insertInvitation,
  insertUser,
  markInvitationAccepted,
  updateUser,
} from './users.repository.js';

/** Who to invite. */
export interface InviteInput {
  email: string;
  role: Role;
  name?: string;
}

/** Invites a person: creates them as `invited` and mails a link to complete sign-up. Returns the user and the link's expiry. */
export async function inviteUser(context: AppContext, actor: Principal, input: InviteInput): Promise<{ user: UserRecord; invitationExpiresAt: string }> {
  const email = input.email.toLowerCase();
  if (await findUserByEmail(context, email)) throw new ConflictError(`A user with the e-mail ${email} already exists.`);
  const at = now(context);
  const iso = at.toISOString();
  const user: UserRecord = { id: randomUUID(), email, name: input.name ?? email.split('@')[0] ?? email, role: input.role, status: 'invited', passwordHash: null, createdAt: iso, updatedAt: iso };
  const token = newToken('invitation');
  const expiresAt = new Date(at.getTime() + context.config.invitationTtlSeconds * 1000).toISOString();
  await inTransaction(context.dataSource, async (manager) => {
    await insertUser(context, user, manager);
    await insertInvitation(context, { id: randomUUID(), userId: user.id, tokenHash: hashToken(token), invitedBy: actor.userId ?? '', createdAt: iso, expiresAt, acceptedAt: null }, manager);
    await recordAudit(context, { action: 'user.invited', actorId: actor.userId, targetType: 'user', targetId: user.id, detail: { email, role: input.role } }, manager);
  });
  const link = `${context.config.publicUrl}/invitations/${token}`;
  await context.mailer.send({
    to: email,
    subject: 'You are invited to Polewright',
    text: [
      `Hello ${user.name},`,
      '',
      `you have been invited to Polewright as ${input.role}. Open this link to choose your name and password:`,
      '',
      link,
      '',
      `The link works once, until ${expiresAt}. From a script, the same is:`,
      `POST ${context.config.publicUrl}/api/v1/invitations/${token}/accept with {"name": "...", "password": "..."}`,
    ].join('\n'),
  });
  return { user, invitationExpiresAt: expiresAt };
}

/** Whether an invitation can still be accepted (`open`), or why not. */
export type InvitationState = 'open' | 'used' | 'expired' | 'unknown';

function stateOf(invitation: InvitationRecord | null, iso: string): InvitationState {
  if (!invitation) return 'unknown';
  if (invitation.acceptedAt) return 'used';
  return invitation.expiresAt <= iso ? 'expired' : 'open';
}

/** The state of the invitation behind a token (the invitation page shows it before asking for a password). */
export async function invitationState(context: AppContext, token: string): Promise<InvitationState> {
  return stateOf(await findInvitationByHash(context, hashToken(token)), now(context).toISOString());
}

/** Completes sign-up from an invitation token: sets name and password, activates the user and opens a session. */
export async function acceptInvitation(context: AppContext, token: string, name: string, password: string): Promise<IssuedSession & { user: UserRecord }> {
  const invitation = await findInvitationByHash(context, hashToken(token));
  const iso = now(context).toISOString();
  const state = stateOf(invitation, iso);
  if (!invitation || state === 'unknown') throw new NotFoundError('The invitation');
  if (state === 'used') throw new ConflictError('This invitation has been used already; sign in instead.');
  if (state === 'expired') throw new ConflictError('This invitation has expired; ask an admin for a new one.');
  const user = await findUserById(context, invitation.userId);
  if (!user || user.status !== 'invited') throw new ConflictError('This account is no longer waiting for its invitation.');
  const passwordHash = await hashPassword(password);
  await inTransaction(context.dataSource, async (manager) => {
    await updateUser(context, user.id, { name, passwordHash, status: 'active', updatedAt: iso }, manager);
    await markInvitationAccepted(context, invitation.id, iso, manager);
    await recordAudit(context, { action: 'user.activated', actorId: user.id, targetType: 'user', targetId: user.id }, manager);
  });
  const session = await openSession(context, user.id);
  return { ...session, user: { ...user, name, passwordHash, status: 'active', updatedAt: iso } };
}

/** What an admin may change about a user. */
export interface UserChanges {
  role?: Role;
  status?: Exclude<UserStatus, 'invited'>;
  name?: string;
}

/** Changes a user's role, name or status; deactivation revokes their sessions at once. Keeps at least one active admin. */
export async function changeUser(context: AppContext, actor: Principal, id: string, changes: UserChanges): Promise<UserRecord> {
  const user = await findUserById(context, id);
  if (!user) throw new NotFoundError('The user');
  const iso = now(context).toISOString();
  const losesAdmin = user.role === 'admin' && user.status === 'active' && ((changes.role && changes.role !== 'admin') || changes.status === 'deactivated');
  if (losesAdmin && user.id === actor.userId) throw new ConflictError('You cannot remove your own admin rights or deactivate yourself.');
  if (losesAdmin && (await countUsers(context, { role: 'admin', status: 'active' })) <= 1) throw new ConflictError('At least one active admin must remain.');
  if (changes.status === 'active' && user.status === 'invited') throw new ConflictError('This user has not accepted the invitation yet.');
  const next: UserRecord = { ...user, ...changes, status: changes.status && user.status !== 'invited' ? changes.status : user.status, updatedAt: iso };
  await inTransaction(context.dataSource, async (manager) => {
    await updateUser(context, id, { role: next.role, status: next.status, name: next.name, updatedAt: iso }, manager);
    if (next.status === 'deactivated' && user.status !== 'deactivated') await revokeSessionsOfUser(context, id, iso, manager);
    const action = next.status !== user.status ? (next.status === 'deactivated' ? 'user.deactivated' : 'user.reactivated') : 'user.updated';
    await recordAudit(context, { action, actorId: actor.userId, targetType: 'user', targetId: id, detail: { ...changes } }, manager);
  });
  return next;
}
