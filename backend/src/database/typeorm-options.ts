import type { DataSourceOptions } from 'typeorm';
import type { DatabaseConfig } from '../config/app.config.js';
import { entities } from './entities.js';
import { migrations } from './migrations/index.js';
import { POSTGRES_POOL_SIZE } from './write-transaction.js';
import { AuditEntrySubscriber } from '../audit/audit-entry.subscriber.js';

export function typeormOptions(database: DatabaseConfig): DataSourceOptions {
  const common = {
    entities,
    migrations,
    subscribers: [AuditEntrySubscriber],
    migrationsRun: true,
    synchronize: false,
    logging: ['error' as const],
  };
  if (database.type === 'postgres')
    return { ...common, type: 'postgres', url: database.url, uuidExtension: 'pgcrypto', poolSize: POSTGRES_POOL_SIZE };
  return {
    ...common,
    type: 'better-sqlite3',
    database: database.path,
    enableWAL: true,
    prepareDatabase: (db: { pragma(sql: string): unknown }) => {
      db.pragma('foreign_keys = ON');
      db.pragma('busy_timeout = 5000');
      // A committed audit entry must survive a power cut, not only a crash of the process.
      db.pragma('synchronous = FULL');
    },
  };
}
