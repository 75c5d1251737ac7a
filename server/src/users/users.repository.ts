import type { EntityManager } from 'typeorm';
import type { AppContext } from '../context.js';
import type { Role } from '../auth/permissions.js';
import { forgetUser } from '../auth/token-cache.js';
import { InvitationEntity, type InvitationRecord } from './invitation.entity.js';
import { UserEntity, type UserRecord, type UserStatus } from './user.entity.js';

function users(context: AppContext, manager?: EntityManager) {
  return (manager ?? context.dataSource.manager).getRepository(UserEntity);
}

/** A user by id, or null. */
export async function findUserById(context: AppContext, id: string, manager?: EntityManager): Promise<UserRecord | null> {
  return users(context, manager).findOneBy({ id });
}

/** A user by e-mail (stored lower-case), or null. */
export async function findUserByEmail(context: AppContext, email: string, manager?: EntityManager): Promise<UserRecord | null> {
  return users(context, manager).findOneBy({ email: email.toLowerCase() });
}

/** How many users exist (optionally of one role and status). */
export async function countUsers(context: AppContext, where: { role?: Role; status?: UserStatus } = {}, manager?: EntityManager): Promise<number> {
  return users(context, manager).countBy(where);
}

/** One page of users ordered by e-mail, with the total count. */
export async function listUsers(context: AppContext, page: number, pageSize: number): Promise<{ items: UserRecord[]; total: number }> {
  const [items, total] = await users(context).findAndCount({ order: { email: 'ASC' }, skip: (page - 1) * pageSize, take: pageSize });
  return { items, total };
}

/** Inserts a user. */
export async function insertUser(context: AppContext, user: UserRecord, manager?: EntityManager): Promise<void> {
  await users(context, manager).insert(user);
}

/** Changes some fields of a user; drops every cached principal of theirs at once (role or status may have changed). */
export async function updateUser(context: AppContext, id: string, changes: Partial<Omit<UserRecord, 'id'>>, manager?: EntityManager): Promise<void> {
  await users(context, manager).update({ id }, changes);
  forgetUser(context, id);
}

/** Inserts an invitation. */
export async function insertInvitation(context: AppContext, invitation: InvitationRecord, manager?: EntityManager): Promise<void> {
  await (manager ?? context.dataSource.manager).getRepository(InvitationEntity).insert(invitation);
}

/** An invitation by the hash of its token, or null. */
export async function findInvitationByHash(context: AppContext, tokenHash: string, manager?: EntityManager): Promise<InvitationRecord | null> {
  return (manager ?? context.dataSource.manager).getRepository(InvitationEntity).findOneBy({ tokenHash });
}

/** Marks an invitation accepted. */
export async function markInvitationAccepted(context: AppContext, id: string, at: string, manager?: EntityManager): Promise<void> {
  await (manager ?? context.dataSource.manager).getRepository(InvitationEntity).update({ id }, { acceptedAt: at });
}
