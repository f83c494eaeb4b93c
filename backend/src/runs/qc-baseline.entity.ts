import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** The released runs a quality manager chose as the baseline of a method version's control charts. */
@Entity('qc_baselines')
export class QcBaseline {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'method_version_id', type: 'uuid', unique: true })
  methodVersionId: string;

  @Column({ name: 'run_ids', type: 'simple-json' })
  runIds: string[];

  @Column({ name: 'chosen_by_id', type: 'uuid' })
  chosenById: string;

  @Column({ name: 'chosen_by_name', type: 'varchar', length: 120 })
  chosenByName: string;

  @Column({ name: 'chosen_at', type: Date })
  chosenAt: Date;

  @Column({ type: 'text' })
  reason: string;

  @Column({ name: 'lock_version', type: 'integer', default: 1 })
  lockVersion: number;
}
