import { queryRoots } from '@/lib/query-keys';

/** Query keys of the session. Signing in or out drops every cached answer outside `all`. */
export const authKeys = {
  all: queryRoots.auth,
  me: () => [...authKeys.all, 'me'] as const,
};
