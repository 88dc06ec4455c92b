import { accountLockSeconds, signInLimitSettings, waitInWords } from './sign-in-limit-settings';

describe('accountLockSeconds', () => {
  const settings = signInLimitSettings(100, 5);

  it('lets 4 failures pass, then locks for 1 s·2^n, at most 15 min, and for good at 100 (NIST SP 800-63B §5.2.2)', () => {
    const schedule = [1, 4, 5, 6, 7, 14, 15, 16, 99, 100, 140].map((failures) => [
      failures,
      accountLockSeconds(failures, settings),
    ]);
    expect(schedule).toEqual([
      [1, 0],
      [4, 0],
      [5, 1],
      [6, 2],
      [7, 4],
      [14, 512],
      [15, 900],
      [16, 900],
      [99, 900],
      [100, Infinity],
      [140, Infinity],
    ]);
  });

  it('takes the free failures from LOGIN_ACCOUNT_FAILURES and the address limit from LOGIN_RATE_LIMIT', () => {
    const strict = signInLimitSettings(20, 3);
    expect(strict.addressFailures).toBe(20);
    expect(accountLockSeconds(2, strict)).toBe(0);
    expect(accountLockSeconds(3, strict)).toBe(1);
  });
});

describe('waitInWords', () => {
  it('says seconds under a minute and whole minutes, rounded up, from a minute on', () => {
    expect(waitInWords(0.2)).toBe('about 1 second');
    expect(waitInWords(1)).toBe('about 1 second');
    expect(waitInWords(59)).toBe('about 59 seconds');
    expect(waitInWords(60)).toBe('about 1 minute');
    expect(waitInWords(61)).toBe('about 2 minutes');
    expect(waitInWords(15 * 60)).toBe('about 15 minutes');
  });
});
