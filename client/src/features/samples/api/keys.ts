import { queryRoots } from '@/lib/query-keys';

/** Query keys of samples: `lists()` covers every client's list, `all` the details too. */
export const sampleKeys = {
  all: queryRoots.samples,
  lists: () => [...sampleKeys.all, 'list'] as const,
  list: (clientId: string) => [...sampleKeys.lists(), clientId] as const,
  detail: (sampleId: string) => [...sampleKeys.all, 'detail', sampleId] as const,
};
