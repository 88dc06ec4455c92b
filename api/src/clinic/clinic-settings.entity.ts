import {
  Check,
  Column,
  Entity,
  JoinColumn,
  ManyToOne,
  PrimaryColumn,
  type Relation,
  UpdateDateColumn,
} from 'typeorm';
import { User } from '../users/user.entity';

// The clinic's own details, named in progress e-mails to families and on the stop page. A single row
// (id 1); until an admin saves the details there is none and ClinicSettingsService answers a default.
@Entity({ name: 'clinic_settings' })
@Check('CHK_clinic_settings_single_row', 'id = 1')
export class ClinicSettingsRow {
  @PrimaryColumn({ type: 'smallint', default: 1, primaryKeyConstraintName: 'PK_clinic_settings' })
  id: number;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  phone: string;

  // Several lines, as on an envelope.
  @Column({ type: 'text' })
  address: string;

  @Column({ type: 'text', nullable: true })
  email: string | null;

  @Column({ type: 'text', nullable: true })
  website: string | null;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;

  @Column({ name: 'updated_by_id', type: 'uuid', nullable: true })
  updatedById: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL', nullable: true })
  @JoinColumn({ name: 'updated_by_id', foreignKeyConstraintName: 'FK_clinic_settings_updated_by_id' })
  updatedBy?: Relation<User> | null;
}
