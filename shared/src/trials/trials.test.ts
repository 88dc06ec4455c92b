import { describe, expect, it } from 'vitest';
import { createTrialSchema, type TrialEvent } from '../schemas/trials.schema';
import { builtInPracticePhrases } from './practice-phrases';
import { computeTrialMeasures, minimumStringDistance, msdErrorRate, pausedWithin } from './trial-measures';
import {
  applyTrialEvent,
  partialWord,
  replayTrial,
  stepTrial,
  emptyReplayState,
  suggestionContext,
  TrialReplayError,
} from './trial-replay';

/** Letter-by-letter events for `text`, evenly spread from 0 to `ms`. */
function typed(text: string, ms: number): TrialEvent[] {
  const chars = [...text];
  return chars.map((c, i) => ({
    t: chars.length > 1 ? Math.round((i * ms) / (chars.length - 1)) : 0,
    type: c === ' ' ? 'space' : /[\p{L}\p{N}]/u.test(c) ? 'letter' : 'punctuation',
    ...(c === ' ' ? {} : { value: c }),
  }));
}

describe('trial replay', () => {
  it('applies letters, spaces, punctuation and backspaces (astral characters as one)', () => {
    const events: TrialEvent[] = [
      ...typed('hi,', 100),
      { t: 200, type: 'backspace' },
      { t: 300, type: 'letter', value: '𝒜' },
      { t: 400, type: 'backspace' },
      { t: 500, type: 'space' },
      { t: 600, type: 'switch' },
      { t: 700, type: 'offer', words: ['there'] },
    ];
    expect(replayTrial(events)).toBe('hi ');
  });

  it('a suggestion replaces the word being typed and adds a space', () => {
    expect(applyTrialEvent('i want te', { t: 0, type: 'suggestion', value: 'tea', slot: 0 })).toBe(
      'i want tea ',
    );
    expect(applyTrialEvent('i want ', { t: 0, type: 'suggestion', value: 'tea', slot: 1 })).toBe(
      'i want tea ',
    );
    expect(applyTrialEvent('come sailing?', { t: 0, type: 'suggestion', value: 'I', slot: 0 })).toBe(
      'come sailing? I ',
    );
    expect(partialWord("i don'")).toBe("don'");
    expect(partialWord('end. ')).toBe('');
  });

  it("sentence punctuation after a word and a space takes the space's place", () => {
    expect(applyTrialEvent('tea ', { t: 0, type: 'punctuation', value: '?' })).toBe('tea? ');
    expect(applyTrialEvent('tea', { t: 0, type: 'punctuation', value: ',' })).toBe('tea,');
    expect(applyTrialEvent('tea ', { t: 0, type: 'punctuation', value: "'" })).toBe("tea '");
    expect(applyTrialEvent('tea. ', { t: 0, type: 'punctuation', value: '.' })).toBe('tea. .');
  });

  it('suggests from the start of a line for a new message and after a space following punctuation', () => {
    expect(suggestionContext('')).toBe('\n');
    expect(suggestionContext('come sailing?')).toBe('come sailing? ');
    expect(suggestionContext('i want t')).toBe('i want t');
    expect(suggestionContext("don'")).toBe("don'");
  });

  it('names the step that cannot be replayed', () => {
    expect(() => replayTrial([...typed('ab', 10), { t: 20, type: 'letter', value: 'xy' }])).toThrow(
      new TrialReplayError(
        'Step 3 of the trial log: A letter step must insert exactly one character, not "xy".',
      ),
    );
    expect(() => replayTrial([{ t: 0, type: 'suggestion' }])).toThrow(TrialReplayError);
  });
});

