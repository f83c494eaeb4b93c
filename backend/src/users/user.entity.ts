import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '@meritline/shared';

@Entity('users')
export class User {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 254, unique: true })
  email: string;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  @Column({ name: 'password_hash', type: 'varchar', length: 100, nullable: true })
  passwordHash: string | null;

  @Column({ type: 'simple-json' })
  roles: Role[];

  @Column({ type: Boolean, default: true })
  active: boolean;

  @Column({ name: 'invitation_token_hash', type: 'varchar', length: 64, nullable: true })
  invitationTokenHash: string | null;

  @Column({ name: 'invitation_expires_at', type: Date, nullable: true })
  invitationExpiresAt: Date | null;

  /** Raised on password change, reset and deactivation: tokens signed with an older value are refused. */
  @Column({ name: 'token_version', type: 'integer', default: 0 })
  tokenVersion: number;

  @Column({ name: 'password_reset_token_hash', type: 'varchar', length: 64, nullable: true })
  passwordResetTokenHash: string | null;

  @Column({ name: 'password_reset_expires_at', type: Date, nullable: true })
  passwordResetExpiresAt: Date | null;

  @Column({ name: 'unlock_token_hash', type: 'varchar', length: 64, nullable: true })
  unlockTokenHash: string | null;

  @Column({ name: 'unlock_expires_at', type: Date, nullable: true })
  unlockExpiresAt: Date | null;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;

  @Column({ name: 'last_sign_in_at', type: Date, nullable: true })
  lastSignInAt: Date | null;
}
