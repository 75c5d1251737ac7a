import type { Scope } from '../api/api-types';

/**
 * An invented plant for the example call: a belt drive of the demo company, integrator plus two lags
 * (made up for the example; any proper transfer function in `s` works).
 */
export const EXAMPLE_PLANT = { expression: '4.2/(s*(s+1.5)*(s+6))' } as const;

/** A ready-to-run example of a call with a new key against this server's origin. */
export interface KeyExample {
  /** What the call does, in one line. */
  readonly summary: string;
  /** The shell command (POSIX shell quoting). */
  readonly command: string;
}

/**
 * The `curl` command a script author can run at once with a new key: a pole-path computation
 * (`POST /api/v1/locus`) when the key may compute, else the model list the key may read.
 */
export function keyExample(origin: string, secret: string, scopes: readonly Scope[]): KeyExample {
  const base = origin.replace(/\/+$/, '');
  if (scopes.includes('compute') || !scopes.includes('models:read')) {
    const body = JSON.stringify({ plant: EXAMPLE_PLANT });
    return {
      summary: scopes.includes('compute')
        ? 'Computes the pole paths of a small invented belt-drive plant.'
        : 'Shows how a script sends the key. This key has no "Compute" scope, so this very call is refused (403).',
      command: [`curl -X POST '${base}/api/v1/locus' \\`, `  -H 'Authorization: Bearer ${secret}' \\`, `  -H 'Content-Type: application/json' \\`, `  -d '${body}'`].join('\n'),
    };
  }
  return {
    summary: 'Lists the first models of the library.',
    command: [`curl '${base}/api/v1/models?pageSize=5' \\`, `  -H 'Authorization: Bearer ${secret}'`].join('\n'),
  };
}
