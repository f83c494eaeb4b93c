import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, idColumn } from './helpers.js';

/** Control-chart baselines per method version and the record of signals e-mailed to quality managers. */
export class QcTrends1796429841749 implements MigrationInterface {
  name = 'QcTrends1796429841749';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    const version = {
      columnNames: ['method_version_id'],
      referencedTableName: 'method_versions',
      referencedColumnNames: ['id'],
      onDelete: 'RESTRICT',
    };
    await queryRunner.createTable(
      new Table({
        name: 'qc_baselines',
        columns: [
          idColumn(queryRunner),
          { name: 'method_version_id', type: t.uuid, isUnique: true },
          { name: 'run_ids', type: t.text },
          { name: 'chosen_by_id', type: t.uuid },
          { name: 'chosen_by_name', type: t.varchar, length: '120' },
          { name: 'chosen_at', type: t.timestamp },
          { name: 'reason', type: t.text },
          { name: 'lock_version', type: t.integer, default: 1 },
        ],
        foreignKeys: [
          version,
          { columnNames: ['chosen_by_id'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'qc_signal_notices',
        columns: [
          idColumn(queryRunner),
          { name: 'method_version_id', type: t.uuid },
          { name: 'series', type: t.varchar, length: '12' },
          { name: 'rule', type: t.varchar, length: '30' },
          { name: 'point_key', type: t.varchar, length: '200' },
          { name: 'recipients', type: t.text },
          { name: 'subject', type: t.varchar, length: '300' },
          { name: 'body', type: t.text },
          { name: 'sent_at', type: t.timestamp },
        ],
        uniques: [{ columnNames: ['method_version_id', 'series', 'rule', 'point_key'] }],
        foreignKeys: [version],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('qc_signal_notices');
    await queryRunner.dropTable('qc_baselines');
  }
}
