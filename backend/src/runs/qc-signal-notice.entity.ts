import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A control-chart signal as e-mailed to the quality managers: sent once, kept as sent. */
@Entity('qc_signal_notices')
export class QcSignalNotice {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'method_version_id', type: 'uuid' })
  methodVersionId: string;

  @Column({ type: 'varchar', length: 12 })
  series: string;

  @Column({ type: 'varchar', length: 30 })
  rule: string;

  /** Identifies the point the signal fired at: run id and item. */
  @Column({ name: 'point_key', type: 'varchar', length: 200 })
  pointKey: string;

  @Column({ type: 'simple-json' })
  recipients: string[];

  @Column({ type: 'varchar', length: 300 })
  subject: string;

  @Column({ type: 'text' })
  body: string;

  /** The signal in one sentence, as the e-mail said it (empty on notices sent before it was kept apart). */
  @Column({ type: 'varchar', length: 500, nullable: true })
  message: string | null;

  @Column({ name: 'sent_at', type: Date })
  sentAt: Date;
}