describe('trial replay: new line, delete word, undo pick, shift, layer, pause', () => {
  // Hand-worked logs: each expected text is worked out by hand from the step definitions in
  // trialEventTypes (derived, no outside source).
  it('a new line inserts a line break; shift, layer, pause and resume change no text', () => {
    const events: TrialEvent[] = [
      { t: 0, type: 'shift', value: 'once' },
      { t: 10, type: 'letter', value: 'H' },
      { t: 20, type: 'letter', value: 'i' },
      { t: 30, type: 'newline' },
      { t: 40, type: 'pause' },
      { t: 50, type: 'resume' },
      { t: 60, type: 'layer', value: 'symbols' },
      { t: 70, type: 'letter', value: '2' },
      { t: 80, type: 'layer', value: 'letters' },
    ];
    expect(replayTrial(events)).toBe('Hi\n2');
  });

  it('delete word: the word before the caret and its spaces; after punctuation the mark goes with its word', () => {
    const del = (text: string) => applyTrialEvent(text, { t: 0, type: 'delete_word' });
    expect(del('i want tea')).toBe('i want ');
    expect(del('i want tea  ')).toBe('i want ');
    expect(del('i want tea. ')).toBe('i want ');
    expect(del('come sailing?')).toBe('come ');
    expect(del("i don't")).toBe('i ');
    expect(del('hi\n')).toBe('hi');
    expect(del('')).toBe('');
    expect(replayTrial([...typed('tea, please', 100), { t: 200, type: 'delete_word' }])).toBe('tea, ');
  });

  it('undo after two picks goes back one pick at a time, letters typed before each pick restored', () => {
    const events: TrialEvent[] = [
      ...typed('i w', 100),
      { t: 200, type: 'suggestion', value: 'want', slot: 0 },
      { t: 300, type: 'letter', value: 't' },
      { t: 400, type: 'suggestion', value: 'tea', slot: 1 },
    ];
    let state = emptyReplayState;
    for (const e of events) state = stepTrial(state, e);
    expect(state).toEqual({ text: 'i want tea ', beforePicks: ['i w', 'i want t'] });
    state = stepTrial(state, { t: 500, type: 'undo_pick' });
    expect(state.text).toBe('i want t');
    state = stepTrial(state, { t: 600, type: 'undo_pick' });
    expect(state).toEqual({ text: 'i w', beforePicks: [] });
    expect(
      replayTrial([...events, { t: 500, type: 'undo_pick' }, { t: 600, type: 'letter', value: 'o' }]),
    ).toBe('i want to');
  });

  it('refuses an undo with no pick left, and unknown shift or layer values', () => {
    expect(() =>
      replayTrial([
        ...typed('a', 0),
        { t: 10, type: 'suggestion', value: 'an', slot: 0 },
        { t: 20, type: 'undo_pick' },
        { t: 30, type: 'undo_pick' },
      ]),
    ).toThrow(
      new TrialReplayError(
        'Step 4 of the trial log: An undo pick step comes with no suggestion pick to undo.',
      ),
    );
    expect(() => replayTrial([{ t: 0, type: 'undo_pick' }])).toThrow(TrialReplayError);
    expect(() => replayTrial([{ t: 0, type: 'shift', value: 'twice' }])).toThrow(
      'A shift step must be one of off, once, lock, not "twice".',
    );
    expect(() => replayTrial([{ t: 0, type: 'layer' }])).toThrow(TrialReplayError);
  });

  it('counts shift, layer, new line, delete word and undo pick as keystrokes; pause and resume not', () => {
    const events: TrialEvent[] = [
      { t: 0, type: 'shift', value: 'once' },
      { t: 100, type: 'letter', value: 'O' },
      { t: 200, type: 'letter', value: 'k' },
      { t: 250, type: 'pause' },
      { t: 5_000, type: 'resume' },
      { t: 5_100, type: 'suggestion', value: 'okay', slot: 0 },
      { t: 5_200, type: 'undo_pick' },
      { t: 5_300, type: 'newline' },
      { t: 5_400, type: 'layer', value: 'symbols' },
      { t: 5_500, type: 'letter', value: '7' },
      { t: 5_600, type: 'space' },
      { t: 5_700, type: 'letter', value: 'x' },
      { t: 5_800, type: 'delete_word' },
    ];
    const m = computeTrialMeasures(events, null);
    // "Ok\n7 " is 5 characters; 11 selections (13 steps less pause and resume).
    expect(replayTrial(events)).toBe('Ok\n7 ');
    // 0 → 5 800 ms less the pause from 250 to 5 000 (4 750 ms): 1 050 ms of typing.
    expect(m).toMatchObject({
      characters: 5,
      keystrokes: 11,
      suggestionsTaken: 1,
      durationMs: 1_050,
      pausedMs: 4_750,
    });
    expect(m.kspc).toBeCloseTo(11 / 5, 6);
  });
});

