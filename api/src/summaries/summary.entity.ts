import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
  type Relation,
  UpdateDateColumn,
} from 'typeorm';
import { Client } from '../clients/client.entity';
import { User } from '../users/user.entity';
import type { VersionFigures } from './summary-text';

// A progress summary as composed and sent: the period, the versions, the clinician's note and the
// exact content (subject, text, the figures the charts are drawn from). Immutable once created; a
// re-send adds recipient rows, it does not change the content.
@Entity({ name: 'summaries' })
@Index('IDX_summaries_client_id', ['clientId'])
@Check('CHK_summaries_period', `period_from <= period_to`)
export class Summary {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_summaries' })
  id: string;

  @Column({ name: 'client_id', type: 'uuid' })
  clientId: string;

  @ManyToOne(() => Client, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_summaries_client_id' })
  client?: Relation<Client>;

  // ISO dates; returned as strings by node-postgres for the `date` type.
  @Column({ name: 'period_from', type: 'date' })
  periodFrom: string;

  @Column({ name: 'period_to', type: 'date' })
  periodTo: string;

  @Column({ name: 'version_ids', type: 'jsonb' })
  versionIds: string[];

  @Column({ type: 'text' })
  note: string;

  @Column({ type: 'text' })
  subject: string;

  @Column({ type: 'text' })
  text: string;

  // The figures of each version as read from its stored metrics when the summary was made.
  @Column({ type: 'jsonb' })
  figures: VersionFigures[];

  @Column({ name: 'created_by_id', type: 'uuid', nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'created_by_id', foreignKeyConstraintName: 'FK_summaries_created_by_id' })
  createdBy?: Relation<User> | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
