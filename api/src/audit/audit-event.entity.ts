import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import { User } from '../users/user.entity';

/** JSON-safe details stored with an audit event (never secrets or password hashes). */
export type AuditDetails = Record<string, unknown>;

// One row per recorded action. Append-only: a trigger in the migration refuses UPDATE and DELETE.
@Entity({ name: 'audit_events' })
@Index('IDX_audit_events_at', ['at'])
@Index('IDX_audit_events_actor_id', ['actorId'])
@Index('IDX_audit_events_subject', ['subjectType', 'subjectId'])
@Index('IDX_audit_events_client_id', ['clientId'])
export class AuditEvent {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_audit_events' })
  id: string;

  @Column({ type: 'timestamptz', default: () => 'now()' })
  at: Date;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'actor_id', foreignKeyConstraintName: 'FK_audit_events_actor_id' })
  actor?: Relation<User> | null;

  // Kept as typed at the time, so the log still reads right after the account changes.
  @Column({ name: 'actor_email', type: 'text', nullable: true })
  actorEmail: string | null;

  @Column({ type: 'text' })
  action: string;

  @Column({ name: 'subject_type', type: 'text', nullable: true })
  subjectType: string | null;

  @Column({ name: 'subject_id', type: 'text', nullable: true })
  subjectId: string | null;

  // Filled by later issues for events about one client record.
  @Column({ name: 'client_id', type: 'uuid', nullable: true })
  clientId: string | null;

  @Column({ type: 'jsonb', default: () => "'{}'" })
  details: AuditDetails;

  @Column({ type: 'text', nullable: true })
  ip: string | null;
}
