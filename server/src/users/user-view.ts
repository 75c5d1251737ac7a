import type { components } from '../openapi/api-types.js';
import type { UserRecord } from './user.entity.js';

/** A user as the API shows it (never the password hash). */
export type UserView = components['schemas']['User'];

/** The public view of a user record. */
export function userView(user: UserRecord): UserView {
  return { id: user.id, email: user.email, name: user.name, role: user.role, status: user.status, createdAt: user.createdAt, updatedAt: user.updatedAt };
}
