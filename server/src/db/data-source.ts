import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { DataSource } from 'typeorm';
import { ENTITIES } from './entities.js';
import { MIGRATIONS } from './migrations.js';

/**
 * Opens the SQLite database (sqlite3 driver) in WAL mode and applies every pending migration.
 * The schema comes from migrations only: `synchronize` stays off.
 */
export async function openDataSource(databasePath: string): Promise<DataSource> {
  if (databasePath !== ':memory:') mkdirSync(dirname(databasePath), { recursive: true });
  const dataSource = new DataSource({
    type: 'sqlite',
    database: databasePath,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    migrationsRun: false,
    migrationsTransactionMode: 'each',
    synchronize: false,
    enableWAL: true,
    busyTimeout: 5000,
    logging: false,
  });
  await dataSource.initialize();
  // durable enough for WAL (every committed transaction survives a process kill; a power cut may lose the last)
  await dataSource.query('PRAGMA synchronous = NORMAL');
  await dataSource.runMigrations({ transaction: 'each' });
  return dataSource;
}
