import { TableIndex, type MigrationInterface, type QueryRunner } from 'typeorm';

/** One index per sort and filter the lists offer, each ending in the id so keyset pages walk it in order. */
const INDEXES: Record<string, string[][]> = {
  validation_studies: [
    ['updated_at', 'id'],
    ['created_at', 'id'],
    ['title', 'id'],
    ['status', 'id'],
    ['status', 'updated_at', 'id'],
    ['status', 'submitted_at', 'id'],
    ['author_id', 'updated_at', 'id'],
    ['method_version_id', 'updated_at', 'id'],
  ],
  runs: [
    ['created_at', 'id'],
    ['status', 'created_at', 'id'],
    ['method_version_id', 'created_at', 'id'],
    ['review_status', 'submitted_at', 'id'],
  ],
};

const indexName = (table: string, columns: string[]) => `IDX_${table}_${columns.join('_')}_keyset`;

export class ListKeysetIndexes1796439581141 implements MigrationInterface {
  name = 'ListKeysetIndexes1796439581141';

  async up(queryRunner: QueryRunner): Promise<void> {
    for (const [table, indexes] of Object.entries(INDEXES)) {
      await queryRunner.createIndices(
        table,
        indexes.map((columnNames) => new TableIndex({ name: indexName(table, columnNames), columnNames })),
      );
    }
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const [table, indexes] of Object.entries(INDEXES)) {
      for (const columnNames of indexes) await queryRunner.dropIndex(table, indexName(table, columnNames));
    }
  }
}
