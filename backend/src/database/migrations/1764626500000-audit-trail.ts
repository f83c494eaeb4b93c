import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes } from './helpers.js';

export class AuditTrail1764626500000 implements MigrationInterface {
  name = 'AuditTrail1764626500000';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.createTable(
      new Table({
        name: 'audit_entries',
        columns: [
          { name: 'seq', type: t.integer, isPrimary: true },
          { name: 'at', type: t.timestamp },
          { name: 'actor_id', type: t.uuid, isNullable: true },
          { name: 'actor_name', type: t.varchar, length: '254' },
          { name: 'action', type: t.varchar, length: '60' },
          { name: 'entity', type: t.varchar, length: '40' },
          { name: 'entity_id', type: t.varchar, length: '64', isNullable: true },
          { name: 'changes', type: t.text, isNullable: true },
          { name: 'reason', type: t.text, isNullable: true },
          { name: 'prev_hash', type: t.varchar, length: '64' },
          { name: 'hash', type: t.varchar, length: '64' },
        ],
        indices: [{ columnNames: ['entity', 'entity_id'] }],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('audit_entries');
  }
}
