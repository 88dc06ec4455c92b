import { describe, expect, it } from 'vitest';
import { expectKeyFactory, isUnder } from '@/testing/query-keys';
import { profileVersionKeys } from './keys';

describe('profileVersionKeys', () => {
  it('keeps lists and details apart under the profile-versions root', () => {
    expectKeyFactory(profileVersionKeys.all, {
      all: profileVersionKeys.all,
      lists: profileVersionKeys.lists(),
      listA: profileVersionKeys.list('a'),
      listB: profileVersionKeys.list('b'),
      detailA: profileVersionKeys.detail('a'),
      detailB: profileVersionKeys.detail('b'),
    });
  });

  it('puts every client’s list under lists() and no detail there', () => {
    expect(isUnder(profileVersionKeys.list('a'), profileVersionKeys.lists())).toBe(true);
    expect(isUnder(profileVersionKeys.detail('a'), profileVersionKeys.lists())).toBe(false);
  });
});
