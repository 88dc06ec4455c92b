import { describe, expect, it } from 'vitest';
import { clientVocabularyState } from '../testing/vocabulary-data';
import { listProblem, vocabularyDifferences, withKeptSpelling, wordRange } from './vocabulary-lists';

describe('vocabulary lists', () => {
  it('names the words shown, with thousands separators, and none for an empty page', () => {
    const words = Array.from({ length: 50 }, () => ({}));
    expect(wordRange({ page: 2, pageSize: 50, total: 6467, words } as never)).toBe('Words 51–100 of 6,467');
    expect(wordRange({ page: 130, pageSize: 50, total: 6467, words: words.slice(0, 17) } as never)).toBe(
      'Words 6,451–6,467 of 6,467',
    );
    expect(wordRange({ page: 1, pageSize: 50, total: 0, words: [] })).toBe('No words');
  });

  it('keeps a spelling once, whatever its capitals', () => {
    const state = clientVocabularyState(undefined, { keptSpellings: ['Tommorow'] });
    expect(withKeptSpelling(state, 'tommorow').keptSpellings).toEqual(['Tommorow']);
    expect(withKeptSpelling(state, 'recieve').keptSpellings).toEqual(['Tommorow', 'recieve']);
  });

  it('checks a changed list with the shared schema before it is sent', () => {
    const { vocabulary } = clientVocabularyState();
    expect(listProblem(vocabulary)).toBeNull();
    expect(
      listProblem({
        ...vocabulary,
        blocks: [...vocabulary.blocks, { word: 'OKAFOR', replacement: undefined }],
      }),
    ).toBe('"OKAFOR" is also added: remove the addition or the block.');
  });

  it('lists what a later list adds and takes out', () => {
    const diff = vocabularyDifferences(
      { additions: [{ text: 'Okafor' }, { text: 'Marina', weight: 5 }], blocks: [] },
      {
        additions: [{ text: 'Okafor' }, { text: 'Marina', weight: 8 }],
        blocks: [{ word: 'lousy', replacement: undefined }],
      },
    );
    expect(diff).toEqual({
      additions: { added: ['Marina (weight 8)'], removed: ['Marina (weight 5)'] },
      blocks: { added: ['lousy'], removed: [] },
    });
  });
});
