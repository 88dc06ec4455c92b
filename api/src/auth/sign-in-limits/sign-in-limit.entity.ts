import { Check, Column, Entity, Index, PrimaryColumn } from 'typeorm';

/**
 * Failed sign-in attempts of one account (kind 'account', subject = the lower-case e-mail, so an
 * unknown address is counted exactly like a real one) or of one client address (kind 'address',
 * subject = the IP). Written with atomic upserts by SignInLimitsService.
 */
@Entity({ name: 'sign_in_limits' })
@Index('IDX_sign_in_limits_updated_at', ['updatedAt'])
@Check('CHK_sign_in_limits_kind', `kind IN ('account', 'address')`)
@Check('CHK_sign_in_limits_failures', `failures >= 0`)
export class SignInLimit {
  @PrimaryColumn({ type: 'text', primaryKeyConstraintName: 'PK_sign_in_limits' })
  kind: 'account' | 'address';

  @PrimaryColumn({ type: 'text', primaryKeyConstraintName: 'PK_sign_in_limits' })
  subject: string;

  @Column({ type: 'integer', default: 0 })
  failures: number;

  @Column({ name: 'window_started_at', type: 'timestamptz', default: () => 'now()' })
  windowStartedAt: Date;

  @Column({ name: 'locked_until', type: 'timestamptz', nullable: true })
  lockedUntil: Date | null;

  @Column({ name: 'updated_at', type: 'timestamptz', default: () => 'now()' })
  updatedAt: Date;
}
