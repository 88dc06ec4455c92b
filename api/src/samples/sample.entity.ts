import type { SampleStatus, SourceKind } from '@keyloom/shared';
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  OneToMany,
  PrimaryGeneratedColumn,
  type Relation,
  Unique,
  UpdateDateColumn,
} from 'typeorm';
import { Client } from '../clients/client.entity';
import { User } from '../users/user.entity';
import { SampleFlag } from './sample-flag.entity';

export type StoredWordCount = { word: string; count: number };

// One piece of a client's writing: the normalised (and, after review, redacted) text and its statistics.
// The original bytes are not kept; their SHA-256 finds duplicate uploads.
@Entity({ name: 'language_samples' })
@Unique('UQ_language_samples_client_sha256', ['clientId', 'sha256'])
@Index('IDX_language_samples_client_id', ['clientId'])
@Check(
  'CHK_language_samples_source_kind',
  `source_kind IN ('messages', 'diary', 'email', 'transcript', 'other')`,
)
@Check('CHK_language_samples_status', `status IN ('needs_review', 'ready', 'excluded')`)
export class Sample {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_language_samples' })
  id: string;

  @Column({ name: 'client_id', type: 'uuid' })
  clientId: string;

  @ManyToOne(() => Client, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_language_samples_client_id' })
  client?: Relation<Client>;

  @Column({ type: 'text' })
  title: string;

  @Column({ name: 'file_name', type: 'text', nullable: true })
  fileName: string | null;

  @Column({ name: 'source_kind', type: 'text' })
  sourceKind: SourceKind;

  @Column({ name: 'period_start', type: 'date', nullable: true })
  periodStart: string | null;

  @Column({ name: 'period_end', type: 'date', nullable: true })
  periodEnd: string | null;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  @Column({ type: 'text' })
  status: SampleStatus;

  @Column({ name: 'excluded_reason', type: 'text', nullable: true })
  excludedReason: string | null;

  @Column({ type: 'text' })
  encoding: string;

  @Column({ type: 'text' })
  sha256: string;

  @Column({ name: 'byte_size', type: 'integer' })
  byteSize: number;

  @Column({ type: 'text' })
  text: string;

  @Column({ type: 'integer' })
  characters: number;

  @Column({ type: 'integer' })
  words: number;

  @Column({ name: 'distinct_words', type: 'integer' })
  distinctWords: number;

  @Column({ name: 'top_words', type: 'jsonb' })
  topWords: StoredWordCount[];

  @Column({ name: 'unknown_words', type: 'jsonb' })
  unknownWords: StoredWordCount[];

  @Column({ name: 'uploaded_by_id', type: 'uuid', nullable: true })
  uploadedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'uploaded_by_id', foreignKeyConstraintName: 'FK_language_samples_uploaded_by_id' })
  uploadedBy?: Relation<User> | null;

  @OneToMany(() => SampleFlag, (flag) => flag.sample)
  flags?: Relation<SampleFlag>[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
