import { describe, expect, it } from 'vitest';
import { expectKeyFactory, isUnder } from '@/testing/query-keys';
import { vocabularyKeys } from './keys';

const listing = { query: '', sort: 'count', show: 'all', page: 1 } as const;

describe('vocabularyKeys', () => {
  it('keeps the client list, the listing pages and the misspellings apart under the vocabulary root', () => {
    expectKeyFactory(vocabularyKeys.all, {
      all: vocabularyKeys.all,
      clientA: vocabularyKeys.client('a'),
      clientB: vocabularyKeys.client('b'),
      versions: vocabularyKeys.versions(),
      page1: vocabularyKeys.words('a', listing),
      page2: vocabularyKeys.words('a', { ...listing, page: 2 }),
      misspellingsA: vocabularyKeys.misspellings('a'),
    });
  });

  it('puts every version key under versions() and no client list there', () => {
    expect(isUnder(vocabularyKeys.misspellings('a'), vocabularyKeys.versions())).toBe(true);
    expect(isUnder(vocabularyKeys.client('a'), vocabularyKeys.versions())).toBe(false);
  });
});
