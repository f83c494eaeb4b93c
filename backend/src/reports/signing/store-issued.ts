import type { DataSource, EntityTarget, ObjectLiteral, QueryDeepPartialEntity } from 'typeorm';
import type { AuditRecord, AuditService } from '../../audit/audit.service.js';
import { writeTransaction } from '../../database/write-transaction.js';

/**
 * Stores an issued document with its audit entry in one transaction. Where a document may be issued only once,
 * `stored` finds the one a concurrent request stored first, which then is the answer.
 */
export async function storeIssued<T extends ObjectLiteral>(
  dataSource: DataSource,
  audit: AuditService,
  entity: EntityTarget<T>,
  document: T,
  entry: AuditRecord,
  stored?: () => Promise<T | null>,
): Promise<T> {
  try {
    await writeTransaction(dataSource, async (manager) => {
      await manager.getRepository(entity).insert(document as QueryDeepPartialEntity<T>);
      await audit.record(entry, manager);
    });
  } catch (error) {
    const raced = await stored?.();
    if (raced) return raced;
    throw error;
  }
  return document;
}
