import type { SummaryRecipientStatus } from '@keyloom/shared';
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
  Unique,
  UpdateDateColumn,
} from 'typeorm';
import { FamilyContact } from '../contacts/family-contact.entity';
import { Summary } from './summary.entity';

// One e-mail of a summary to one family contact. The idempotency key is the unit of "exactly once":
// the job sends only while the row is 'queued' and marks it 'sent' in the same step as it records the
// SMTP answer; the key is also the Message-ID, so a receiving server can drop a duplicate.
// `round` counts sends of the same summary (1, then 2… for each re-send).
@Entity({ name: 'summary_recipients' })
@Index('IDX_summary_recipients_summary_id', ['summaryId'])
@Unique('UQ_summary_recipients_idempotency_key', ['idempotencyKey'])
@Unique('UQ_summary_recipients_stop_token', ['stopToken'])
@Unique('UQ_summary_recipients_round', ['summaryId', 'contactId', 'round'])
@Check('CHK_summary_recipients_status', `status IN ('queued', 'sent', 'failed')`)
@Check('CHK_summary_recipients_sent_at', `(status = 'sent') = (sent_at IS NOT NULL)`)
export class SummaryRecipient {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_summary_recipients' })
  id: string;

  @Column({ name: 'summary_id', type: 'uuid' })
  summaryId: string;

  @ManyToOne(() => Summary, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'summary_id', foreignKeyConstraintName: 'FK_summary_recipients_summary_id' })
  summary?: Relation<Summary>;

  @Column({ name: 'contact_id', type: 'uuid', nullable: true })
  contactId: string | null;

  @ManyToOne(() => FamilyContact, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'contact_id', foreignKeyConstraintName: 'FK_summary_recipients_contact_id' })
  contact?: Relation<FamilyContact> | null;

  // Name and address as they were when the summary was sent (the record of who got what).
  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  email: string;

  @Column({ type: 'integer', default: 1 })
  round: number;

  // Set by the service (randomUUID) when the row is queued; never changes afterwards.
  @Column({ name: 'idempotency_key', type: 'uuid' })
  idempotencyKey: string;

  // Behind GET /api/summaries/stop/:token; 256 random bits as base64url, set by the service.
  @Column({ name: 'stop_token', type: 'text' })
  stopToken: string;

  @Column({ type: 'text', default: 'queued' })
  status: SummaryRecipientStatus;

  @Column({ type: 'integer', default: 0 })
  attempts: number;

  @Column({ name: 'last_error', type: 'text', nullable: true })
  lastError: string | null;

  @Column({ name: 'job_id', type: 'text', nullable: true })
  jobId: string | null;

  @Column({ name: 'message_id', type: 'text', nullable: true })
  messageId: string | null;

  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true })
  sentAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
