import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';

// The built core must be importable by package name from plain Node ESM at the repository root, the
// way scripts and the server use it (requires `npm run build` first, as the README's test command does).
describe('the built @polewright/locus-core package', () => {
  it('imports by name from plain Node ESM and computes a locus', () => {
    const script = `
      const core = await import('@polewright/locus-core');
      const result = core.locus({ plant: { numerator: [1], denominator: [1, 3, 2, 0] } });
      console.log(JSON.stringify({ branches: result.branches.length, limit: result.stableGainRanges[0].to }));
    `;
    const output = execFileSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8' });
    const parsed = JSON.parse(output.trim());
    // K/(s(s+1)(s+2)): Routh gives the limit K = 1·2·(1+2) = 6 (cubic condition a1·a2 > a0·a3)
    expect(parsed.branches).toBe(3);
    expect(Math.abs(parsed.limit - 6)).toBeLessThan(1e-12);
  });
});
