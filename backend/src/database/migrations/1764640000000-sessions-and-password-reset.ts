import { Table, TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, createdAtColumn, idColumn } from './helpers.js';

export class SessionsAndPasswordReset1764640000000 implements MigrationInterface {
  name = 'SessionsAndPasswordReset1764640000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.addColumns('users', [
      new TableColumn({ name: 'token_version', type: t.integer, default: 0 }),
      new TableColumn({ name: 'password_reset_token_hash', type: t.varchar, length: '64', isNullable: true }),
      new TableColumn({ name: 'password_reset_expires_at', type: t.timestamp, isNullable: true }),
      new TableColumn({ name: 'unlock_token_hash', type: t.varchar, length: '64', isNullable: true }),
      new TableColumn({ name: 'unlock_expires_at', type: t.timestamp, isNullable: true }),
    ]);
    await queryRunner.createTable(
      new Table({
        name: 'user_sessions',
        columns: [
          idColumn(queryRunner),
          { name: 'user_id', type: t.uuid },
          { name: 'token_version', type: t.integer },
          createdAtColumn(queryRunner),
          { name: 'last_activity_at', type: t.timestamp },
          { name: 'ended_at', type: t.timestamp, isNullable: true },
          { name: 'end_reason', type: t.varchar, length: '40', isNullable: true },
        ],
        foreignKeys: [{ columnNames: ['user_id'], referencedTableName: 'users', referencedColumnNames: ['id'], onDelete: 'CASCADE' }],
        indices: [{ columnNames: ['user_id'] }],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'app_settings',
        columns: [
          { name: 'key', type: t.varchar, length: '100', isPrimary: true },
          { name: 'value', type: t.text },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('app_settings');
    await queryRunner.dropTable('user_sessions');
    for (const name of [
      'unlock_expires_at',
      'unlock_token_hash',
      'password_reset_expires_at',
      'password_reset_token_hash',
      'token_version',
    ]) {
      await queryRunner.dropColumn('users', name);
    }
  }
}
