import { describe, it } from 'vitest';
import { expectKeyFactory } from '@/testing/query-keys';
import { userKeys } from './keys';

describe('userKeys', () => {
  it('keeps the staff list under the users root', () => {
    expectKeyFactory(userKeys.all, { all: userKeys.all, list: userKeys.list() });
  });
});
