import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, createdAtColumn, idColumn } from './helpers.js';

/** Signed results reports of released runs, one per run. */
export class RunResultsReports1796428699593 implements MigrationInterface {
  name = 'RunResultsReports1796428699593';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.createTable(
      new Table({
        name: 'run_results_reports',
        columns: [
          idColumn(queryRunner),
          { name: 'run_id', type: t.uuid, isUnique: true },
          { name: 'method_version_id', type: t.uuid },
          { name: 'pdf', type: t.blob },
          { name: 'sha256', type: t.varchar, length: '64', isUnique: true },
          { name: 'size_bytes', type: t.integer },
          { name: 'signed_at', type: t.timestamp },
          createdAtColumn(queryRunner),
        ],
        foreignKeys: [
          { columnNames: ['run_id'], referencedTableName: 'runs', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
          {
            columnNames: ['method_version_id'],
            referencedTableName: 'method_versions',
            referencedColumnNames: ['id'],
            onDelete: 'RESTRICT',
          },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('run_results_reports');
  }
}
