import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { PreparationPreviewDto, PreparationStep, PreparationStock } from '@meritline/shared';
import { ReferenceMaterial } from '../reference-materials/reference-material.entity.js';
import { User } from '../users/user.entity.js';

export interface StoredPreparationInput {
  source: { purity: number; uPurity: number };
  stock: PreparationStock;
  steps: PreparationStep[];
}

/** Written once, never changed: studies and reports refer to it. */
@Entity('standard_preparations')
export class StandardPreparation {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 160 })
  name: string;

  @Column({ name: 'material_id', type: 'uuid', nullable: true })
  materialId: string | null;

  @ManyToOne(() => ReferenceMaterial, { onDelete: 'RESTRICT', nullable: true })
  @JoinColumn({ name: 'material_id' })
  material: ReferenceMaterial | null;

  @Column({ type: 'simple-json' })
  input: StoredPreparationInput;

  @Column({ type: 'simple-json' })
  result: PreparationPreviewDto;

  @Column({ name: 'engine_version', type: 'varchar', length: 40 })
  engineVersion: string;

  @Column({ name: 'created_by_id', type: 'uuid' })
  createdById: string;

  @ManyToOne(() => User, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'created_by_id' })
  createdBy: User;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;
}
