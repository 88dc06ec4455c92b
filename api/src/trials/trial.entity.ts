import type { TrialEvent, TrialMeasures, TrialSettings } from '@keyloom/shared';
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
} from 'typeorm';
import { Client } from '../clients/client.entity';
import { ProfileVersion } from '../profile-versions/profile-version.entity';
import { User } from '../users/user.entity';

/** The version's simulated figures at the trial's slot count (null when the report lacks them). */
export type SimulatedFigures = { keystrokeSavings: number | null; wpm: number | null; slots: number };

// One finished trial on the test keyboard: the log as the browser sent it (replayed by the API), and
// the measures the API computed from it. Never changed after it is stored.
@Entity({ name: 'trials' })
@Unique('UQ_trials_local_trial_id', ['localTrialId'])
@Index('IDX_trials_profile_version_id_created_at', ['profileVersionId', 'createdAt'])
@Index('IDX_trials_client_id', ['clientId'])
@Check('CHK_trials_times', `started_at <= finished_at`)
export class Trial {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_trials' })
  id: string;

  @Column({ name: 'local_trial_id', type: 'uuid' })
  localTrialId: string;

  @Column({ name: 'profile_version_id', type: 'uuid' })
  profileVersionId: string;

  @ManyToOne(() => ProfileVersion, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'profile_version_id', foreignKeyConstraintName: 'FK_trials_profile_version_id' })
  profileVersion?: Relation<ProfileVersion>;

  @Column({ name: 'client_id', type: 'uuid' })
  clientId: string;

  @ManyToOne(() => Client, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'client_id', foreignKeyConstraintName: 'FK_trials_client_id' })
  client?: Relation<Client>;

  @Column({ name: 'user_id', type: 'uuid', nullable: true })
  userId: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'FK_trials_user_id' })
  user?: Relation<User> | null;

  @Column({ name: 'user_name', type: 'text' })
  userName: string;

  @Column({ name: 'user_role', type: 'text' })
  userRole: string;

  @Column({ name: 'started_at', type: 'timestamptz' })
  startedAt: Date;

  @Column({ name: 'finished_at', type: 'timestamptz' })
  finishedAt: Date;

  @Column({ name: 'phrase_id', type: 'text', nullable: true })
  phraseId: string | null;

  @Column({ name: 'target_phrase', type: 'text', nullable: true })
  targetPhrase: string | null;

  @Column({ type: 'text' })
  text: string;

  @Column({ type: 'jsonb' })
  settings: TrialSettings;

  // Not loaded with the row: the list never sends the log.
  @Column({ type: 'jsonb', select: false })
  events: TrialEvent[];

  @Column({ type: 'jsonb' })
  measures: TrialMeasures;

  @Column({ type: 'jsonb' })
  simulated: SimulatedFigures;

  @Column({ type: 'text', default: '' })
  note: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
