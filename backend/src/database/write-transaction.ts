import { AsyncLocalStorage } from 'node:async_hooks';
import type { DataSource, EntityManager } from 'typeorm';

let queue: Promise<unknown> = Promise.resolve();
const activeManager = new AsyncLocalStorage<EntityManager>();

/**
 * TypeORM gives better-sqlite3 a single shared connection, so two concurrent transactions would
 * nest as savepoints of one another and commit or roll back each other's work: writes take turns.
 * A write started inside a running one (same async context) joins it instead of waiting for itself.
 * PostgreSQL has a connection per transaction and row locks, so it runs them directly.
 */
export function writeTransaction<T>(dataSource: DataSource, work: (manager: EntityManager) => Promise<T>): Promise<T> {
  const active = activeManager.getStore();
  if (active) return work(active);
  const transaction = () => dataSource.transaction((manager) => activeManager.run(manager, () => work(manager)));
  if (dataSource.options.type !== 'better-sqlite3') return transaction();
  const run = queue.then(transaction);
  queue = run.catch(() => undefined);
  return run;
}
