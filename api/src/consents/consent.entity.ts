import type { ConsentScope, WithdrawalReport } from '@keyloom/shared';
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
} from 'typeorm';
import { Client } from '../clients/client.entity';
import { User } from '../users/user.entity';

// One consent record. Never edited after creation except: the document may be attached while the
// consent stands, a withdrawal fills the withdrawn_* columns once (the service refuses a second), and
// a record made in error is voided once (void_* columns): kept, shown struck through, no longer consent.
@Entity({ name: 'consents' })
@Index('IDX_consents_client_id', ['clientId'])
@Check('CHK_consents_given_by', `given_by IN ('client', 'representative')`)
@Check('CHK_consents_scopes', `cardinality(scopes) > 0 AND scopes <@ ARRAY['training', 'summaries']::text[]`)
@Check('CHK_consents_expiry_after_given', `expires_on IS NULL OR expires_on > given_on`)
@Check('CHK_consents_withdrawal_complete', `(withdrawn_at IS NULL) = (withdrawal IS NULL)`)
@Check(
  'CHK_consents_void_complete',
  `(voided_at IS NULL) = (void_reason IS NULL) AND (voided_at IS NULL) = (void_report IS NULL)`,
)
@Check('CHK_consents_void_or_withdrawal', `voided_at IS NULL OR withdrawn_at IS NULL`)
export class Consent {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_consents' })
  id: string;

  @Column({ name: 'client_id', type: 'uuid' })
  clientId: string;

  // The paper trail outlives everything else: a client with consent records cannot be deleted.
  @ManyToOne(() => Client, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_consents_client_id' })
  client?: Relation<Client>;

  @Column({ name: 'given_by', type: 'text' })
  givenBy: 'client' | 'representative';

  @Column({ name: 'representative_name', type: 'text', nullable: true })
  representativeName: string | null;

  @Column({ name: 'representative_relationship', type: 'text', nullable: true })
  representativeRelationship: string | null;

  @Column({ type: 'text', array: true })
  scopes: ConsentScope[];

  // Calendar dates (YYYY-MM-DD strings), not instants.
  @Column({ name: 'given_on', type: 'date' })
  givenOn: string;

  @Column({ name: 'expires_on', type: 'date', nullable: true })
  expiresOn: string | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ name: 'recorded_by_id', type: 'uuid' })
  recordedById: string;

  @ManyToOne(() => User, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'recorded_by_id', foreignKeyConstraintName: 'FK_consents_recorded_by_id' })
  recordedBy?: Relation<User>;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'withdrawn_at', type: 'timestamptz', nullable: true })
  withdrawnAt: Date | null;

  @Column({ name: 'withdrawn_by_id', type: 'uuid', nullable: true })
  withdrawnById: string | null;

  @ManyToOne(() => User, { onDelete: 'RESTRICT', nullable: true })
  @JoinColumn({ name: 'withdrawn_by_id', foreignKeyConstraintName: 'FK_consents_withdrawn_by_id' })
  withdrawnBy?: Relation<User> | null;

  @Column({ name: 'withdrawal_reason', type: 'text', nullable: true })
  withdrawalReason: string | null;

  // What the withdrawal deleted (counts per hook), kept as the trace that it happened.
  @Column({ type: 'jsonb', nullable: true })
  withdrawal: WithdrawalReport | null;

  @Column({ name: 'voided_at', type: 'timestamptz', nullable: true })
  voidedAt: Date | null;

  @Column({ name: 'voided_by_id', type: 'uuid', nullable: true })
  voidedById: string | null;

  @ManyToOne(() => User, { onDelete: 'RESTRICT', nullable: true })
  @JoinColumn({ name: 'voided_by_id', foreignKeyConstraintName: 'FK_consents_voided_by_id' })
  voidedBy?: Relation<User> | null;

  @Column({ name: 'void_reason', type: 'text', nullable: true })
  voidReason: string | null;

  // What voiding deleted (the same counts as a withdrawal report).
  @Column({ name: 'void_report', type: 'jsonb', nullable: true })
  voidReport: WithdrawalReport | null;

  @Column({ name: 'document_name', type: 'text', nullable: true })
  documentName: string | null;

  @Column({ name: 'document_mime', type: 'text', nullable: true })
  documentMime: string | null;

  @Column({ name: 'document_size', type: 'integer', nullable: true })
  documentSize: number | null;

  // The scanned form itself; never loaded with the record, only by the download route.
  @Column({ name: 'document_bytes', type: 'bytea', nullable: true, select: false })
  documentBytes: Buffer | null;

  @Column({ name: 'document_uploaded_at', type: 'timestamptz', nullable: true })
  documentUploadedAt: Date | null;
}
