import type { QueryRunner, TableColumnOptions } from 'typeorm';

/** Column types resolved by the running driver, so one migration serves SQLite and PostgreSQL. */
export function columnTypes(queryRunner: QueryRunner) {
  const driver = queryRunner.connection.driver;
  const type = (t: unknown) => driver.normalizeType({ type: t as never });
  return {
    uuid: type('uuid'),
    timestamp: type(Date),
    boolean: type(Boolean),
    integer: type(Number),
    blob: queryRunner.connection.driver.options.type === 'postgres' ? 'bytea' : 'blob',
    text: 'text',
    varchar: 'varchar',
  };
}

export function idColumn(queryRunner: QueryRunner): TableColumnOptions {
  return { name: 'id', type: columnTypes(queryRunner).uuid, isPrimary: true, isGenerated: true, generationStrategy: 'uuid' };
}

export function createdAtColumn(queryRunner: QueryRunner, name = 'created_at'): TableColumnOptions {
  return { name, type: columnTypes(queryRunner).timestamp, default: 'CURRENT_TIMESTAMP' };
}
