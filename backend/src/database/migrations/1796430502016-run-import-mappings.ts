import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, idColumn } from './helpers.js';

/** The saved column mapping of instrument exports, one per method version. */
export class RunImportMappings1796430502016 implements MigrationInterface {
  name = 'RunImportMappings1796430502016';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.createTable(
      new Table({
        name: 'run_import_mappings',
        columns: [
          idColumn(queryRunner),
          { name: 'method_version_id', type: t.uuid, isUnique: true },
          { name: 'columns', type: t.text },
          { name: 'updated_by_name', type: t.varchar, length: '120' },
          { name: 'updated_at', type: t.timestamp },
          { name: 'lock_version', type: t.integer, default: 1 },
        ],
        foreignKeys: [
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
    await queryRunner.dropTable('run_import_mappings');
  }
}
