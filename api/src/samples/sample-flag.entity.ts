import type { FlagStatus, PersonalDataKind } from '@keyloom/shared';
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
import { User } from '../users/user.entity';
import { Sample } from './sample.entity';

// One span of likely personal data in a sample's text, and the clinician's decision on it.
@Entity({ name: 'sample_flags' })
@Index('IDX_sample_flags_sample_id', ['sampleId'])
@Check(
  'CHK_sample_flags_kind',
  `kind IN ('email', 'phone', 'street_address', 'postcode', 'date_of_birth', 'long_digits', 'url')`,
)
@Check('CHK_sample_flags_status', `status IN ('open', 'redacted', 'kept')`)
@Check('CHK_sample_flags_span', `start_offset >= 0 AND end_offset > start_offset`)
export class SampleFlag {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_sample_flags' })
  id: string;

  @Column({ name: 'sample_id', type: 'uuid' })
  sampleId: string;

  @ManyToOne(() => Sample, (sample) => sample.flags, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'sample_id', foreignKeyConstraintName: 'FK_sample_flags_sample_id' })
  sample?: Relation<Sample>;

  @Column({ type: 'text' })
  kind: PersonalDataKind;

  // UTF-16 code-unit offsets into the sample's current text.
  @Column({ name: 'start_offset', type: 'integer' })
  start: number;

  @Column({ name: 'end_offset', type: 'integer' })
  end: number;

  // The matched text while open or kept; null once redacted.
  @Column({ type: 'text', nullable: true })
  text: string | null;

  @Column({ type: 'text' })
  status: FlagStatus;

  // The text a redaction replaced, kept so the redaction can be undone; dropped (by a database trigger)
  // once a version starts training on the sample. Never sent to the browser or the log.
  @Column({ name: 'original_text', type: 'text', nullable: true, select: false })
  originalText: string | null;

  @Column({ type: 'text', nullable: true })
  reason: string | null;

  @Column({ name: 'decided_by_id', type: 'uuid', nullable: true })
  decidedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'decided_by_id', foreignKeyConstraintName: 'FK_sample_flags_decided_by_id' })
  decidedBy?: Relation<User> | null;

  @Column({ name: 'decided_at', type: 'timestamptz', nullable: true })
  decidedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