describe('trial measures', () => {
  it('words per minute: 43 characters in 20 s give 25.2 wpm', () => {
    // MacKenzie (2002), "A note on calculating text entry speed": (43 − 1) / 20 s = 2.10 cps;
    // × 60 / 5 = 25.2 wpm (docs/references.md §2, the wpm step derived).
    const phrase = 'the quick brown fox jumps over the lazy dog';
    expect([...phrase].length).toBe(43);
    const m = computeTrialMeasures(typed(phrase, 20_000), phrase);
    expect(m.durationMs).toBe(20_000);
    expect(m.wpm).toBeCloseTo(25.2, 6);
    // One key per character: KSPC 1.00 as for a full keyboard (MacKenzie 2002 [S]), so KS = 0.
    expect(m.kspc).toBe(1);
    expect(m.keystrokeSavings).toBe(0);
    expect(m.errorRate).toBe(0);
  });

  it('counts the characters a picked suggestion adds, its spaces included', () => {
    const events: TrialEvent[] = [
      ...typed('ok.', 200),
      { t: 300, type: 'suggestion', value: 'see', slot: 0 },
      { t: 400, type: 'punctuation', value: '?' },
    ];
    const m = computeTrialMeasures(events, 'ok. see?');
    expect(replayTrial(events)).toBe('ok. see? ');
    expect(m).toMatchObject({ characters: 9, keystrokes: 5, charactersFromSuggestions: 5, errorRate: 0 });
  });

  it('counts a picked suggestion as one keystroke: "he" + "hello" gives 6 characters for 3 keys', () => {
    // Derived: KS = 1 − 3/6 = 0.5, the definition of keystroke savings.
    const events: TrialEvent[] = [
      { t: 0, type: 'offer', words: ['i', 'the'] },
      { t: 100, type: 'letter', value: 'h' },
      { t: 150, type: 'offer', words: ['how', 'he'] },
      { t: 200, type: 'letter', value: 'e' },
      { t: 250, type: 'offer', words: ['hello', 'here'] },
      { t: 900, type: 'suggestion', value: 'hello', slot: 0 },
      { t: 950, type: 'offer', words: [] },
    ];
    const m = computeTrialMeasures(events, null);
    expect(m).toMatchObject({
      characters: 6,
      keystrokes: 3,
      suggestionsOffered: 3,
      suggestionsTaken: 1,
      charactersFromSuggestions: 4,
      errorsCorrected: 0,
      durationMs: 800,
      keystrokeSavings: 0.5,
      kspc: 0.5,
      errorRate: null,
    });
  });

  it('corrections cost keystrokes and can make savings negative', () => {
    const events: TrialEvent[] = [
      ...typed('ax', 300),
      { t: 400, type: 'backspace' },
      { t: 500, type: 'letter', value: 'b' },
    ];
    const m = computeTrialMeasures(events, 'ab');
    expect(m.characters).toBe(2);
    expect(m.keystrokes).toBe(4);
    expect(m.errorsCorrected).toBe(1);
    expect(m.keystrokeSavings).toBe(-1);
    expect(m.errorRate).toBe(0);
  });

  it('minimum string distance is the Levenshtein distance', () => {
    // "kitten" → "sitting" = 3, the usual textbook example (from memory).
    expect(minimumStringDistance('kitten', 'sitting')).toBe(3);
    expect(minimumStringDistance('', 'abc')).toBe(3);
    expect(minimumStringDistance('flaw', 'lawn')).toBe(2);
    // "quickly" typed as "qucehkly": MSD 3, error rate 3/8 (Soukoreff & MacKenzie 2001 — from memory).
    expect(msdErrorRate('quickly', 'qucehkly')).toBeCloseTo(3 / 8, 12);
    expect(msdErrorRate('Tea please', 'tea please ')).toBe(0);
  });
});

