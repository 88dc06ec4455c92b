import { queryRoots } from '@/lib/query-keys';

/** Query keys of a client's contacts (under the clients root: a client change refreshes them). */
export const contactKeys = {
  all: [...queryRoots.clients, 'contacts'] as const,
  list: (clientId: string) => [...contactKeys.all, clientId] as const,
};

/** Query keys of a client's consents (under the clients root: a client change refreshes them). */
export const consentKeys = {
  all: [...queryRoots.clients, 'consents'] as const,
  list: (clientId: string) => [...consentKeys.all, clientId] as const,
  withdrawalPreview: (clientId: string, consentId: string) =>
    [...consentKeys.list(clientId), 'withdrawal-preview', consentId] as const,
};
