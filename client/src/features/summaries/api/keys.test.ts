import { describe, it } from 'vitest';
import { expectKeyFactory } from '@/testing/query-keys';
import { summaryKeys } from './keys';

describe('summaryKeys', () => {
  it('gives each client’s summaries their own key under the summaries root', () => {
    expectKeyFactory(summaryKeys.all, {
      all: summaryKeys.all,
      a: summaryKeys.list('a'),
      b: summaryKeys.list('b'),
    });
  });
});
