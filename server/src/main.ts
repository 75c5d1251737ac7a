import type { AddressInfo } from 'node:net';
import { startKeyExpiryNotices } from './api-keys/key-expiry-notices.js';
import { createApp } from './app.js';
import { loadConfig } from './config.js';
import { closeContext, createContext, logLine } from './context.js';

/** Starts the server: context (database, mail, seed), the app on PORT, key-expiry notices; stops cleanly on SIGTERM/SIGINT. */
async function main(): Promise<void> {
  const config = loadConfig();
  const context = await createContext(config);
  const app = createApp(context);
  context.compute?.warm();
  const stopNotices = startKeyExpiryNotices(context);
  const server = app.listen(config.port, () => {
    const { port } = server.address() as AddressInfo;
    logLine(context, `Polewright listening on http://localhost:${port}: console /, API /api/v1, docs /api/docs, embedding demo /embed-demo/ (database ${config.databasePath}${context.mailer.captured ? ', fake SMTP: mail at GET /api/v1/dev/mailbox' : ''})`);
  });
  server.on('error', (error) => {
    console.error(`cannot listen on port ${config.port}: ${error.message}`);
    process.exit(1);
  });
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logLine(context, `${signal}: shutting down`);
    stopNotices();
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(() => {
      closeContext(context).then(
        () => process.exit(0),
        () => process.exit(1),
      );
    });
    server.closeIdleConnections();
  };
  // only with --expose-gc (the API benchmark does that): SIGUSR2 collects garbage, so that memory can be
  // judged after a settle instead of at whatever point the collector happened to be
  const collect = (globalThis as { gc?: () => void }).gc;
  if (collect) process.on('SIGUSR2', () => collect());
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}

main().catch((error: unknown) => {
  console.error('Polewright failed to start:', error instanceof Error ? error.message : error);
  process.exit(1);
});
