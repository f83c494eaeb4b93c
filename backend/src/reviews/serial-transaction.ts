import type { DataSource, EntityManager } from 'typeorm';

let tail: Promise<unknown> = Promise.resolve();

/**
 * TypeORM's SQLite drivers share one connection, so two overlapping transactions would nest as
 * savepoints and could commit or roll back each other's work. Queue ours one after another;
 * PostgreSQL gives each transaction its own connection and row locks.
 */
export function serialTransaction<T>(dataSource: DataSource, work: (manager: EntityManager) => Promise<T>): Promise<T> {
  if (dataSource.options.type !== 'better-sqlite3') return dataSource.transaction(work);
  const run = tail.then(() => dataSource.transaction(work));
  tail = run.catch(() => undefined);
  return run;
}
