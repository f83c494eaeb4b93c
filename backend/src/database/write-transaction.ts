import { AsyncLocalStorage } from 'node:async_hooks';
import type { DataSource, EntityManager } from 'typeorm';

let queue: Promise<unknown> = Promise.resolve();
const activeManager = new AsyncLocalStorage<EntityManager>();

/** Connections per server process on PostgreSQL. */
export const POSTGRES_POOL_SIZE = 10;
// Write transactions take at most half the pool: one waiting for the audit chain's lock holds its connection,
// and the one holding the lock may still read through the pool (outside its transaction) before it commits.
const POSTGRES_CONCURRENT_WRITES = POSTGRES_POOL_SIZE / 2;
let postgresWriters = 0;
const waitingWriters: (() => void)[] = [];

async function withPostgresWriteSlot<T>(work: () => Promise<T>): Promise<T> {
  if (postgresWriters < POSTGRES_CONCURRENT_WRITES) postgresWriters++;
  else await new Promise<void>((resolve) => waitingWriters.push(resolve));
  try {
    return await work();
  } finally {
    const next = waitingWriters.shift();
    if (next) next();
    else postgresWriters--;
  }
}

/**
 * TypeORM gives better-sqlite3 a single shared connection, so two concurrent transactions would
 * nest as savepoints of one another and commit or roll back each other's work: writes take turns.
 * A write started inside a running one (same async context) joins it instead of waiting for itself.
 * PostgreSQL has a connection per transaction and row locks, so it runs several at once, never more
 * than half the pool, so that the pool cannot run dry while they queue for the audit chain's lock.
 */
export function writeTransaction<T>(dataSource: DataSource, work: (manager: EntityManager) => Promise<T>): Promise<T> {
  const active = activeManager.getStore();
  if (active) return work(active);
  const transaction = () => dataSource.transaction((manager) => activeManager.run(manager, () => work(manager)));
  if (dataSource.options.type !== 'better-sqlite3') return withPostgresWriteSlot(transaction);
  const run = queue.then(transaction);
  queue = run.catch(() => undefined);
  return run;
}
