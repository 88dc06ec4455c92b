import { describe, expect, it } from 'vitest';
import { expectKeyFactory } from '@/testing/query-keys';
import { authKeys } from './keys';

describe('authKeys', () => {
  it('keeps the session under the auth root that sign-in and sign-out spare', () => {
    expectKeyFactory(authKeys.all, { all: authKeys.all, me: authKeys.me() });
    expect(authKeys.me()[0]).toBe(authKeys.all[0]);
  });
});
