import { TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes } from './helpers.js';

/** Change control on method versions, and the written justification a signer gives for approving a failed study. */
export class MethodChangeControl1764650000000 implements MigrationInterface {
  name = 'MethodChangeControl1764650000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    const types = columnTypes(queryRunner);
    await queryRunner.addColumn('study_signatures', new TableColumn({ name: 'justification', type: types.text, isNullable: true }));
    await queryRunner.addColumns('method_versions', [
      new TableColumn({ name: 'change_kind', type: types.varchar, length: '30', isNullable: true }),
      new TableColumn({ name: 'revalidation_scope', type: types.text, isNullable: true }),
      new TableColumn({ name: 'activation_justification', type: types.text, isNullable: true }),
    ]);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropColumn('method_versions', 'activation_justification');
    await queryRunner.dropColumn('method_versions', 'revalidation_scope');
    await queryRunner.dropColumn('method_versions', 'change_kind');
    await queryRunner.dropColumn('study_signatures', 'justification');
  }
}
