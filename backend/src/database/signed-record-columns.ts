import { Column, CreateDateColumn, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '@meritline/shared';
import { binaryColumnType } from './column-types.js';

/** An electronic signature: who, as what, meaning what, when, over which content. Each table adds the record it signs. */
export abstract class SignatureColumns<Meaning extends string> {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'signer_id', type: 'uuid' })
  signerId: string;

  @Column({ name: 'signer_name', type: 'varchar', length: 120 })
  signerName: string;

  @Column({ name: 'signer_role', type: 'varchar', length: 20 })
  signerRole: Role;

  @Column({ type: 'varchar', length: 30 })
  meaning: Meaning;

  @Column({ name: 'signed_at', type: Date })
  signedAt: Date;

  /** SHA-256 of the canonical JSON of { data, result } at signing. */
  @Column({ name: 'content_hash', type: 'varchar', length: 64 })
  contentHash: string;
}

/** A signed PDF issued once and stored; re-downloads and verification by upload read these bytes. */
export abstract class StoredPdfColumns {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: binaryColumnType })
  pdf: Buffer;

  @Column({ type: 'varchar', length: 64, unique: true })
  sha256: string;

  @Column({ name: 'size_bytes', type: Number })
  sizeBytes: number;

  @Column({ name: 'signed_at', type: Date })
  signedAt: Date;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;
}
