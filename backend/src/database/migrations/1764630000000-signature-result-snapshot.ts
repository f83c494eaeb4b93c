import { TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes } from './helpers.js';

/** Keeps the result beside the data an author signed, so a superseded signature can still be checked. */
export class SignatureResultSnapshot1764630000000 implements MigrationInterface {
  name = 'SignatureResultSnapshot1764630000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.addColumn(
      'study_signatures',
      new TableColumn({ name: 'result_snapshot', type: columnTypes(queryRunner).text, isNullable: true }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropColumn('study_signatures', 'result_snapshot');
  }
}
