import type { Role } from '@keyloom/shared';
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  PrimaryGeneratedColumn,
  UpdateDateColumn,
} from 'typeorm';

// A staff account. E-mail is unique without regard to case (a lower(email) index made by the migration).
@Entity({ name: 'users' })
@Index('UQ_users_email_lower', { synchronize: false })
@Index('IDX_users_role_active', ['role', 'active'])
@Check('CHK_users_role', `role IN ('admin', 'clinician', 'supervisor', 'carer')`)
@Check('CHK_users_email_trimmed', `email = btrim(email) AND email <> ''`)
export class User {
  // gen_random_uuid() (built into PostgreSQL 13+; uuidExtension 'pgcrypto' in the data source options).
  @PrimaryGeneratedColumn('uuid', { primaryKeyConstraintName: 'PK_users' })
  id: string;

  @Column({ type: 'text' })
  email: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  role: Role;

  @Column({ name: 'password_hash', type: 'text', select: false })
  passwordHash: string;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  /** Set by the seed outside demo mode: the account may only change its password until it does. */
  @Column({ name: 'must_change_password', type: 'boolean', default: false })
  mustChangePassword: boolean;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @Column({ name: 'last_sign_in_at', type: 'timestamptz', nullable: true })
  lastSignInAt: Date | null;
}
