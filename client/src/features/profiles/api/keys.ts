import { queryRoots } from '@/lib/query-keys';

/** Query keys of profile versions: invalidating `all` refreshes every list, detail and trial list. */
export const profileVersionKeys = {
  all: queryRoots.profileVersions,
  lists: () => [...profileVersionKeys.all, 'list'] as const,
  list: (clientId: string) => [...profileVersionKeys.lists(), clientId] as const,
  detail: (versionId: string) => [...profileVersionKeys.all, 'detail', versionId] as const,
};