describe('practice phrases and the trial schema', () => {
  it('ships lower-case phrases with unique stable ids, typeable on the test keyboard', () => {
    const ids = new Set(builtInPracticePhrases.map((p) => p.id));
    expect(ids.size).toBe(builtInPracticePhrases.length);
    expect(builtInPracticePhrases.length).toBeGreaterThanOrEqual(20);
    for (const p of builtInPracticePhrases) expect(p.text).toMatch(/^[a-z .,?'-]+$/);
  });

  it('refuses a trial without steps and fills defaults', () => {
    const base = {
      localTrialId: '4b9d1c3e-2f7a-4c61-9a0e-8f7b6d5c4a31',
      startedAt: '2026-12-02T10:00:00Z',
      finishedAt: '2026-12-02T10:05:00Z',
      text: 'hi',
      settings: {
        selectionMode: 'direct',
        layout: 'typewriter',
        slots: 5,
        dwellMs: null,
        scanIntervalMs: null,
        largeTargets: false,
        highContrast: false,
        textScale: 1,
        tintKeys: false,
      },
    };
    expect(createTrialSchema.safeParse({ ...base, events: [] }).success).toBe(false);
    const ok = createTrialSchema.parse({ ...base, events: typed('hi', 10) });
    expect(ok).toMatchObject({ phraseId: null, targetPhrase: null, note: '' });
  });
});

describe('paused time is not typing time', () => {
  const letter = (t: number, value: string): TrialEvent => ({ t, type: 'letter', value });

  it('two pauses: 10 s from the first key to the last, 3 s + 2 s paused, leave 5 s for 5 characters', () => {
    const events: TrialEvent[] = [
      letter(0, 'a'),
      letter(1_000, 'b'),
      { t: 1_500, type: 'pause' },
      { t: 4_500, type: 'resume' }, // 3 000 ms paused
      letter(5_000, 'c'),
      { t: 6_000, type: 'pause' },
      { t: 8_000, type: 'resume' }, // 2 000 ms paused
      letter(9_000, 'd'),
      letter(10_000, 'e'),
    ];
    const m = computeTrialMeasures(events, null);
    // Worked by hand: 10 000 − 3 000 − 2 000 = 5 000 ms; (5 − 1) / 5 s × 60 / 5 = 9.6 wpm
    // (with the pauses counted it would be (5 − 1) / 10 s × 12 = 4.8 wpm).
    expect(m).toMatchObject({ characters: 5, durationMs: 5_000, pausedMs: 5_000 });
    expect(m.wpm).toBeCloseTo(9.6, 6);
  });

  it('a pause never resumed counts up to the end', () => {
    // Finished from the pause: the pause starts after the last key, so the typing time is 0 → 2 000 ms.
    const finishedPaused: TrialEvent[] = [
      letter(0, 'a'),
      letter(1_000, 'b'),
      letter(2_000, 'c'),
      { t: 2_500, type: 'pause' },
    ];
    const m = computeTrialMeasures(finishedPaused, null);
    expect(m).toMatchObject({ durationMs: 2_000, pausedMs: 0 });
    // (3 − 1) / 2 s × 12 = 12 wpm.
    expect(m.wpm).toBeCloseTo(12, 6);
    // Up to an end at 4 000 ms: paused from 2 500 to 4 000 = 1 500 ms.
    expect(pausedWithin(finishedPaused, 0, 4_000)).toBe(1_500);
    // A key logged while paused (no resume before it): 1 000 → 4 000 is paused, 1 000 ms typing.
    const keyWhilePaused: TrialEvent[] = [letter(0, 'a'), { t: 1_000, type: 'pause' }, letter(4_000, 'b')];
    expect(computeTrialMeasures(keyWhilePaused, null)).toMatchObject({ durationMs: 1_000, pausedMs: 3_000 });
  });

  it('a resume without a pause, and a second pause before the resume, are ignored', () => {
    const events: TrialEvent[] = [
      letter(0, 'a'),
      { t: 500, type: 'resume' }, // no pause before it: ignored
      letter(1_000, 'b'),
      { t: 2_000, type: 'pause' },
      { t: 2_500, type: 'pause' }, // already paused: ignored
      { t: 3_000, type: 'resume' }, // 2 000 → 3 000: 1 000 ms paused
      letter(4_000, 'c'),
    ];
    const m = computeTrialMeasures(events, null);
    // 4 000 − 1 000 = 3 000 ms; (3 − 1) / 3 s × 12 = 8 wpm.
    expect(m).toMatchObject({ durationMs: 3_000, pausedMs: 1_000 });
    expect(m.wpm).toBeCloseTo(8, 6);
  });
});
