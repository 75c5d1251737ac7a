/*
 * In-process cache of resolved principals, keyed by the SHA-256 of the bearer token. It saves the two
 * database look-ups per request (token row + user row) on the single shared sqlite connection.
 *
 * Safety rules:
 * - only successful resolutions are cached, for a few seconds (TTL) and at most MAX_ENTRIES of them;
 * - the expiry time of the token itself is kept with the entry and checked against the clock on every
 *   request (resolve-token.ts), so a cached token never outlives its expiry;
 * - every write that can take a right away (sign-out, key revoke, user deactivation or role change)
 *   goes through a repository function that calls `forgetToken` / `forgetUser`, so the same process
 *   refuses the token at once;
 * - a generation counter stops a resolution that read the database before such a write from storing
 *   its (now stale) answer after it.
 */
import type { DataSource } from 'typeorm';
import type { AppContext } from '../context.js';
import type { Principal } from './principal.js';

/** How long a resolved principal is reused without reading the database again. */
export const TOKEN_CACHE_TTL_MS = 5_000;
/** Upper bound of cached principals (the oldest are dropped first). */
export const TOKEN_CACHE_MAX_ENTRIES = 10_000;

/** A resolved token as cached: the principal and what must still be checked on every request. */
export interface CachedToken {
  readonly principal: Principal;
  /** ISO expiry of the token (null: none), compared with the clock on every use. */
  readonly expiresAt: string | null;
  /** For API keys: when the last use was recorded (the throttled last-used write); mutable on purpose. */
  lastUsedAt?: string | null;
  /** When the entry stops being reused (clock milliseconds). */
  readonly staleAt: number;
}

/** The cache of one data source (one server). */
export class TokenCache {
  private readonly entries = new Map<string, CachedToken>();
  private currentGeneration = 0;

  constructor(
    private readonly ttlMs = TOKEN_CACHE_TTL_MS,
    private readonly maxEntries = TOKEN_CACHE_MAX_ENTRIES,
  ) {}

  /** Bumped by every invalidation; take it before reading the database and pass it to `set`. */
  get generation(): number {
    return this.currentGeneration;
  }

  /** The entry for a token hash unless it has gone stale at `nowMs`. */
  get(hash: string, nowMs: number): CachedToken | undefined {
    const entry = this.entries.get(hash);
    if (!entry) return undefined;
    if (entry.staleAt <= nowMs) {
      this.entries.delete(hash);
      return undefined;
    }
    return entry;
  }

  /** Stores a resolution made at generation `generation`; dropped when an invalidation came in between. */
  set(hash: string, entry: Omit<CachedToken, 'staleAt'>, nowMs: number, generation: number): void {
    if (generation !== this.currentGeneration) return;
    this.entries.delete(hash);
    this.entries.set(hash, { ...entry, staleAt: nowMs + this.ttlMs });
    while (this.entries.size > this.maxEntries) {
      const oldest = this.entries.keys().next().value as string;
      this.entries.delete(oldest);
    }
  }

  /** Drops one token's entry by its hash. */
  delete(hash: string): void {
    this.entries.delete(hash);
  }

  /** Drops every entry matching `test` and invalidates resolutions in flight. */
  forget(test: (principal: Principal) => boolean): void {
    this.currentGeneration++;
    for (const [hash, entry] of this.entries) if (test(entry.principal)) this.entries.delete(hash);
  }

  /** Number of cached principals. */
  get size(): number {
    return this.entries.size;
  }
}

const caches = new WeakMap<DataSource, TokenCache>();

/** The token cache of this server's database (one per data source, created on first use). */
export function tokenCacheOf(context: AppContext): TokenCache {
  let cache = caches.get(context.dataSource);
  if (!cache) {
    cache = new TokenCache();
    caches.set(context.dataSource, cache);
  }
  return cache;
}

/** Drops the cached principal of one session, key or embed token row (by its id) at once. */
export function forgetToken(context: AppContext, tokenId: string): void {
  tokenCacheOf(context).forget((p) => p.tokenId === tokenId);
}

/** Drops every cached principal of a user (their sessions, and keys and embed tokens they issued) at once. */
export function forgetUser(context: AppContext, userId: string): void {
  tokenCacheOf(context).forget((p) => p.userId === userId);
}
