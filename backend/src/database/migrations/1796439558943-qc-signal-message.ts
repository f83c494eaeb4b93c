import { TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes } from './helpers.js';

/** The signal's sentence kept on its own, so the overview no longer reads it out of the e-mail text. */
export class QcSignalMessage1796439558943 implements MigrationInterface {
  name = 'QcSignalMessage1796439558943';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.addColumn(
      'qc_signal_notices',
      new TableColumn({ name: 'message', type: t.varchar, length: '500', isNullable: true }),
    );
    const notices: { id: string; body: string }[] = await queryRunner.query('SELECT id, body FROM qc_signal_notices');
    const placeholder = queryRunner.connection.driver.options.type === 'postgres' ? ['$1', '$2'] : ['?', '?'];
    for (const notice of notices) {
      const sentence = notice.body.split('\n')[2]?.slice(0, 500) ?? null;
      await queryRunner.query(`UPDATE qc_signal_notices SET message = ${placeholder[0]} WHERE id = ${placeholder[1]}`, [
        sentence,
        notice.id,
      ]);
    }
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropColumn('qc_signal_notices', 'message');
  }
}
