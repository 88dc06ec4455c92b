import type { ProfileSettings, ProfileVersionStatus, WordWeights } from '@keyloom/shared';
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
import { Client } from '../clients/client.entity';
import { User } from '../users/user.entity';

/** One sample as frozen into a version: its text as it was when the version was configured. */
export type FrozenSample = { id: string; title: string; sha256: string; characters: number; text: string };

/** One step of the version's history (who moved it where, when, with what comment). */
export type StoredVersionEvent = {
  status: ProfileVersionStatus;
  at: string;
  by: string | null;
  comment: string | null;
};

// A profile version: frozen inputs, training state, the engine's report and the personal model.
// Immutable once trained: later routes only move `status` (and record who and why).
@Entity({ name: 'profile_versions' })
@Unique('UQ_profile_versions_client_number', ['clientId', 'number'])
@Index('UQ_profile_versions_one_active', ['clientId'], { unique: true, where: `status = 'active'` })
@Check(
  'CHK_profile_versions_status',
  `status IN ('draft', 'training', 'trained', 'failed', 'signed_off', 'active', 'retired', 'sent_back')`,
)
@Check('CHK_profile_versions_progress', `progress >= 0 AND progress <= 1`)
// Retired by hand: when and why together (migration 1764991000001).
@Check('CHK_profile_versions_retire_complete', `(retired_at IS NULL) = (retire_reason IS NULL)`)
// A base-only version freezes no samples (migration 1765000000001).
@Check('CHK_profile_versions_base_only_samples', `NOT base_only OR jsonb_array_length(samples) = 0`)
export class ProfileVersion {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_profile_versions' })
  id: string;

  @Column({ name: 'client_id', type: 'uuid' })
  clientId: string;

  @ManyToOne(() => Client, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_profile_versions_client_id' })
  client?: Relation<Client>;

  @Column({ type: 'integer' })
  number: number;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  @Column({ type: 'text' })
  status: ProfileVersionStatus;

  @Column({ type: 'jsonb' })
  settings: ProfileSettings;

  @Column({ type: 'jsonb' })
  samples: FrozenSample[];

  /** General English alone (no samples, no metrics): for a client with too little writing. */
  @Column({ name: 'base_only', type: 'boolean', default: false })
  baseOnly: boolean;

  @Column({ type: 'double precision', default: 0 })
  progress: number;

  @Column({ type: 'text', nullable: true })
  stage: string | null;

  @Column({ type: 'text', nullable: true })
  error: string | null;

  @Column({ name: 'job_id', type: 'text', nullable: true })
  jobId: string | null;

  @Column({ name: 'heartbeat_at', type: 'timestamptz', nullable: true })
  heartbeatAt: Date | null;

  @Column({ type: 'jsonb', nullable: true })
  metrics: Record<string, unknown> | null;

  // Not loaded with the row: only the export reads it.
  @Column({ type: 'bytea', nullable: true, select: false })
  model: Buffer | null;

  @Column({ name: 'model_size', type: 'integer', nullable: true })
  modelSize: number | null;

  @Column({ name: 'base_weight', type: 'double precision', nullable: true })
  baseWeight: number | null;

  @Column({ name: 'base_model_sha256', type: 'text', nullable: true })
  baseModelSha256: string | null;

  // The client's word model for the word-aware list (null: trained before it). Not loaded with the
  // row: only the export and the test keyboard's download read it.
  @Column({ name: 'word_model', type: 'bytea', nullable: true, select: false })
  wordModel: Buffer | null;

  /** The word mixture's weights tuned at training (null without a word model). */
  @Column({ name: 'word_weights', type: 'jsonb', nullable: true })
  wordWeights: WordWeights | null;

  /** SHA-256 (hex) of the base vocabulary file trained beside, or null. */
  @Column({ name: 'base_words_sha256', type: 'text', nullable: true })
  baseWordsSha256: string | null;

  @Column({ type: 'jsonb', default: () => `'[]'` })
  history: StoredVersionEvent[];

  @Column({ name: 'created_by_id', type: 'uuid', nullable: true })
  createdById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'created_by_id', foreignKeyConstraintName: 'FK_profile_versions_created_by_id' })
  createdBy?: Relation<User> | null;

  @Column({ name: 'signed_off_by_id', type: 'uuid', nullable: true })
  signedOffById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'signed_off_by_id', foreignKeyConstraintName: 'FK_profile_versions_signed_off_by_id' })
  signedOffBy?: Relation<User> | null;

  @Column({ name: 'signed_off_at', type: 'timestamptz', nullable: true })
  signedOffAt: Date | null;

  @Column({ name: 'sign_off_comment', type: 'text', nullable: true })
  signOffComment: string | null;

  @Column({ name: 'approved_by_id', type: 'uuid', nullable: true })
  approvedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'approved_by_id', foreignKeyConstraintName: 'FK_profile_versions_approved_by_id' })
  approvedBy?: Relation<User> | null;

  @Column({ name: 'approved_at', type: 'timestamptz', nullable: true })
  approvedAt: Date | null;

  @Column({ name: 'approval_comment', type: 'text', nullable: true })
  approvalComment: string | null;

  @Column({ name: 'sent_back_reason', type: 'text', nullable: true })
  sentBackReason: string | null;

  @Column({ name: 'retired_by_id', type: 'uuid', nullable: true })
  retiredById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'retired_by_id', foreignKeyConstraintName: 'FK_profile_versions_retired_by_id' })
  retiredBy?: Relation<User> | null;

  @Column({ name: 'retired_at', type: 'timestamptz', nullable: true })
  retiredAt: Date | null;

  @Column({ name: 'retire_reason', type: 'text', nullable: true })
  retireReason: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'trained_at', type: 'timestamptz', nullable: true })
  trainedAt: Date | null;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
