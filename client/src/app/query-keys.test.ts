import { type QueryKey } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import type { AuditFilters } from '@/features/audit/api/get-audit';
import { auditKeys } from '@/features/audit/api/keys';
import { authKeys } from '@/features/auth/api/keys';
import { clientKeys } from '@/features/clients/api/keys';
import { consentKeys, contactKeys } from '@/features/consent/api/keys';
import { practicePhraseKeys, trialKeys } from '@/features/keyboard/api/keys';
import { profileVersionKeys } from '@/features/profiles/api/keys';
import { sampleKeys } from '@/features/samples/api/keys';
import { userKeys } from '@/features/staff/api/keys';
import { summaryKeys } from '@/features/summaries/api/keys';
import { vocabularyKeys } from '@/features/vocabulary/api/keys';
import { queryRoots } from '@/lib/query-keys';
import { expectKeyFactory, isUnder } from '@/testing/query-keys';

const filters: AuditFilters = { clientId: 'a', userId: '', action: '', from: '', to: '', page: 1 };

// One id for every resource: keys of different features that took the same id must still differ.
const id = 'a';
const everyKey: Record<string, QueryKey> = {
  me: authKeys.me(),
  audit: auditKeys.list(filters),
  clientList: clientKeys.list(),
  client: clientKeys.detail(id),
  carers: clientKeys.carersAvailable(id),
  contacts: contactKeys.list(id),
  consents: consentKeys.list(id),
  withdrawalPreview: consentKeys.withdrawalPreview(id, id),
  trials: trialKeys.list(id),
  practicePhrases: practicePhraseKeys.list(id),
  versionList: profileVersionKeys.list(id),
  version: profileVersionKeys.detail(id),
  sampleList: sampleKeys.list(id),
  sample: sampleKeys.detail(id),
  users: userKeys.list(),
  summaries: summaryKeys.list(id),
  clientVocabulary: vocabularyKeys.client(id),
  vocabularyWords: vocabularyKeys.words(id, { query: '', sort: 'count', show: 'all', page: 1 }),
  misspellings: vocabularyKeys.misspellings(id),
};

describe('query keys across features', () => {
  it('never give two resources the same key', () => {
    expectKeyFactory([], everyKey);
  });

  it('put every key under exactly one root, and no root under another', () => {
    const roots = Object.values(queryRoots);
    for (const [name, key] of Object.entries(everyKey)) {
      expect(
        roots.filter((root) => isUnder(key, root)),
        name,
      ).toHaveLength(1);
    }
    for (const root of roots) expect(roots.filter((other) => isUnder(root, other))).toEqual([root]);
  });
});
