import { randomBytes, scrypt, timingSafeEqual } from 'node:crypto';

// scrypt parameters: N = 2^14, r = 8, p = 1 (node's defaults; common practice for interactive sign-in, no source)
const N = 16384;
const R = 8;
const P = 1;
const KEY_LENGTH = 32;

function derive(password: string, salt: Buffer, n: number, r: number, p: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    scrypt(password.normalize('NFKC'), salt, KEY_LENGTH, { N: n, r, p, maxmem: 64 * 1024 * 1024 }, (error, key) => (error ? reject(error) : resolve(key)));
  });
}

/** Hashes a password with scrypt and a random 16-byte salt: `scrypt$N$r$p$salt$hash` (base64url). */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await derive(password, salt, N, R, P);
  return ['scrypt', N, R, P, salt.toString('base64url'), key.toString('base64url')].join('$');
}

/** A valid hash of nothing anyone knows, to spend the same time on unknown e-mails. */
const DECOY = hashPassword(randomBytes(24).toString('base64url'));

/** Whether `password` matches `stored` (constant-time compare); a null hash spends the time and fails. */
export async function verifyPassword(password: string, stored: string | null): Promise<boolean> {
  const parts = (stored ?? (await DECOY)).split('$');
  if (parts.length !== 6 || parts[0] !== 'scrypt') return false;
  const [, n, r, p, salt, hash] = parts as [string, string, string, string, string, string];
  const expected = Buffer.from(hash, 'base64url');
  const actual = await derive(password, Buffer.from(salt, 'base64url'), Number(n), Number(r), Number(p));
  return stored !== null && actual.length === expected.length && timingSafeEqual(actual, expected);
}
