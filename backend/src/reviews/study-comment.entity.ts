import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { StudySection } from '@meritline/shared';
import { ValidationStudy } from '../studies/validation-study.entity.js';

@Entity('study_comments')
export class StudyComment {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'study_id', type: 'uuid' })
  studyId: string;

  @ManyToOne(() => ValidationStudy, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'study_id' })
  study: ValidationStudy;

  @Column({ type: 'varchar', length: 20 })
  section: StudySection;

  /** Set on replies: the first comment of the thread. */
  @Column({ name: 'thread_id', type: 'uuid', nullable: true })
  threadId: string | null;

  @Column({ name: 'author_id', type: 'uuid' })
  authorId: string;

  @Column({ name: 'author_name', type: 'varchar', length: 120 })
  authorName: string;

  @Column({ type: 'text' })
  body: string;

  @Column({ type: Boolean, default: false })
  resolved: boolean;

  @CreateDateColumn({ name: 'created_at' })
  createdAt: Date;
}
