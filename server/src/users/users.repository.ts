import type { EntityManager } from 'typeorm';
import type { AppContext } from '../context.js';
import type { Role } from '../auth/permissions.js';
import { forgetUser } from '../auth/token-cache.js';
import { InvitationEntity, type InvitationRecord } from './invitation.entity.js';
import { UserEntity, type UserRecord, type UserStatus } from './user.entity.js';
import type { UserQuery, UserSort } from './user-query.js';

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

// names sort without regard to (ASCII) case; ties fall back to the e-mail, which is unique
const SORT_COLUMNS: Record<UserSort, string> = { email: 'u.email', name: 'u.name COLLATE NOCASE', createdAt: 'u.created_at' };

/** One page of the users matching the query (every user by e-mail by default), with the total count. */
export async function listUsers(context: AppContext, query: UserQuery, page: number, pageSize: number): Promise<{ items: UserRecord[]; total: number }> {
  const select = users(context).createQueryBuilder('u');
  if (query.q) {
    // SQLite's LIKE ignores case for ASCII letters only; the wildcards of the text itself are escaped
    const like = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    select.andWhere(`(u.email LIKE :like ESCAPE '\\' OR u.name LIKE :like ESCAPE '\\')`, { like });
  }
  if (query.role) select.andWhere('u.role = :role', { role: query.role });
  if (query.status) select.andWhere('u.status = :status', { status: query.status });
  const direction = query.order === 'desc' ? 'DESC' : 'ASC';
  select.orderBy(SORT_COLUMNS[query.sort], direction);
  if (query.sort !== 'email') select.addOrderBy('u.email', 'ASC');
  const [items, total] = await select.skip((page - 1) * pageSize).take(pageSize).getManyAndCount();
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
