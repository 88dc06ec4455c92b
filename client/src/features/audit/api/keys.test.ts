import { describe, it } from 'vitest';
import { expectKeyFactory } from '@/testing/query-keys';
import type { AuditFilters } from './get-audit';
import { auditKeys } from './keys';

const filters: AuditFilters = { clientId: '', userId: '', action: '', from: '', to: '', page: 1 };

describe('auditKeys', () => {
  it('gives each set of filters its own key under the audit root', () => {
    expectKeyFactory(auditKeys.all, {
      all: auditKeys.all,
      firstPage: auditKeys.list(filters),
      secondPage: auditKeys.list({ ...filters, page: 2 }),
      oneClient: auditKeys.list({ ...filters, clientId: 'c1' }),
    });
  });
});
