import type { DataSource, EntityManager } from 'typeorm';

let queue: Promise<unknown> = Promise.resolve();

/**
 * TypeORM gives better-sqlite3 a single shared connection, so two concurrent transactions would
 * nest as savepoints of one another and commit or roll back each other's work: writes take turns.
 * PostgreSQL has a connection per transaction and row locks, so it runs them directly.
 */
export function writeTransaction<T>(dataSource: DataSource, work: (manager: EntityManager) => Promise<T>): Promise<T> {
  if (dataSource.options.type !== 'better-sqlite3') return dataSource.transaction(work);
  const run = queue.then(() => dataSource.transaction(work));
  queue = run.catch(() => undefined);
  return run;
}
