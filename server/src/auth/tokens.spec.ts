import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from './password.js';
import { hashToken, kindOf, newToken } from './tokens.js';

describe('tokens', () => {
  it('are prefixed by kind and recognised back', () => {
    for (const kind of ['session', 'api-key', 'embed', 'invitation'] as const) expect(kindOf(newToken(kind))).toBe(kind);
  });

  it('are never repeated and hash to 64 hex digits', () => {
    const a = newToken('session');
    expect(a).not.toBe(newToken('session'));
    expect(hashToken(a)).toMatch(/^[0-9a-f]{64}$/);
    expect(hashToken(a)).toBe(hashToken(a));
  });

  it('rejects strings of the wrong shape', () => {
    expect(kindOf('pws_short')).toBeNull();
    expect(kindOf('pwx_' + 'a'.repeat(43))).toBeNull();
    expect(kindOf('pws_' + 'a'.repeat(42) + '!')).toBeNull();
  });
});

describe('passwords', () => {
  it('verify against their own scrypt hash only, with a fresh salt each time', async () => {
    const one = await hashPassword('quillfield-belt-2026');
    const two = await hashPassword('quillfield-belt-2026');
    expect(one).not.toBe(two);
    expect(one).toMatch(/^scrypt\$16384\$8\$1\$/);
    expect(await verifyPassword('quillfield-belt-2026', one)).toBe(true);
    expect(await verifyPassword('quillfield-belt-2027', one)).toBe(false);
    expect(await verifyPassword('anything', null)).toBe(false);
    expect(await verifyPassword('anything', 'not-a-hash')).toBe(false);
  });
});
