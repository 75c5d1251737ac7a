import type { Role } from '../api/api-types';

/** A role and what it lets a person do (the API's role → permissions table, in words). */
export interface RoleInfo {
  readonly role: Role;
  readonly explanation: string;
}

/** The three roles, least powerful first (the order offered in pickers). */
export const ROLES: readonly RoleInfo[] = [
  { role: 'viewer', explanation: 'Reads models and computes pole paths; changes nothing.' },
  { role: 'engineer', explanation: 'Reads, creates and changes models; computes.' },
  { role: 'admin', explanation: 'Everything an engineer does, plus people, API keys and the audit log.' },
];

/** The states of an account, in the order offered in the filter. */
export const STATUSES: readonly { readonly status: 'invited' | 'active' | 'deactivated'; readonly label: string }[] = [
  { status: 'active', label: 'Active' },
  { status: 'invited', label: 'Invited (not yet signed up)' },
  { status: 'deactivated', label: 'Deactivated' },
];
