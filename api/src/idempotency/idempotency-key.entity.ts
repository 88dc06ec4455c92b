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
import { User } from '../users/user.entity';

// One Idempotency-Key a signed-in user sent with a state-changing request: 'pending' while the first
// request runs, then 'done' with the id of what it made. A repeat answers from here instead of acting
// again. The unique (user, key) pair is what makes one request win across processes.
@Entity({ name: 'idempotency_keys' })
@Unique('UQ_idempotency_keys_user_key', ['userId', 'key'])
@Index('IDX_idempotency_keys_created_at', ['createdAt'])
@Check('CHK_idempotency_keys_status', `status IN ('pending', 'done')`)
export class IdempotencyKey {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_idempotency_keys' })
  id: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => User, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'FK_idempotency_keys_user_id' })
  user?: Relation<User>;

  @Column({ type: 'text' })
  key: string;

  // SHA-256 (hex) of the route and the validated body: the same key with another request is refused.
  @Column({ type: 'text' })
  fingerprint: string;

  @Column({ type: 'text', default: 'pending' })
  status: 'pending' | 'done';

  // What the first request made (e.g. the summary), read again to answer a repeat.
  @Column({ name: 'resource_id', type: 'uuid', nullable: true })
  resourceId: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'completed_at', type: 'timestamptz', nullable: true })
  completedAt: Date | null;
}
