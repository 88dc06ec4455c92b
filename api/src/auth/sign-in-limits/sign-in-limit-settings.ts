/**
 * The sign-in limits. Only failed attempts count; a successful sign-in clears its account's count.
 *
 * - Per account: after `accountFreeFailures` consecutive failures the account is held back for
 *   `baseLockSeconds`·2^n seconds (n = failures beyond the free ones), at most `maxLockSeconds`; at
 *   `accountMaxFailures` consecutive failures it stays locked until an administrator sets a new password.
 *   NIST SP 800-63B §5.2.2 "Rate Limiting (Throttling)": no more than 100 consecutive failed attempts
 *   on one account, and growing waits between attempts as a way to keep the owner from being locked
 *   out; OWASP Authentication Cheat Sheet, "Account Lockout": an exponential lockout with a ceiling.
 *   The 5 free failures, 1 s base and 15 min ceiling are common practice, no source.
 * - Per client address: `addressFailures` failed attempts in `addressWindowSeconds`, so guesses spread
 *   over many accounts from one address are stopped too (a higher limit, since a clinic's staff share
 *   one address behind NAT).
 */
export type SignInLimitSettings = {
  accountFreeFailures: number;
  baseLockSeconds: number;
  maxLockSeconds: number;
  accountMaxFailures: number;
  addressFailures: number;
  addressWindowSeconds: number;
};

/** NIST SP 800-63B §5.2.2: at most 100 consecutive failed attempts on one account. */
export const ACCOUNT_MAX_FAILURES = 100;

export function signInLimitSettings(
  addressFailures: number,
  accountFreeFailures: number,
): SignInLimitSettings {
  return {
    accountFreeFailures,
    baseLockSeconds: 1,
    maxLockSeconds: 15 * 60,
    accountMaxFailures: ACCOUNT_MAX_FAILURES,
    addressFailures,
    addressWindowSeconds: 15 * 60,
  };
}

/**
 * Seconds an account is held back after its `failures`-th consecutive failure: 0 while failures are
 * free, Infinity from `accountMaxFailures` on (until an administrator sets a new password).
 */
export function accountLockSeconds(failures: number, settings: SignInLimitSettings): number {
  if (failures >= settings.accountMaxFailures) return Infinity;
  if (failures < settings.accountFreeFailures) return 0;
  const doublings = failures - settings.accountFreeFailures;
  return Math.min(settings.baseLockSeconds * 2 ** Math.min(doublings, 30), settings.maxLockSeconds);
}

/** How long to wait, in the words the sign-in page shows: "about 40 seconds", "about 15 minutes". */
export function waitInWords(seconds: number): string {
  if (seconds < 60) {
    const whole = Math.max(1, Math.ceil(seconds));
    return `about ${whole} second${whole === 1 ? '' : 's'}`;
  }
  const minutes = Math.ceil(seconds / 60);
  return `about ${minutes} minute${minutes === 1 ? '' : 's'}`;
}
