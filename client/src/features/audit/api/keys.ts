import { queryRoots } from '@/lib/query-keys';
import type { AuditFilters } from './get-audit';

/** Query keys of the audit log: one page per set of filters. */
export const auditKeys = {
  all: queryRoots.audit,
  list: (filters: AuditFilters) => [...auditKeys.all, 'list', filters] as const,
};
