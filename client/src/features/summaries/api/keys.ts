import { queryRoots } from '@/lib/query-keys';

/** Query keys of progress summaries. */
export const summaryKeys = {
  all: queryRoots.summaries,
  list: (clientId: string) => [...summaryKeys.all, 'list', clientId] as const,
  message: (summaryId: string) => [...summaryKeys.all, 'message', summaryId] as const,
};
