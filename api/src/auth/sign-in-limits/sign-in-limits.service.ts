import { HttpException, HttpStatus, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { AuditService } from '../../audit/audit.service';
import { AppConfig } from '../../config/app-config';
import { accountLockSeconds, waitInWords } from './sign-in-limit-settings';

/** The message of a held-back sign-in, with the wait in words (the seconds are in Retry-After too). */
export const signInLockedMessage = (seconds: number): string =>
  `Too many failed sign-in attempts. Try again in ${waitInWords(seconds)}.`;
export const SIGN_IN_LOCKED_FOR_GOOD_MESSAGE =
  'Too many failed sign-in attempts for this account. Ask an administrator to set a new password.';

// Rows untouched for a day and not locked are forgotten (common practice, no source).
const FORGET_AFTER = '1 day';

/**
 * 429 Too Many Requests for a held-back sign-in. The filter sends `retryAfterSeconds` as the
 * Retry-After header (RFC 9110 §10.2.3, delay-seconds).
 */
export class SignInLockedException extends HttpException {
  constructor(
    readonly retryAfterSeconds: number,
    message = signInLockedMessage(retryAfterSeconds),
  ) {
    super({ message, retryAfterSeconds }, HttpStatus.TOO_MANY_REQUESTS);
  }
}

type LockRow = { kind: 'account' | 'address'; wait: number | null };

/**
 * Failed sign-in counters in PostgreSQL, so every API process and a restart see the same counts.
 * Accounts are keyed by the typed e-mail (lower case), so an unknown address behaves exactly like a
 * real account and the answers do not tell which addresses have accounts.
 */
@Injectable()
export class SignInLimitsService {
  private readonly logger = new Logger('SignInLimits');

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly config: AppConfig,
  ) {}

  /** Throws SignInLockedException while the account or the address is held back. */
  async assertMayTry(email: string, ip: string | null): Promise<void> {
    const rows = await this.dataSource.query<LockRow[]>(
      `SELECT kind,
              CASE WHEN locked_until = 'infinity' THEN NULL
                   ELSE ceil(extract(epoch FROM locked_until - now()))::int END AS wait
         FROM sign_in_limits
        WHERE locked_until > now()
          AND ((kind = 'account' AND subject = $1) OR (kind = 'address' AND subject = $2))`,
      [email.toLowerCase(), ip ?? ''],
    );
    if (rows.length === 0) return;
    const { maxLockSeconds } = this.config.signInLimits;
    if (rows.some((row) => row.kind === 'account' && row.wait === null)) {
      throw new SignInLockedException(maxLockSeconds, SIGN_IN_LOCKED_FOR_GOOD_MESSAGE);
    }
    throw new SignInLockedException(Math.max(1, ...rows.map((row) => row.wait ?? maxLockSeconds)));
  }

  /** A failed attempt: counts it for the account and the address, and locks either when due. */
  async recordFailure(email: string, ip: string | null, userId: string | null): Promise<void> {
    const settings = this.config.signInLimits;
    const [account] = await this.dataSource.query<{ failures: number }[]>(
      `INSERT INTO sign_in_limits (kind, subject, failures, window_started_at, updated_at)
       VALUES ('account', $1, 1, now(), now())
       ON CONFLICT (kind, subject) DO UPDATE
         SET failures = sign_in_limits.failures + 1, updated_at = now()
       RETURNING failures`,
      [email.toLowerCase()],
    );
    const lockSeconds = accountLockSeconds(account.failures, settings);
    if (lockSeconds > 0) {
      await this.dataSource.query(
        `UPDATE sign_in_limits
            SET locked_until = CASE WHEN $2::float8 = 'infinity'::float8 THEN 'infinity'::timestamptz
                                    ELSE now() + make_interval(secs => $2::float8) END
          WHERE kind = 'account' AND subject = $1`,
        [email.toLowerCase(), lockSeconds],
      );
      await this.lockRecorded('account', ip, userId, account.failures, lockSeconds);
    }

    if (ip) {
      const window = settings.addressWindowSeconds;
      const [address] = await this.dataSource.query<{ failures: number; wait: number }[]>(
        `INSERT INTO sign_in_limits (kind, subject, failures, window_started_at, updated_at)
         VALUES ('address', $1, 1, now(), now())
         ON CONFLICT (kind, subject) DO UPDATE
           SET failures = CASE WHEN sign_in_limits.window_started_at <= now() - make_interval(secs => $2)
                               THEN 1 ELSE sign_in_limits.failures + 1 END,
               window_started_at = CASE WHEN sign_in_limits.window_started_at <= now() - make_interval(secs => $2)
                                        THEN now() ELSE sign_in_limits.window_started_at END,
               updated_at = now()
         RETURNING failures,
                   ceil(extract(epoch FROM window_started_at + make_interval(secs => $2) - now()))::int AS wait`,
        [ip, window],
      );
      if (address.failures >= settings.addressFailures) {
        await this.dataSource.query(
          `UPDATE sign_in_limits SET locked_until = window_started_at + make_interval(secs => $2)
            WHERE kind = 'address' AND subject = $1`,
          [ip, window],
        );
        if (address.failures === settings.addressFailures) {
          await this.lockRecorded('address', ip, null, address.failures, address.wait);
        }
      }
    }

    await this.dataSource.query(
      `DELETE FROM sign_in_limits
        WHERE updated_at < now() - interval '${FORGET_AFTER}' AND (locked_until IS NULL OR locked_until < now())`,
    );
  }

  /** A successful sign-in: the account's failures are forgotten (the address's are not). */
  async recordSuccess(email: string): Promise<void> {
    await this.dataSource.query(`DELETE FROM sign_in_limits WHERE kind = 'account' AND subject = $1`, [
      email.toLowerCase(),
    ]);
  }

  // Ids only: the account's id when it exists, never the typed e-mail or password.
  private async lockRecorded(
    scope: 'account' | 'address',
    ip: string | null,
    userId: string | null,
    failures: number,
    lockSeconds: number,
  ): Promise<void> {
    const seconds = Number.isFinite(lockSeconds) ? lockSeconds : null;
    this.logger.warn(
      `Sign-in held back (${scope}${userId ? ` ${userId}` : ''}) after ${failures} failures, ` +
        (seconds === null ? 'until a new password is set' : `for ${seconds} s`),
    );
    await this.audit.record(
      { id: null, email: null, ip },
      'auth.sign-in-locked',
      userId ? { type: 'user', id: userId } : null,
      { scope, failures, lockSeconds: seconds },
    );
  }
}
