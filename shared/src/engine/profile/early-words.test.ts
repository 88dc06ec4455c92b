import { describe, expect, it } from 'vitest';
import { countEarlyWords, EarlyWordRecorder, isListableEarlyWord, topEarlyWords } from './early-words';
import { profileReportSchema } from '../../schemas/profile-report.schema';

// The rule (no digits, at least three letters) is the product's own choice: common practice, no source.

const SLOTS = 3;
const codePoints = (s: string) => Array.from(s, (c) => c.codePointAt(0) ?? 0);

/** Visits every space-separated word of `text`; `shownAt(word)` gives the letters typed before it was offered. */
function record(text: string, shownAt: (word: string) => number): EarlyWordRecorder {
  const recorder = new EarlyWordRecorder(SLOTS);
  const re = /\S+/g;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    const firstShownAt = new Int32Array(SLOTS + 1).fill(-1);
    firstShownAt[SLOTS] = shownAt(m[0]);
    recorder.record({ start: m.index, end: m.index + m[0].length, firstShownAt });
  }
  return recorder;
}

describe('words offered early', () => {
  const text = 'the kettle and 14 Bramley 3pm is ok tea kettle';
  const profile = record(text, () => 0); // the profile offers every word before its first letter
  const base = record(text, (w) => (w === 'tea' ? 0 : -1)); // the base offers only "tea"

  it('leaves out numbers, words with digits and words shorter than three letters', () => {
    const counts = new Map<string, number>();
    countEarlyWords(codePoints(text), profile, base, counts);
    expect(Object.fromEntries(counts)).toEqual({ the: 1, kettle: 2, and: 1, Bramley: 1 });
    expect(topEarlyWords(counts, 2)).toEqual([
      { word: 'kettle', count: 2 },
      { word: 'Bramley', count: 1 },
    ]);
  });

  it('counts letters, not characters, for the length rule', () => {
    expect(isListableEarlyWord("I'm")).toBe(false);
    expect(isListableEarlyWord("can't")).toBe(true);
    expect(isListableEarlyWord('café')).toBe(true);
    expect(isListableEarlyWord('a2b')).toBe(false);
    expect(isListableEarlyWord('٣٤٥')).toBe(false); // digits of another script are numbers too
  });

  it('an older stored report whose list holds numbers and short words still parses', () => {
    const shape = profileReportSchema.shape.earlyWords;
    const older = [
      { word: 'the', count: 9 },
      { word: '14', count: 3 },
      { word: 'ok', count: 2 },
    ];
    expect(shape.parse(older)).toEqual(older);
  });
});
