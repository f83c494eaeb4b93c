import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { ImportMappingColumns } from '@meritline/shared';

/** How a method version's instrument export maps onto a run: saved once, reused for the next runs. */
@Entity('run_import_mappings')
export class RunImportMapping {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'method_version_id', type: 'uuid', unique: true })
  methodVersionId: string;

  @Column({ type: 'simple-json' })
  columns: ImportMappingColumns;

  @Column({ name: 'updated_by_name', type: 'varchar', length: 120 })
  updatedByName: string;

  @Column({ name: 'updated_at', type: Date })
  updatedAt: Date;

  @Column({ name: 'lock_version', type: 'integer', default: 1 })
  lockVersion: number;
}
