import type { DataSource, EntityManager } from 'typeorm';

// TypeORM's sqlite driver shares ONE connection and one query runner: two overlapping
// `dataSource.transaction()` calls would nest as savepoints of each other and a rollback of one could undo
// the other. So every transaction of the app queues here, one at a time per data source.
const queues = new WeakMap<DataSource, Promise<unknown>>();

/** Runs `work` inside a transaction, after every transaction started earlier on this data source has ended. */
export function inTransaction<T>(dataSource: DataSource, work: (manager: EntityManager) => Promise<T>): Promise<T> {
  const previous = queues.get(dataSource) ?? Promise.resolve();
  const run = previous.catch(() => undefined).then(() => dataSource.transaction(work));
  queues.set(dataSource, run.catch(() => undefined));
  return run;
}
