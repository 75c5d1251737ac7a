import { availableParallelism } from 'node:os';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The repository root: `server/src` and `dist/server` are both two levels below it. */
export const REPO_ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');

/** Everything the server reads from its environment, parsed once at start. */
export interface ServerConfig {
  readonly port: number;
  /** SQLite file; created with its folder when missing. */
  readonly databasePath: string;
  readonly adminEmail: string | null;
  readonly adminPassword: string | null;
  /** Whether the demo users and models are seeded into an empty database. */
  readonly demo: boolean;
  /** Requests a minute per token and per IP address; 0 turns rate limiting off. */
  readonly rateLimitPerMinute: number;
  readonly nodeEnv: string;
  /** Whether this is a production run (no dev mailbox). */
  readonly isProduction: boolean;
  /** Outgoing SMTP; null starts the local fake SMTP server that captures mail. */
  readonly smtpUrl: string | null;
  /** Base URL for links in e-mails. */
  readonly publicUrl: string;
  /** Sender of every e-mail. */
  readonly mailFrom: string;
  /** Largest JSON body accepted. */
  readonly jsonBodyLimit: string;
  /** Lifetime of a session token. */
  readonly sessionTtlSeconds: number;
  /** Lifetime of an invitation link. */
  readonly invitationTtlSeconds: number;
  /** How many days before an API key expires its issuer gets a notice. */
  readonly keyExpiryNoticeDays: number;
  /** How often the key-expiry check runs (0 = never, e.g. in tests that call it by hand). */
  readonly keyExpiryCheckMs: number;
  /** The root OpenAPI document (split files beside it). */
  readonly openapiPath: string;
  /** Whether every response is checked against the OpenAPI document too (tests; a mismatch becomes a 500). */
  readonly validateResponses: boolean;
  /** Whether start-up and request-error logs are printed. */
  readonly quiet: boolean;
  /** Worker threads that run the engine (COMPUTE_WORKERS; default the available parallelism, at least 1). */
  readonly computeWorkers: number;
}

function integer(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value.trim() === '') return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 0) throw new Error(`${name} must be a non-negative integer, got "${value}"`);
  return n;
}

function text(value: string | undefined): string | null {
  return value === undefined || value.trim() === '' ? null : value.trim();
}

/** Reads the server configuration from environment variables (see CONTRACTS: PORT, DATABASE_PATH, …). */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): ServerConfig {
  const port = integer(env['PORT'], 4300, 'PORT');
  const nodeEnv = env['NODE_ENV'] ?? 'development';
  return {
    port,
    databasePath: resolve(env['DATABASE_PATH'] ?? resolve(REPO_ROOT, 'data', 'polewright.sqlite')),
    adminEmail: text(env['POLEWRIGHT_ADMIN_EMAIL'])?.toLowerCase() ?? null,
    adminPassword: text(env['POLEWRIGHT_ADMIN_PASSWORD']),
    demo: (env['POLEWRIGHT_DEMO'] ?? '').toLowerCase() !== 'off',
    rateLimitPerMinute: integer(env['RATE_LIMIT_PER_MINUTE'], 600, 'RATE_LIMIT_PER_MINUTE'),
    nodeEnv,
    isProduction: nodeEnv === 'production',
    smtpUrl: text(env['SMTP_URL']),
    publicUrl: (text(env['PUBLIC_URL']) ?? `http://localhost:${port}`).replace(/\/+$/, ''),
    mailFrom: text(env['MAIL_FROM']) ?? 'Polewright <polewright@localhost>',
    jsonBodyLimit: text(env['JSON_BODY_LIMIT']) ?? '1mb',
    sessionTtlSeconds: integer(env['SESSION_TTL_SECONDS'], 12 * 3600, 'SESSION_TTL_SECONDS'),
    invitationTtlSeconds: integer(env['INVITATION_TTL_SECONDS'], 7 * 24 * 3600, 'INVITATION_TTL_SECONDS'),
    keyExpiryNoticeDays: integer(env['KEY_EXPIRY_NOTICE_DAYS'], 7, 'KEY_EXPIRY_NOTICE_DAYS'),
    keyExpiryCheckMs: integer(env['KEY_EXPIRY_CHECK_MS'], 3600_000, 'KEY_EXPIRY_CHECK_MS'),
    openapiPath: resolve(REPO_ROOT, 'openapi', 'openapi.yaml'),
    validateResponses: env['OPENAPI_VALIDATE_RESPONSES'] === '1',
    quiet: env['POLEWRIGHT_QUIET'] === '1',
    computeWorkers: Math.max(1, integer(env['COMPUTE_WORKERS'], availableParallelism(), 'COMPUTE_WORKERS')),
  };
}
