import { describe, expect, it } from 'vitest';
import { expectKeyFactory, isUnder } from '@/testing/query-keys';
import { sampleKeys } from './keys';

describe('sampleKeys', () => {
  it('keeps lists and details apart under the samples root', () => {
    expectKeyFactory(sampleKeys.all, {
      all: sampleKeys.all,
      lists: sampleKeys.lists(),
      listA: sampleKeys.list('a'),
      listB: sampleKeys.list('b'),
      detailA: sampleKeys.detail('a'),
      detailB: sampleKeys.detail('b'),
    });
  });

  it('lets a flag decision refresh every list but not the detail it has just written', () => {
    expect(isUnder(sampleKeys.list('a'), sampleKeys.lists())).toBe(true);
    expect(isUnder(sampleKeys.detail('a'), sampleKeys.lists())).toBe(false);
  });
});
