import type { Permission, Role } from './permissions.js';

/** Who is calling, resolved from the bearer token (CONTRACTS: auth/). */
export interface Principal {
  readonly kind: 'session' | 'api-key' | 'embed';
  /** The signed-in user; for API keys and embed tokens the admin or user who issued them. */
  readonly userId: string | null;
  /** The user's role for sessions; null for keys and embed tokens (their scopes say what they may do). */
  readonly role: Role | null;
  readonly scopes: ReadonlySet<Permission>;
  /** Models an embed token is bound to; null for the other kinds. */
  readonly modelIds: readonly string[] | null;
  /** Page origins an embed token is bound to; null for the other kinds. */
  readonly origins: readonly string[] | null;
  /** Id of the session, key or embed token row. */
  readonly tokenId: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by the bearer strategy when the request carried a valid token. */
      principal?: Principal;
    }
  }
}
