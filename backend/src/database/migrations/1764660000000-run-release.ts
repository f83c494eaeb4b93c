import { Table, TableColumn, TableForeignKey, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, idColumn } from './helpers.js';

/** Second-person release of routine runs: review status, lock version, signatures and the correction link. */
export class RunRelease1764660000000 implements MigrationInterface {
  name = 'RunRelease1764660000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.addColumns('runs', [
      new TableColumn({ name: 'review_status', type: t.varchar, length: '12', default: "'calculated'" }),
      new TableColumn({ name: 'lock_version', type: t.integer, default: 1 }),
      new TableColumn({ name: 'submitted_at', type: t.timestamp, isNullable: true }),
      new TableColumn({ name: 'released_at', type: t.timestamp, isNullable: true }),
      new TableColumn({ name: 'return_comment', type: t.text, isNullable: true }),
      new TableColumn({ name: 'supersedes_id', type: t.uuid, isNullable: true }),
      new TableColumn({ name: 'superseded_by_id', type: t.uuid, isNullable: true }),
      new TableColumn({ name: 'supersede_reason', type: t.text, isNullable: true }),
    ]);
    await queryRunner.createForeignKeys('runs', [
      new TableForeignKey({
        columnNames: ['supersedes_id'],
        referencedTableName: 'runs',
        referencedColumnNames: ['id'],
        onDelete: 'RESTRICT',
      }),
      new TableForeignKey({
        columnNames: ['superseded_by_id'],
        referencedTableName: 'runs',
        referencedColumnNames: ['id'],
        onDelete: 'RESTRICT',
      }),
    ]);
    await queryRunner.createTable(
      new Table({
        name: 'run_signatures',
        columns: [
          idColumn(queryRunner),
          { name: 'run_id', type: t.uuid },
          { name: 'signer_id', type: t.uuid },
          { name: 'signer_name', type: t.varchar, length: '120' },
          { name: 'signer_role', type: t.varchar, length: '20' },
          { name: 'meaning', type: t.varchar, length: '30' },
          { name: 'signed_at', type: t.timestamp },
          { name: 'content_hash', type: t.varchar, length: '64' },
        ],
        indices: [{ columnNames: ['run_id', 'signed_at'] }],
        foreignKeys: [
          { columnNames: ['run_id'], referencedTableName: 'runs', referencedColumnNames: ['id'], onDelete: 'CASCADE' },
          { columnNames: ['signer_id'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('run_signatures');
    const table = await queryRunner.getTable('runs');
    for (const key of table?.foreignKeys.filter((fk) => ['supersedes_id', 'superseded_by_id'].includes(fk.columnNames[0])) ?? []) {
      await queryRunner.dropForeignKey('runs', key);
    }
    for (const column of [
      'supersede_reason',
      'superseded_by_id',
      'supersedes_id',
      'return_comment',
      'released_at',
      'submitted_at',
      'lock_version',
      'review_status',
    ]) {
      await queryRunner.dropColumn('runs', column);
    }
  }
}
