import { queryRoots } from '@/lib/query-keys';

/** Query keys of the printed reports: a version's, and a client's over a period. */
export const reportKeys = {
  all: queryRoots.reports,
  version: (versionId: string) => [...reportKeys.all, 'version', versionId] as const,
  client: (clientId: string, period: { from?: string; to?: string }) =>
    [...reportKeys.all, 'client', clientId, { from: period.from ?? null, to: period.to ?? null }] as const,
};
