import { Table, type MigrationInterface, type QueryRunner } from 'typeorm';
import { columnTypes, createdAtColumn, idColumn } from './helpers.js';

export class UsersAndOutbox1764626400000 implements MigrationInterface {
  name = 'UsersAndOutbox1764626400000';

  async up(queryRunner: QueryRunner): Promise<void> {
    const t = columnTypes(queryRunner);
    await queryRunner.createTable(
      new Table({
        name: 'users',
        columns: [
          idColumn(queryRunner),
          { name: 'email', type: t.varchar, length: '254', isUnique: true },
          { name: 'name', type: t.varchar, length: '120' },
          { name: 'password_hash', type: t.varchar, length: '100', isNullable: true },
          { name: 'roles', type: t.text },
          { name: 'active', type: t.boolean, default: true },
          { name: 'invitation_token_hash', type: t.varchar, length: '64', isNullable: true },
          { name: 'invitation_expires_at', type: t.timestamp, isNullable: true },
          createdAtColumn(queryRunner),
          { name: 'last_sign_in_at', type: t.timestamp, isNullable: true },
        ],
      }),
    );
    await queryRunner.createTable(
      new Table({
        name: 'outbox_messages',
        columns: [
          idColumn(queryRunner),
          { name: 'from_address', type: t.varchar, length: '254' },
          { name: 'to_addresses', type: t.text },
          { name: 'subject', type: t.varchar, length: '300' },
          { name: 'text', type: t.text },
          createdAtColumn(queryRunner, 'received_at'),
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('outbox_messages');
    await queryRunner.dropTable('users');
  }
}
