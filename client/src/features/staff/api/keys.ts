import { queryRoots } from '@/lib/query-keys';

/** Query keys of staff accounts. */
export const userKeys = {
  all: queryRoots.users,
  list: () => [...userKeys.all, 'list'] as const,
};
