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
import type { SummaryCommentRef } from '@keyloom/shared';
import type { VersionFigures } from './summary-text';

// A progress summary: a draft the clinician edits (subject, text, versions, ticked staff comments,
// recipients), then sent. What was sent — the period, the versions, the note and the exact content
// (subject, text, the figures the charts are drawn from) — never changes; a re-send adds recipient
// rows, it does not change the content.
@Entity({ name: 'summaries' })
@Index('IDX_summaries_client_id', ['clientId'])
@Check('CHK_summaries_period', `period_from <= period_to`)
@Check('CHK_summaries_state', `state IN ('draft', 'sent')`)
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

  /** 'draft' until the clinician sends it; then 'sent' (the recipients' rows tell how delivery went). */
  @Column({ type: 'text', default: 'draft' })
  state: 'draft' | 'sent';

  /** The contacts the draft will go to (ids; checked again when it is sent). */
  @Column({ name: 'contact_ids', type: 'jsonb', default: () => `'[]'` })
  contactIds: string[];

  /** Staff comments the clinician ticked to quote, one by one (none are quoted otherwise). */
  @Column({ name: 'include_comments', type: 'jsonb', default: () => `'[]'` })
  includeComments: SummaryCommentRef[];

  /** The text as Keyloom wrote it from the figures (null for summaries made before drafts). */
  @Column({ name: 'generated_text', type: 'text', nullable: true })
  generatedText: string | null;

  /** For the clinician only, never sent: what was left out and why (e.g. an implausible trial figure). */
  @Column({ type: 'jsonb', default: () => `'[]'` })
  notes: string[];

  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true })
  sentAt: Date | null;

  @Column({ name: 'sent_by_id', type: 'uuid', nullable: true })
  sentById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'sent_by_id', foreignKeyConstraintName: 'FK_summaries_sent_by_id' })
  sentBy?: Relation<User> | null;

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
