import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('outbox_messages')
export class OutboxMessage {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'from_address', type: 'varchar', length: 254 })
  from: string;

  @Column({ name: 'to_addresses', type: 'simple-json' })
  to: string[];

  @Column({ type: 'varchar', length: 300 })
  subject: string;

  @Column({ type: 'text' })
  text: string;

  @CreateDateColumn({ name: 'received_at' })
  receivedAt: Date;
}
