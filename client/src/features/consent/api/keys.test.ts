import { describe, expect, it } from 'vitest';
import { queryRoots } from '@/lib/query-keys';
import { expectKeyFactory, isUnder } from '@/testing/query-keys';
import { consentKeys, contactKeys } from './keys';

describe('contactKeys and consentKeys', () => {
  it('keeps contacts and consents of each client apart', () => {
    expectKeyFactory(contactKeys.all, {
      all: contactKeys.all,
      listA: contactKeys.list('a'),
      listB: contactKeys.list('b'),
    });
    expectKeyFactory(consentKeys.all, {
      all: consentKeys.all,
      listA: consentKeys.list('a'),
      listB: consentKeys.list('b'),
      previewA1: consentKeys.withdrawalPreview('a', '1'),
      previewA2: consentKeys.withdrawalPreview('a', '2'),
      previewB1: consentKeys.withdrawalPreview('b', '1'),
    });
  });

  it('lies under the clients root, so a client change refreshes them, without overlapping', () => {
    expect(isUnder(contactKeys.list('a'), queryRoots.clients)).toBe(true);
    expect(isUnder(consentKeys.withdrawalPreview('a', '1'), queryRoots.clients)).toBe(true);
    expect(isUnder(contactKeys.list('a'), consentKeys.all)).toBe(false);
    expect(isUnder(consentKeys.list('a'), contactKeys.all)).toBe(false);
  });
});
