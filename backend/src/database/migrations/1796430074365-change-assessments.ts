import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, createdAtColumn, idColumn } from './helpers.js';

/** Signed change assessments: a quality manager's comparison of a new method version with an earlier one, as a signed PDF. */
export class ChangeAssessments1796430074365 implements MigrationInterface {
  name = 'ChangeAssessments1796430074365';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.createTable(
      new Table({
        name: 'change_assessments',
        columns: [
          idColumn(queryRunner),
          { name: 'method_version_id', type: t.uuid },
          { name: 'compared_version_id', type: t.uuid },
          { name: 'from_study_id', type: t.uuid, isNullable: true },
          { name: 'to_study_id', type: t.uuid, isNullable: true },
          { name: 'signer_id', type: t.uuid },
          { name: 'signer_name', type: t.varchar, length: '120' },
          { name: 'meaning', type: t.varchar, length: '30' },
          { name: 'statement', type: t.text },
          { name: 'pdf', type: t.blob },
          { name: 'sha256', type: t.varchar, length: '64', isUnique: true },
          { name: 'size_bytes', type: t.integer },
          { name: 'signed_at', type: t.timestamp },
          createdAtColumn(queryRunner),
        ],
        indices: [{ columnNames: ['method_version_id', 'signed_at'] }],
        foreignKeys: [
          {
            columnNames: ['method_version_id'],
            referencedTableName: 'method_versions',
            referencedColumnNames: ['id'],
            onDelete: 'RESTRICT',
          },
          {
            columnNames: ['compared_version_id'],
            referencedTableName: 'method_versions',
            referencedColumnNames: ['id'],
            onDelete: 'RESTRICT',
          },
          {
            columnNames: ['from_study_id'],
            referencedTableName: 'validation_studies',
            referencedColumnNames: ['id'],
            onDelete: 'RESTRICT',
          },
          { columnNames: ['to_study_id'], referencedTableName: 'validation_studies', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
          { columnNames: ['signer_id'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('change_assessments');
  }
}
