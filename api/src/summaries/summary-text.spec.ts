import {
  figuresFromMetrics,
  ratePhrase,
  savingsChangePhrase,
  savingsPhrase,
  summarySubject,
  summaryText,
  trialsSentence,
  type VersionFigures,
  versionLine,
} from './summary-text';

describe('savingsPhrase', () => {
  // Rounding to tenths: derived from the wording rule, no outside source.
  it.each([
    [0, 'hardly any key presses saved'],
    [0.049, 'hardly any key presses saved'],
    [0.05, 'about 1 in 10 key presses saved'],
    [0.42, 'about 4 in 10 key presses saved'],
    [0.45, 'about 5 in 10 key presses saved'],
    [0.58, 'about 6 in 10 key presses saved'],
    [0.949, 'about 9 in 10 key presses saved'],
    [0.95, 'nearly all key presses saved'],
    [1.3, 'nearly all key presses saved'],
  ])('%p → %p', (fraction, wording) => {
    expect(savingsPhrase(fraction)).toBe(wording);
  });
});

describe('ratePhrase', () => {
  it.each([
    // Koester & Simpson 2014, switch users before/after settings optimisation: 1.42 and 2.72 wpm
    // (docs/references.md §2); the wording is derived.
    [1.42, 'roughly 1 word a minute'],
    [2.72, 'roughly 3 words a minute'],
    // MacKenzie 2002 worked example: 42 characters in 20 s = 2.10 cps → 25.2 wpm (docs/references.md §2).
    [((42 / 20) * 60) / 5, 'roughly 25 words a minute'],
    [0.3, 'less than 1 word a minute'],
    [Number.NaN, 'less than 1 word a minute'],
  ])('%p wpm → %p', (wpm, wording) => {
    expect(ratePhrase(wpm)).toBe(wording);
  });
});

describe('savingsChangePhrase', () => {
  it('names small changes as the same and larger ones in points per 100 (derived)', () => {
    expect(savingsChangePhrase(0.4, 0.41)).toBe('about the same as before');
    expect(savingsChangePhrase(0.31, 0.42)).toBe('11 more in every 100 key presses saved than before');
    expect(savingsChangePhrase(0.42, 0.37)).toBe('5 more in every 100 key presses needed than before');
  });
});

describe('figuresFromMetrics', () => {
  const version = { number: 2, status: 'active', date: '2026-11-03', slots: 5 };

  it('reads savings at the version slots and both rates from a stored report', () => {
    const metrics = { keystrokeSavings: { '1': 0.2, '5': 0.42 }, rates: { wpmWithout: 1.9, wpmWith: 2.72 } };
    expect(figuresFromMetrics(version, metrics)).toEqual({
      ...version,
      keystrokeSavings: 0.42,
      wpmWithout: 1.9,
      wpmWith: 2.72,
    });
  });

  it('gives nulls for missing or malformed fields instead of throwing', () => {
    expect(figuresFromMetrics(version, null).keystrokeSavings).toBeNull();
    const odd = figuresFromMetrics(version, { keystrokeSavings: { '5': '0.4' }, rates: [] });
    expect([odd.keystrokeSavings, odd.wpmWith, odd.wpmWithout]).toEqual([null, null, null]);
  });
});

