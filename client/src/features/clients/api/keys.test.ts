import { describe, it } from 'vitest';
import { expectKeyFactory } from '@/testing/query-keys';
import { clientKeys } from './keys';

describe('clientKeys', () => {
  it('keeps the list, each detail and each carer list apart, all under the clients root', () => {
    expectKeyFactory(clientKeys.all, {
      all: clientKeys.all,
      list: clientKeys.list(),
      detailA: clientKeys.detail('a'),
      detailB: clientKeys.detail('b'),
      carersA: clientKeys.carersAvailable('a'),
      carersB: clientKeys.carersAvailable('b'),
    });
  });
});
