import { describe, expect, it } from 'vitest';
import { queryRoots } from '@/lib/query-keys';
import { expectKeyFactory, isUnder } from '@/testing/query-keys';
import { practicePhraseKeys, trialKeys } from './keys';

describe('trialKeys and practicePhraseKeys', () => {
  it('keeps each version’s trials and each client’s phrases apart', () => {
    expectKeyFactory(trialKeys.all, { all: trialKeys.all, a: trialKeys.list('a'), b: trialKeys.list('b') });
    expectKeyFactory(practicePhraseKeys.all, {
      all: practicePhraseKeys.all,
      a: practicePhraseKeys.list('a'),
      b: practicePhraseKeys.list('b'),
    });
  });

  it('puts trials under profile versions and phrases under clients, as before', () => {
    expect(isUnder(trialKeys.list('a'), queryRoots.profileVersions)).toBe(true);
    expect(isUnder(practicePhraseKeys.list('a'), queryRoots.clients)).toBe(true);
  });
});
