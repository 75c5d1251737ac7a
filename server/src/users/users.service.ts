import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit.service.js';
import type { Role } from '../auth/permissions.js';
import type { Principal } from '../auth/principal.js';
import { hashPassword, verifyPassword } from '../auth/password.js';
import { hashToken, newToken } from '../auth/tokens.js';
import { type AppContext, now } from '../context.js';
import { inTransaction } from '../db/transaction.js';
import { ConflictError, InputError, NotFoundError } from '../http/problem.js';
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

/** An invitation, the person it invites, and whether it can still be accepted (`open`) or why not, now. */
export interface FoundInvitation {
  state: 'open' | 'used' | 'expired';
  invitation: InvitationRecord;
  user: UserRecord;
}

/**
 * The invitation behind a token with its person and state: the one place the state is worked out, for
 * `GET /invitations/{token}` (the console shows it before asking for a password) and the accept call.
 * Throws `NotFoundError` for a token no invitation has.
 */
export async function getInvitation(context: AppContext, token: string): Promise<FoundInvitation> {
  const invitation = await findInvitationByHash(context, hashToken(token));
  const user = invitation ? await findUserById(context, invitation.userId) : null;
  if (!invitation || !user) throw new NotFoundError('The invitation');
  const state = invitation.acceptedAt ? 'used' : invitation.expiresAt <= now(context).toISOString() ? 'expired' : 'open';
  return { state, invitation, user };
}

/** Completes sign-up from an invitation token: sets name and password, activates the user and opens a session. */
export async function acceptInvitation(context: AppContext, token: string, name: string, password: string): Promise<IssuedSession & { user: UserRecord }> {
  const { state, invitation, user } = await getInvitation(context, token);
  if (state === 'used') throw new ConflictError('This invitation has been used already; sign in instead.');
  if (state === 'expired') throw new ConflictError('This invitation has expired; ask an admin for a new one.');
  if (user.status !== 'invited') throw new ConflictError('This account is no longer waiting for its invitation.');
  const iso = now(context).toISOString();
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

/** What signed-in people may change about themselves (`PATCH /me`). */
export interface SelfChanges {
  name?: string;
  currentPassword?: string;
  newPassword?: string;
}

/**
 * Changes the caller's own name and/or password. A new password needs the current one, checked with the
 * same scrypt verify as sign-in (a wrong guess costs as much as a sign-in attempt, and is audited); on a
 * password change every other session of the caller is revoked at once, the one making the request stays.
 * Throws `InputError` at `/currentPassword` (missing or wrong), `/newPassword` (current password without a
 * new one) or `/name` (blank). The audit event lists the fields changed, never a password.
 */
export async function updateSelf(context: AppContext, actor: Principal, changes: SelfChanges): Promise<UserRecord> {
  const user = actor.userId ? await findUserById(context, actor.userId) : null;
  if (!user) throw new NotFoundError('The user');
  const name = changes.name?.trim();
  if (name === '') throw InputError.at('/name', 'must not be blank');
  if (changes.newPassword === undefined && changes.currentPassword !== undefined) {
    throw InputError.at('/newPassword', 'is required with currentPassword: give the new password, or leave both out');
  }
  let passwordHash = user.passwordHash;
  if (changes.newPassword !== undefined) {
    if (changes.currentPassword === undefined) throw InputError.at('/currentPassword', 'is required to set a new password');
    if (!(await verifyPassword(changes.currentPassword, user.passwordHash))) {
      await recordAudit(context, { action: 'user.update-self.refused', actorId: user.id, targetType: 'user', targetId: user.id, detail: { reason: 'wrong current password' } });
      throw InputError.at('/currentPassword', 'is not your current password');
    }
    passwordHash = await hashPassword(changes.newPassword);
  }
  const fields = [...(name !== undefined && name !== user.name ? ['name'] : []), ...(changes.newPassword !== undefined ? ['password'] : [])];
  if (fields.length === 0) return user;
  const iso = now(context).toISOString();
  const next: UserRecord = { ...user, name: name ?? user.name, passwordHash, updatedAt: iso };
  await inTransaction(context.dataSource, async (manager) => {
    await updateUser(context, user.id, { name: next.name, passwordHash, updatedAt: iso }, manager);
    if (fields.includes('password')) await revokeSessionsOfUser(context, user.id, iso, manager, { except: actor.tokenId });
    await recordAudit(context, { action: 'user.update-self', actorId: user.id, targetType: 'user', targetId: user.id, detail: { fields, otherSessionsRevoked: fields.includes('password') } }, manager);
  });
  return next;
}
