import { describe, it } from 'vitest';
import { expectKeyFactory } from '@/testing/query-keys';
import { clinicKeys } from './keys';

describe('clinicKeys', () => {
  it('keeps the clinic details under the clinic root', () => {
    expectKeyFactory(clinicKeys.all, { all: clinicKeys.all, settings: clinicKeys.settings() });
  });
});
