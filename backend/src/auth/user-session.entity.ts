import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('user_sessions')
export class UserSession {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @Column({ name: 'token_version', type: 'integer' })
  tokenVersion: number;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;

  @Column({ name: 'last_activity_at', type: Date })
  lastActivityAt: Date;

  @Column({ name: 'ended_at', type: Date, nullable: true })
  endedAt: Date | null;

  @Column({ name: 'end_reason', type: 'varchar', length: 40, nullable: true })
  endReason: string | null;
}
