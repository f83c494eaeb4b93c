import { Table, TableIndex, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, idColumn } from './helpers.js';

/** Indexes for filtering the audit trail by time, person and action, and the signed reviews of the trail. */
export class AuditReview1796428669934 implements MigrationInterface {
  name = 'AuditReview1796428669934';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.createIndices('audit_entries', [
      new TableIndex({ name: 'IDX_audit_entries_at', columnNames: ['at'] }),
      new TableIndex({ name: 'IDX_audit_entries_actor_seq', columnNames: ['actor_id', 'seq'] }),
      new TableIndex({ name: 'IDX_audit_entries_action_seq', columnNames: ['action', 'seq'] }),
    ]);
    await queryRunner.createTable(
      new Table({
        name: 'audit_reviews',
        columns: [
          idColumn(queryRunner),
          { name: 'scope', type: t.varchar, length: '10' },
          { name: 'period_from', type: t.varchar, length: '10', isNullable: true },
          { name: 'period_to', type: t.varchar, length: '10', isNullable: true },
          { name: 'record_kind', type: t.varchar, length: '20', isNullable: true },
          { name: 'record_id', type: t.varchar, length: '64', isNullable: true },
          { name: 'subject', type: t.varchar, length: '300' },
          { name: 'reviewer_id', type: t.uuid },
          { name: 'reviewer_name', type: t.varchar, length: '120' },
          { name: 'reviewed_at', type: t.timestamp },
          { name: 'comment', type: t.text, isNullable: true },
          { name: 'last_seq', type: t.integer },
          { name: 'entries', type: t.integer },
          { name: 'chain_intact', type: t.boolean },
        ],
        indices: [{ columnNames: ['reviewed_at'] }, { columnNames: ['record_kind', 'record_id'] }],
        foreignKeys: [{ columnNames: ['reviewer_id'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'RESTRICT' }],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('audit_reviews');
    for (const name of ['IDX_audit_entries_at', 'IDX_audit_entries_actor_seq', 'IDX_audit_entries_action_seq']) {
      await queryRunner.dropIndex('audit_entries', name);
    }
  }
}
