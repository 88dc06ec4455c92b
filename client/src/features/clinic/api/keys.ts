import { queryRoots } from '@/lib/query-keys';

/** Query keys of the clinic's own details. */
export const clinicKeys = {
  all: queryRoots.clinic,
  settings: () => [...clinicKeys.all, 'settings'] as const,
};
