import { Injectable } from '@nestjs/common';
import type { SessionUser } from '@keyloom/shared';
import bcrypt from 'bcryptjs';
import { randomUUID } from 'node:crypto';
import { AuditService } from '../audit/audit.service';
import { AppConfig } from '../config/app-config';
import { toSessionUser } from '../users/dto/user.dto';
import { UsersService } from '../users/users.service';
import type { Actor } from './session-user';
import { SignInLimitsService } from './sign-in-limits/sign-in-limits.service';

export type SignInFailure = 'unknown-account' | 'wrong-password' | 'inactive-account';

@Injectable()
export class AuthService {
  private dummyHash?: Promise<string>;

  constructor(
    private readonly users: UsersService,
    private readonly audit: AuditService,
    private readonly config: AppConfig,
    private readonly limits: SignInLimitsService,
  ) {}

  /**
   * Checks an e-mail and password. Returns the user, or null for an unknown account, a wrong
   * password or a deactivated account alike (the caller shows one message). An unknown account
   * still costs one bcrypt comparison, against a dummy hash, so timing does not reveal which
   * addresses have accounts. Every failure is written to the audit log and counted by the sign-in
   * limits; while the account (or the address) is held back, even the right password gets a 429.
   */
  async validateUser(email: string, password: string, ip: string | null): Promise<SessionUser | null> {
    await this.limits.assertMayTry(email, ip);
    const user = await this.users.findForSignIn(email);
    const hash = user?.passwordHash ?? (await this.getDummyHash());
    const matches = await bcrypt.compare(password, hash);
    if (user && matches && user.active) {
      await this.limits.recordSuccess(email);
      return toSessionUser(user);
    }

    const reason: SignInFailure = !user
      ? 'unknown-account'
      : !matches
        ? 'wrong-password'
        : 'inactive-account';
    await this.audit.record(
      { id: null, email, ip },
      'auth.sign-in-failed',
      user ? { type: 'user', id: user.id } : null,
      { reason },
    );
    await this.limits.recordFailure(email, ip, user?.id ?? null);
    return null;
  }

  /** Bookkeeping after the session is established: last sign-in time and the audit event. */
  async signedIn(actor: Actor): Promise<void> {
    await this.users.markSignedIn(actor.id);
    await this.audit.record(actor, 'auth.sign-in', { type: 'user', id: actor.id });
  }

  async signedOut(actor: Actor): Promise<void> {
    await this.audit.record(actor, 'auth.sign-out', { type: 'user', id: actor.id });
  }

  // Same cost as real hashes, so the comparison takes as long.
  private getDummyHash(): Promise<string> {
    this.dummyHash ??= bcrypt.hash(`keyloom-no-such-account-${randomUUID()}`, this.config.bcryptCost);
    return this.dummyHash;
  }
}
