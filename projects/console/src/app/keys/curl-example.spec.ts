import { keyExample } from './curl-example';
import { keyStatus } from './key-status';

describe('keyExample', () => {
  it('is a locus computation against this origin when the key may compute', () => {
    const example = keyExample('https://loops.quillfield.example/', 'pwk_abc', ['compute']);
    expect(example.command.split('\n')).toEqual([
      "curl -X POST 'https://loops.quillfield.example/api/v1/locus' \\",
      "  -H 'Authorization: Bearer pwk_abc' \\",
      "  -H 'Content-Type: application/json' \\",
      `  -d '{"plant":{"expression":"4.2/(s*(s+1.5)*(s+6))"}}'`,
    ]);
  });

  it('lists models for a read-only key, and warns that a write-only key cannot compute', () => {
    expect(keyExample('http://localhost:4300', 'pwk_r', ['models:read']).command).toContain("curl 'http://localhost:4300/api/v1/models?pageSize=5'");
    expect(keyExample('http://localhost:4300', 'pwk_w', ['models:write']).summary).toContain('refused (403)');
  });
});

describe('keyStatus', () => {
  const now = Date.parse('2026-12-02T12:00:00Z');
  it('is revoked before anything else, expired at its expiry, active otherwise', () => {
    expect(keyStatus({ revokedAt: '2026-12-01T00:00:00Z', expiresAt: '2026-11-01T00:00:00Z' }, now)).toBe('revoked');
    expect(keyStatus({ revokedAt: null, expiresAt: '2026-12-02T12:00:00Z' }, now)).toBe('expired');
    expect(keyStatus({ revokedAt: null, expiresAt: '2026-12-02T12:00:01Z' }, now)).toBe('active');
    expect(keyStatus({ revokedAt: null, expiresAt: null }, now)).toBe('active');
  });
});
