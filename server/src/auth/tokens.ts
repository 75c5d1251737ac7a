import { createHash, randomBytes } from 'node:crypto';

/** Prefixes of the three bearer token kinds (CONTRACTS: embed tokens). */
export const TOKEN_PREFIX = { session: 'pws_', 'api-key': 'pwk_', embed: 'pwe_', invitation: 'pwi_' } as const;

/** Token kinds. */
export type TokenKind = keyof typeof TOKEN_PREFIX;

/** A new random token: its prefix and 32 random bytes in base64url. */
export function newToken(kind: TokenKind): string {
  return TOKEN_PREFIX[kind] + randomBytes(32).toString('base64url');
}

/** What is stored instead of a token: SHA-256, hex. Tokens carry 256 random bits, so no salt or stretching is needed. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

const SHAPE = /^pw[skei]_[A-Za-z0-9_-]{43}$/;

/** The kind of a well-formed token, or null when it is not one of ours. */
export function kindOf(token: string): TokenKind | null {
  if (!SHAPE.test(token)) return null;
  const prefix = token.slice(0, 4);
  for (const [kind, p] of Object.entries(TOKEN_PREFIX)) if (p === prefix) return kind as TokenKind;
  return null;
}
