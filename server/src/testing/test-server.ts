import { mkdtempSync, rmSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createApp } from '../app.js';
import { loadConfig, type ServerConfig } from '../config.js';
import { type AppContext, closeContext, createContext } from '../context.js';
import { DEMO_PEOPLE } from '../seed/demo-people.js';
import { openSession } from '../sessions/sessions.service.js';
import { findUserByEmail } from '../users/users.repository.js';

/** Options of a test server. */
export interface TestServerOptions {
  /** Environment variables on top of the test defaults (rate limit off, fake SMTP, demo on, quiet). */
  env?: Record<string, string>;
  /** Injected clock (e.g. to expire sessions and keys without waiting). */
  clock?: () => Date;
}

/** A running test server. */
export interface TestServer {
  baseUrl: string;
  context: AppContext;
  config: ServerConfig;
  /** Session tokens of the seeded demo users. */
  tokens: { admin: string; engineer: string; viewer: string };
  close(): Promise<void>;
}

/**
 * Starts the real app on a fresh temporary SQLite file (migrations applied, demo seeded) on an ephemeral
 * port, over real HTTP, with a session for each demo role.
 */
export async function startTestServer(options: TestServerOptions = {}): Promise<TestServer> {
  const folder = mkdtempSync(join(tmpdir(), 'polewright-test-'));
  const config = loadConfig({ NODE_ENV: 'test', POLEWRIGHT_QUIET: '1', RATE_LIMIT_PER_MINUTE: '0', KEY_EXPIRY_CHECK_MS: '0', ...options.env, DATABASE_PATH: join(folder, 'test.sqlite'), PORT: '0' });
  const context = await createContext(config, { clock: options.clock });
  const server: Server = await new Promise((resolve) => {
    const s = createApp(context).listen(0, '127.0.0.1', () => resolve(s));
  });
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const tokens = { admin: '', engineer: '', viewer: '' };
  for (const person of DEMO_PEOPLE) {
    const user = await findUserByEmail(context, person.email);
    if (user) tokens[person.role] = (await openSession(context, user.id)).token;
  }
  return {
    baseUrl,
    context,
    config,
    tokens,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await closeContext(context);
      rmSync(folder, { recursive: true, force: true });
    },
  };
}
