import { Table, type MigrationInterface, type QueryRunner, type TableForeignKeyOptions } from 'typeorm';
import { columnTypes, createdAtColumn, idColumn } from './helpers.js';

const ref = (column: string, table: string, onDelete: TableForeignKeyOptions['onDelete']): TableForeignKeyOptions => ({
  columnNames: [column],
  referencedTableName: table,
  referencedColumnNames: ['id'],
  onDelete,
});

export class MethodsStudiesRuns1764626600000 implements MigrationInterface {
  name = 'MethodsStudiesRuns1764626600000';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    const uuidRef = (name: string, isNullable = false) => ({ name, type: t.uuid, isNullable });

    await queryRunner.createTable(
      new Table({
        name: 'methods',
        columns: [
          idColumn(queryRunner),
          { name: 'name', type: t.varchar, length: '160', isUnique: true },
          { name: 'analyte', type: t.varchar, length: '120' },
          { name: 'matrix', type: t.varchar, length: '120' },
          { name: 'technique', type: t.varchar, length: '80' },
          { name: 'x_unit', type: t.varchar, length: '30' },
          { name: 'y_unit', type: t.varchar, length: '30' },
          { name: 'purpose', type: t.varchar, length: '40' },
          uuidRef('created_by_id'),
          createdAtColumn(queryRunner),
          createdAtColumn(queryRunner, 'updated_at'),
        ],
        foreignKeys: [ref('created_by_id', 'users', 'RESTRICT')],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'method_versions',
        columns: [
          idColumn(queryRunner),
          uuidRef('method_id'),
          { name: 'number', type: t.integer },
          { name: 'change_summary', type: t.text },
          { name: 'status', type: t.varchar, length: '10' },
          { name: 'criteria', type: t.text },
          { name: 'settings', type: t.text },
          uuidRef('created_by_id'),
          createdAtColumn(queryRunner),
          { name: 'lock_version', type: t.integer },
        ],
        uniques: [{ columnNames: ['method_id', 'number'] }],
        foreignKeys: [ref('method_id', 'methods', 'CASCADE'), ref('created_by_id', 'users', 'RESTRICT')],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'validation_studies',
        columns: [
          idColumn(queryRunner),
          uuidRef('method_version_id'),
          { name: 'title', type: t.varchar, length: '200' },
          { name: 'status', type: t.varchar, length: '12' },
          { name: 'data', type: t.text },
          { name: 'result', type: t.text, isNullable: true },
          { name: 'result_errors', type: t.text, isNullable: true },
          { name: 'engine_version', type: t.varchar, length: '20' },
          { name: 'data_hash', type: t.varchar, length: '64' },
          { name: 'meta', type: t.text },
          uuidRef('author_id'),
          { name: 'editor_ids', type: t.text },
          uuidRef('copied_from_id', true),
          { name: 'submitted_at', type: t.timestamp, isNullable: true },
          { name: 'approved_at', type: t.timestamp, isNullable: true },
          createdAtColumn(queryRunner),
          createdAtColumn(queryRunner, 'updated_at'),
          { name: 'lock_version', type: t.integer },
        ],
        indices: [{ columnNames: ['status'] }, { columnNames: ['method_version_id'] }, { columnNames: ['author_id'] }],
        foreignKeys: [ref('method_version_id', 'method_versions', 'RESTRICT'), ref('author_id', 'users', 'RESTRICT')],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'study_signatures',
        columns: [
          idColumn(queryRunner),
          uuidRef('study_id'),
          uuidRef('signer_id'),
          { name: 'signer_name', type: t.varchar, length: '120' },
          { name: 'signer_role', type: t.varchar, length: '20' },
          { name: 'meaning', type: t.varchar, length: '30' },
          { name: 'signed_at', type: t.timestamp },
          { name: 'content_hash', type: t.varchar, length: '64' },
          { name: 'comment', type: t.text, isNullable: true },
          { name: 'data_snapshot', type: t.text, isNullable: true },
        ],
        indices: [{ columnNames: ['study_id'] }],
        foreignKeys: [ref('study_id', 'validation_studies', 'CASCADE'), ref('signer_id', 'users', 'RESTRICT')],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'study_comments',
        columns: [
          idColumn(queryRunner),
          uuidRef('study_id'),
          { name: 'section', type: t.varchar, length: '20' },
          uuidRef('thread_id', true),
          uuidRef('author_id'),
          { name: 'author_name', type: t.varchar, length: '120' },
          { name: 'body', type: t.text },
          { name: 'resolved', type: t.boolean, default: false },
          createdAtColumn(queryRunner),
        ],
        indices: [{ columnNames: ['study_id'] }],
        foreignKeys: [ref('study_id', 'validation_studies', 'CASCADE'), ref('author_id', 'users', 'RESTRICT')],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'notifications',
        columns: [
          idColumn(queryRunner),
          uuidRef('user_id'),
          { name: 'kind', type: t.varchar, length: '40' },
          { name: 'message', type: t.varchar, length: '300' },
          { name: 'link', type: t.varchar, length: '200', isNullable: true },
          { name: 'read_at', type: t.timestamp, isNullable: true },
          createdAtColumn(queryRunner),
        ],
        indices: [{ columnNames: ['user_id', 'read_at'] }],
        foreignKeys: [ref('user_id', 'users', 'CASCADE')],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'validation_reports',
        columns: [
          idColumn(queryRunner),
          { ...uuidRef('study_id'), isUnique: true },
          uuidRef('method_version_id'),
          { name: 'pdf', type: t.blob },
          { name: 'sha256', type: t.varchar, length: '64', isUnique: true },
          { name: 'size_bytes', type: t.integer },
          { name: 'signed_at', type: t.timestamp },
          createdAtColumn(queryRunner),
        ],
        foreignKeys: [ref('study_id', 'validation_studies', 'RESTRICT'), ref('method_version_id', 'method_versions', 'RESTRICT')],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'runs',
        columns: [
          idColumn(queryRunner),
          uuidRef('method_version_id'),
          { name: 'title', type: t.varchar, length: '200' },
          { name: 'status', type: t.varchar, length: '10' },
          { name: 'model', type: t.varchar, length: '30' },
          { name: 'data', type: t.text },
          { name: 'result', type: t.text },
          { name: 'rejection_reasons', type: t.text },
          { name: 'engine_version', type: t.varchar, length: '20' },
          { name: 'data_hash', type: t.varchar, length: '64' },
          uuidRef('author_id'),
          createdAtColumn(queryRunner),
        ],
        indices: [{ columnNames: ['method_version_id', 'created_at'] }],
        foreignKeys: [ref('method_version_id', 'method_versions', 'RESTRICT'), ref('author_id', 'users', 'RESTRICT')],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const table of [
      'runs',
      'validation_reports',
      'notifications',
      'study_comments',
      'study_signatures',
      'validation_studies',
      'method_versions',
      'methods',
    ]) {
      await queryRunner.dropTable(table);
    }
  }
}
