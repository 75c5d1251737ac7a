import type { DataSource } from 'typeorm';
import { type ComputePool, createComputePool } from './compute/compute-pool.js';
import type { ServerConfig } from './config.js';
import { openDataSource } from './db/data-source.js';
import { createMailer, type Mailer } from './mail/mailer.js';
import { seed } from './seed/seed.js';

/** What every router, service and repository receives (CONTRACTS: context.ts). */
export interface AppContext {
  dataSource: DataSource;
  config: ServerConfig;
  mailer: Mailer;
  /** Injected clock for tests; the real time when absent. */
  clock?: () => Date;
  /** Where the server writes its log lines (console when absent). */
  log?: (message: string) => void;
  /** Worker threads running the engine (COMPUTE_WORKERS); compute runs on the event loop when absent. */
  compute?: ComputePool;
}

/** The current time as the context sees it. */
export function now(context: AppContext): Date {
  return context.clock ? context.clock() : new Date();
}

/** Writes one log line unless the configuration is quiet. */
export function logLine(context: AppContext, message: string): void {
  if (context.config.quiet) return;
  (context.log ?? console.log)(message);
}

/** Options for `createContext`. */
export interface ContextOptions {
  clock?: () => Date;
  log?: (message: string) => void;
}

/** Opens the database (migrations applied), starts the mailer (fake SMTP when needed) and seeds an empty database. */
export async function createContext(config: ServerConfig, options: ContextOptions = {}): Promise<AppContext> {
  const dataSource = await openDataSource(config.databasePath);
  const mailer = await createMailer(config);
  const compute = createComputePool(config.computeWorkers);
  const context: AppContext = { dataSource, config, mailer, clock: options.clock, log: options.log, compute };
  try {
    await seed(context);
  } catch (error) {
    await closeContext(context);
    throw error;
  }
  return context;
}

/** Stops the compute workers and the mailer and closes the database. */
export async function closeContext(context: AppContext): Promise<void> {
  await context.compute?.close();
  await context.mailer.close();
  if (context.dataSource.isInitialized) await context.dataSource.destroy();
}
