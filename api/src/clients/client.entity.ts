import type { AccessMethod } from '@keyloom/shared';
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
import { User } from '../users/user.entity';

// A client of the clinic, known only by a pseudonym; owned by one clinician.
@Entity({ name: 'clients' })
@Index('IDX_clients_clinician_id', ['clinicianId'])
@Check(
  'CHK_clients_access_method',
  `access_method IN ('direct', 'switch', 'eye_gaze', 'head_pointer', 'other')`,
)
@Check('CHK_clients_pseudonym_trimmed', `pseudonym = btrim(pseudonym) AND pseudonym <> ''`)
export class Client {
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_clients' })
  id: string;

  @Column({ type: 'text' })
  pseudonym: string;

  // What the family calls the client, for progress e-mails to them; the app keeps using the pseudonym.
  @Column({ name: 'preferred_name', type: 'text', nullable: true })
  preferredName: string | null;

  @Column({ name: 'access_method', type: 'text' })
  accessMethod: AccessMethod;

  @Column({ name: 'scan_interval_ms', type: 'integer', nullable: true })
  scanIntervalMs: number | null;

  @Column({ name: 'dwell_ms', type: 'integer', nullable: true })
  dwellMs: number | null;

  @Column({ name: 'key_time_ms', type: 'integer', nullable: true })
  keyTimeMs: number | null;

  @Column({ type: 'text', nullable: true })
  goals: string | null;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ name: 'clinician_id', type: 'uuid' })
  clinicianId: string;

  // Staff accounts are deactivated, never deleted, while they own clients.
  @ManyToOne(() => User, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'clinician_id', foreignKeyConstraintName: 'FK_clients_clinician_id' })
  clinician?: Relation<User>;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
