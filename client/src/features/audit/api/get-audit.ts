import { type AuditPage, auditPageSchema } from '@keyloom/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { env } from '@/config/env';
import { apiRequest, toQueryString } from '@/lib/api-client';
import { auditKeys } from './keys';

/** The audit filters as they appear in the page's address; empty strings mean "any". */
export type AuditFilters = {
  clientId: string;
  userId: string;
  action: string;
  from: string;
  to: string;
  page: number;
};

/** The query string for GET /api/audit: only the filters that are set, page 1 left out. */
export const auditQueryString = (filters: AuditFilters): string =>
  toQueryString({
    clientId: filters.clientId,
    userId: filters.userId,
    action: filters.action,
    from: filters.from,
    to: filters.to,
    page: filters.page > 1 ? filters.page : undefined,
  });

/** GET /api/audit.csv: every event matching the filters (the page does not matter). */
export const auditCsvUrl = (filters: AuditFilters): string =>
  `${env.API_URL}/audit.csv${auditQueryString({ ...filters, page: 1 })}`;

/** One page of audit events, newest first (supervisor, admin). */
export const getAudit = (filters: AuditFilters, signal?: AbortSignal): Promise<AuditPage> =>
  apiRequest(`/audit${auditQueryString(filters)}`, { schema: auditPageSchema, signal });

export const auditQueryOptions = (filters: AuditFilters) =>
  queryOptions({
    queryKey: auditKeys.list(filters),
    queryFn: ({ signal }) => getAudit(filters, signal),
    placeholderData: keepPreviousData,
  });

export const useAudit = (filters: AuditFilters) => useQuery(auditQueryOptions(filters));
