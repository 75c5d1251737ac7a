/** What a token may do. Scopes of API keys are a subset of the first three. */
export type Permission = 'models:read' | 'models:write' | 'compute' | 'admin';

/**
 * What an operation of the OpenAPI document requires (its `x-polewright-permission`): a permission, any
 * signed-in session (`session`: sign out, `/me`), or nothing at all (`public`: sign-in, health, docs,
 * invitation accept).
 */
export type Requirement = Permission | 'session' | 'public';

/** Every value `x-polewright-permission` may take. */
export const REQUIREMENTS: readonly Requirement[] = ['models:read', 'models:write', 'compute', 'admin', 'session', 'public'];

/** Whether a value names a requirement. */
export function isRequirement(value: unknown): value is Requirement {
  return typeof value === 'string' && (REQUIREMENTS as readonly string[]).includes(value);
}

/** The three roles of people. */
export type Role = 'admin' | 'engineer' | 'viewer';

/** Every role, most powerful first. */
export const ROLES: readonly Role[] = ['admin', 'engineer', 'viewer'];

/** Scopes an API key may carry (never `admin`). */
export const API_KEY_SCOPES: readonly Permission[] = ['models:read', 'models:write', 'compute'];

/** Role → permissions: admin everything; engineer read, write, compute; viewer read and compute. */
export const ROLE_PERMISSIONS: Readonly<Record<Role, readonly Permission[]>> = {
  admin: ['models:read', 'models:write', 'compute', 'admin'],
  engineer: ['models:read', 'models:write', 'compute'],
  viewer: ['models:read', 'compute'],
};

/** Whether a value names a role. */
export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
