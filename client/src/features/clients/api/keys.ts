import { queryRoots } from '@/lib/query-keys';

/**
 * Query keys of clients. Other features keep a client's contacts, consents and practice phrases
 * under the same root, so invalidating `all` refreshes everything shown about a client.
 */
export const clientKeys = {
  all: queryRoots.clients,
  list: () => [...clientKeys.all, 'list'] as const,
  detail: (clientId: string) => [...clientKeys.all, 'detail', clientId] as const,
  carersAvailable: (clientId: string) => [...clientKeys.all, 'carers-available', clientId] as const,
};
