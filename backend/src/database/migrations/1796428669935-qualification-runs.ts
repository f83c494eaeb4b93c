import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes } from './helpers.js';

/** Runs of the self-qualification of the calculations, each with its signed report. */
export class QualificationRuns1796428669935 implements MigrationInterface {
  name = 'QualificationRuns1796428669935';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.createTable(
      new Table({
        name: 'qualification_runs',
        columns: [
          { name: 'id', type: t.uuid, isPrimary: true },
          { name: 'ran_at', type: t.timestamp },
          { name: 'ran_by_id', type: t.uuid },
          { name: 'ran_by_name', type: t.varchar, length: '120' },
          { name: 'installation', type: t.text },
          { name: 'total', type: t.integer },
          { name: 'passed', type: t.integer },
          { name: 'all_passed', type: t.boolean },
          { name: 'results', type: t.text },
          { name: 'pdf', type: t.blob },
          { name: 'sha256', type: t.varchar, length: '64' },
          { name: 'size_bytes', type: t.integer },
        ],
        indices: [{ columnNames: ['ran_at'] }, { columnNames: ['sha256'], isUnique: true }],
        foreignKeys: [{ columnNames: ['ran_by_id'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' }],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('qualification_runs');
  }
}
