import { EntitySchema } from 'typeorm';
import type { Role } from '../auth/permissions.js';

/** Whether a person can sign in: invited (no password yet), active, or deactivated. */
export type UserStatus = 'invited' | 'active' | 'deactivated';

/** A person who signs in. Times are ISO strings. */
export interface UserRecord {
  id: string;
  email: string;
  name: string;
  role: Role;
  status: UserStatus;
  /** `scrypt$N$r$p$salt$hash` (base64url parts); null until the invitation is accepted. */
  passwordHash: string | null;
  createdAt: string;
  updatedAt: string;
}

/** Table `users`. */
export const UserEntity = new EntitySchema<UserRecord>({
  name: 'User',
  tableName: 'users',
  columns: {
    id: { type: 'varchar', primary: true },
    email: { type: 'varchar', unique: true },
    name: { type: 'varchar' },
    role: { type: 'varchar' },
    status: { type: 'varchar' },
    passwordHash: { name: 'password_hash', type: 'varchar', nullable: true },
    createdAt: { name: 'created_at', type: 'varchar' },
    updatedAt: { name: 'updated_at', type: 'varchar' },
  },
});