describe('summaryText', () => {
  const v = (number: number, ks: number | null, wpm: number | null): VersionFigures => ({
    number,
    status: number === 2 ? 'active' : 'retired',
    date: `2026-1${number - 1}-03`,
    slots: 5,
    keystrokeSavings: ks,
    wpmWithout: 1.9,
    wpmWith: wpm,
  });

  it('puts each version figure, the change, the note and the caution in the text', () => {
    const text = summaryText({
      clientName: 'R. Ashby',
      clinicName: 'Willowmere Community Communication Clinic',
      from: '2026-10-01',
      to: '2026-11-30',
      versions: [v(1, 0.31, 2.2), v(2, 0.42, 2.72)],
      note: '  Pepper featured in most of the practice texts.  ',
    });
    const paragraphs = text.split('\n\n');
    expect(paragraphs[1]).toBe(
      'Version 1 (approved, since replaced, 3 October 2026): about 3 in 10 key presses saved, roughly 2 words a minute with suggestions, ' +
        'roughly 2 words a minute without.\n' +
        'Version 2 (approved, in use, 3 November 2026): about 4 in 10 key presses saved, roughly 3 words a minute with suggestions, ' +
        'roughly 2 words a minute without.',
    );
    expect(paragraphs[2]).toBe(
      'From version 1 to version 2: 11 more in every 100 key presses saved than before.',
    );
    expect(paragraphs[3]).toBe('A note from the clinician:\nPepper featured in most of the practice texts.');
    expect(paragraphs[4]).toMatch(/not measurements/);
  });

  it('says so when the period has no versions and leaves out an empty note', () => {
    const text = summaryText({
      clientName: 'R. Ashby',
      clinicName: 'Willowmere',
      from: '2026-10-01',
      to: '2026-10-31',
      versions: [],
      note: ' ',
    });
    expect(text).toContain('No new versions');
    expect(text).not.toContain('note from the clinician');
    expect(summarySubject({ clientName: 'R. Ashby', from: '2026-10-01', to: '2026-10-31' })).toBe(
      'Progress summary for R. Ashby, 1 to 31 October 2026',
    );
  });
});

describe('trialsSentence', () => {
  it('puts the measured trial means in words, or nothing without trials', () => {
    // 1 − keystrokes / characters (the keystroke-savings definition, docs/references.md §2): 10 selections for 14 characters → 0.286
    // (derived); Koester & Simpson 2014 2.72 wpm (docs/references.md §2).
    expect(trialsSentence({ count: 3, keystrokeSavings: 1 - 10 / 14, wpm: 2.72 })).toBe(
      'In 3 tries on the test keyboard, about 3 in 10 key presses were saved, at roughly 3 words a minute.',
    );
    // Corrections can outnumber savings: a negative mean is "hardly any", never a negative count.
    expect(trialsSentence({ count: 1, keystrokeSavings: -0.2, wpm: null })).toBe(
      'In 1 try on the test keyboard, hardly any key presses were saved.',
    );
    expect(trialsSentence({ count: 2, keystrokeSavings: null, wpm: null })).toBe(
      'There were 2 tries on the test keyboard.',
    );
    expect(trialsSentence(null)).toBe('');
    expect(trialsSentence({ count: 0, keystrokeSavings: 0.5, wpm: 3 })).toBe('');
  });

  it('follows the version line only when the version had trials', () => {
    const base: VersionFigures = {
      number: 1,
      status: 'trained',
      date: '2026-11-02',
      slots: 5,
      keystrokeSavings: 0.42,
      wpmWith: null,
      wpmWithout: null,
    };
    expect(versionLine(base)).toBe(
      'Version 1 (not yet approved: still being tried, 2 November 2026): about 4 in 10 key presses saved.',
    );
    expect(versionLine({ ...base, trials: { count: 2, keystrokeSavings: 0.31, wpm: null } })).toBe(
      'Version 1 (not yet approved: still being tried, 2 November 2026): about 4 in 10 key presses saved. ' +
        'In 2 tries on the test keyboard, about 3 in 10 key presses were saved.',
    );
    expect(
      versionLine({
        ...base,
        status: 'signed_off',
        carerComment: { by: 'Hannah Ashby', text: ' He liked the sailing words. ' },
      }),
    ).toBe(
      'Version 1 (not yet approved: tried and waiting for approval, 2 November 2026): about 4 in 10 key presses saved. ' +
        'Hannah Ashby tried it and wrote: “He liked the sailing words.”',
    );
  });

  it('says a base-only version is general English only, with figures from its trials', () => {
    const base: VersionFigures = {
      number: 2,
      status: 'active',
      date: '2026-11-20',
      slots: 5,
      keystrokeSavings: null,
      wpmWith: null,
      wpmWithout: null,
    };
    expect(versionLine(base)).toBe('Version 2 (approved, in use, 20 November 2026): no figures yet.');
    expect(
      versionLine({ ...base, baseOnly: true, trials: { count: 1, keystrokeSavings: 0.2, wpm: null } }),
    ).toBe(
      'Version 2 (approved, in use, 20 November 2026): suggestions from general English only, while there is too little of ' +
        'their own writing; its figures come from the tries on the test keyboard. ' +
        'In 1 try on the test keyboard, about 2 in 10 key presses were saved.',
    );
  });
});
