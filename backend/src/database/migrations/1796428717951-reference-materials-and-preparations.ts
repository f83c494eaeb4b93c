import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, createdAtColumn, idColumn } from './helpers.js';

/** The register of reference materials with their certificates, and the standard preparations made from them. */
export class ReferenceMaterialsAndPreparations1796428717951 implements MigrationInterface {
  name = 'ReferenceMaterialsAndPreparations1796428717951';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    const double = 'double precision';
    await queryRunner.createTable(
      new Table({
        name: 'reference_materials',
        columns: [
          idColumn(queryRunner),
          { name: 'name', type: t.varchar, length: '160' },
          { name: 'analyte', type: t.varchar, length: '120' },
          { name: 'supplier', type: t.varchar, length: '160' },
          { name: 'lot', type: t.varchar, length: '80' },
          { name: 'certificate_number', type: t.varchar, length: '80' },
          { name: 'value_kind', type: t.varchar, length: '10' },
          { name: 'certified_value', type: double },
          { name: 'unit', type: t.varchar, length: '30' },
          { name: 'expanded_uncertainty', type: double, isNullable: true },
          { name: 'coverage_factor', type: double, isNullable: true },
          { name: 'standard_uncertainty', type: double, isNullable: true },
          { name: 'received_on', type: t.varchar, length: '10' },
          { name: 'opened_on', type: t.varchar, length: '10', isNullable: true },
          { name: 'expires_on', type: t.varchar, length: '10' },
          { name: 'storage', type: t.varchar, length: '500', default: "''" },
          { name: 'withdrawn_at', type: t.timestamp, isNullable: true },
          { name: 'withdrawn_reason', type: t.text, isNullable: true },
          { name: 'certificate_pdf', type: t.blob, isNullable: true },
          { name: 'certificate_file_name', type: t.varchar, length: '200', isNullable: true },
          { name: 'certificate_size_bytes', type: t.integer, isNullable: true },
          { name: 'certificate_sha256', type: t.varchar, length: '64', isNullable: true },
          { name: 'certificate_uploaded_at', type: t.timestamp, isNullable: true },
          { name: 'expiry_notice_sent_at', type: t.timestamp, isNullable: true },
          { name: 'created_by_id', type: t.uuid },
          createdAtColumn(queryRunner),
          createdAtColumn(queryRunner, 'updated_at'),
          { name: 'lock_version', type: t.integer, default: 1 },
        ],
        uniques: [{ columnNames: ['supplier', 'certificate_number', 'lot'] }],
        indices: [{ columnNames: ['expires_on'] }],
        foreignKeys: [
          { columnNames: ['created_by_id'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'standard_preparations',
        columns: [
          idColumn(queryRunner),
          { name: 'name', type: t.varchar, length: '160' },
          { name: 'material_id', type: t.uuid, isNullable: true },
          { name: 'input', type: t.text },
          { name: 'result', type: t.text },
          { name: 'engine_version', type: t.varchar, length: '40' },
          { name: 'created_by_id', type: t.uuid },
          createdAtColumn(queryRunner),
        ],
        indices: [{ columnNames: ['material_id'] }, { columnNames: ['created_at'] }],
        foreignKeys: [
          { columnNames: ['material_id'], referencedTableName: 'reference_materials', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
          { columnNames: ['created_by_id'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('standard_preparations');
    await queryRunner.dropTable('reference_materials');
  }
}
