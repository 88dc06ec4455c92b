import { describe, expect, it } from 'vitest';
import { clientVocabularySchema, vocabularyQuerySchema } from './vocabulary.schema';
import { profileSettingsSchema } from './profile-settings.schema';

const messages = (input: unknown): string[] => {
  const result = clientVocabularySchema.safeParse(input);
  return result.success ? [] : result.error.issues.map((i) => i.message);
};

describe('client vocabulary schema (the one contract for forms, API and engine)', () => {
  it('accepts additions with weights given as form digits, and an empty replacement as none', () => {
    const v = clientVocabularySchema.parse({
      additions: [{ text: ' Dr Okafor ', weight: '5' }, { text: 'hospice' }],
      blocks: [
        { word: 'recieve', replacement: 'receive' },
        { word: 'darn', replacement: '' },
      ],
    });
    expect(v.additions).toEqual([{ text: 'Dr Okafor', weight: 5 }, { text: 'hospice' }]);
    expect(v.blocks).toEqual([{ word: 'recieve', replacement: 'receive' }, { word: 'darn' }]);
  });

  it('refuses duplicates, a word both added and blocked, and what the engine cannot use', () => {
    expect(messages({ additions: [{ text: 'Okafor' }, { text: 'okafor' }] })).toEqual([
      '"okafor" is already added.',
    ]);
    expect(messages({ additions: [{ text: 'Okafor' }], blocks: [{ word: 'OKAFOR' }] })).toEqual([
      '"OKAFOR" is also added: remove the addition or the block.',
    ]);
    // The engine's rules: a block is one word; an addition holds at most six words.
    expect(messages({ blocks: [{ word: 'two words' }] })[0]).toMatch(/must be one word/);
    expect(messages({ additions: [{ text: 'one two three four five six seven' }] })[0]).toMatch(
      /more than 6 words/,
    );
    expect(messages({ blocks: [{ word: 'a1', replacement: 'b2' }, { word: 'b2' }] })).not.toEqual([]);
    expect(messages({ additions: [{ text: 'x', weight: 0 }] })[0]).toMatch(/weight from 1 to 100/);
  });

  it('is part of the version settings, empty for settings stored before it existed', () => {
    const stored = { order: 5, escape: 'C', exclusion: true, baseWeight: 'auto', slots: 5, caseFold: false };
    expect(profileSettingsSchema.parse({ ...stored, access: { method: 'direct' } }).vocabulary).toEqual({
      additions: [],
      blocks: [],
    });
  });

  it('reads the listing query from URL strings with its defaults', () => {
    expect(vocabularyQuerySchema.parse({ page: '3', sort: 'word' })).toEqual({
      query: '',
      sort: 'word',
      show: 'all',
      page: 3,
      pageSize: 50,
    });
    expect(vocabularyQuerySchema.safeParse({ pageSize: '1000' }).success).toBe(false);
  });
});
