import { TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes } from './helpers.js';

/** Keeps the title and record fields (conclusion, instrument, dates) an author signed, so a resubmission shows their changes too. */
export class SignatureMetaSnapshot1796428791270 implements MigrationInterface {
  name = 'SignatureMetaSnapshot1796428791270';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.addColumn(
      'study_signatures',
      new TableColumn({ name: 'meta_snapshot', type: columnTypes(queryRunner).text, isNullable: true }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropColumn('study_signatures', 'meta_snapshot');
  }
}
