import { Column, CreateDateColumn, Entity, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { MethodVersion } from './method-version.entity.js';

@Entity('methods')
export class Method {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'varchar', length: 160, unique: true })
  name: string;

  @Column({ type: 'varchar', length: 120 })
  analyte: string;

  @Column({ type: 'varchar', length: 120 })
  matrix: string;

  @Column({ type: 'varchar', length: 80 })
  technique: string;

  @Column({ name: 'x_unit', type: 'varchar', length: 30 })
  xUnit: string;

  @Column({ name: 'y_unit', type: 'varchar', length: 30 })
  yUnit: string;

  /** Key of the criteria template the method was set up with (e.g. assay, trace, residue). */
  @Column({ type: 'varchar', length: 40 })
  purpose: string;

  @Column({ name: 'created_by_id', type: 'uuid' })
  createdById: string;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at' })
  updatedAt: Date;

  @OneToMany(() => MethodVersion, (version) => version.method)
  versions: MethodVersion[];
}
