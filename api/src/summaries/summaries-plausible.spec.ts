import { MIN_TRIAL_CHARS, PLAUSIBLE_RATE_FACTOR, plausibleTrials } from './trial-figures';

// The rules themselves are common practice, no source (docs/references.md §2); these checks hold the
// service to the rule as stated: more than PLAUSIBLE_RATE_FACTOR times the estimate is left out.
describe('plausibleTrials', () => {
  const version = { number: 3, wpmWith: 15 };

  it('keeps a measured speed up to twice the estimate', () => {
    const notes: string[] = [];
    const kept = plausibleTrials(version, { count: 2, keystrokeSavings: 0.3, wpm: 30 }, notes);
    expect(kept).toEqual({ count: 2, keystrokeSavings: 0.3, wpm: 30 });
    expect(notes).toEqual([]);
  });

  it('leaves out a measured speed more than twice the estimate, with a note saying why', () => {
    expect(PLAUSIBLE_RATE_FACTOR).toBe(2);
    const notes: string[] = [];
    const kept = plausibleTrials(version, { count: 1, keystrokeSavings: 0.4, wpm: 65 }, notes);
    expect(kept).toEqual({ count: 1, keystrokeSavings: 0.4, wpm: null });
    expect(notes).toEqual([
      'Version 3: the measured trial speed (65.0 words a minute) is more than 2 times the estimate (15.0), ' +
        'so it was left out as implausible. Check the trial log on the version’s page.',
    ]);
  });

  it('says how many short trials were left out, and drops the figures when none is left', () => {
    const notes: string[] = [];
    expect(
      plausibleTrials(version, { count: 0, keystrokeSavings: null, wpm: null, short: 2 }, notes),
    ).toBeNull();
    expect(notes).toEqual([
      `Version 3: 2 trials shorter than ${MIN_TRIAL_CHARS} characters were left out of the trial figures (too short to measure).`,
    ]);
  });

  it('keeps a speed without an estimate to compare it with', () => {
    const notes: string[] = [];
    expect(
      plausibleTrials({ number: 1, wpmWith: null }, { count: 1, keystrokeSavings: null, wpm: 40 }, notes),
    ).toEqual({
      count: 1,
      keystrokeSavings: null,
      wpm: 40,
    });
    expect(notes).toEqual([]);
  });
});
