import { type Client, clientSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { clientKeys } from './keys';

/** One client's record; 404 for a client outside the reader's caseload or assignments. */
export const getClient = (clientId: string, signal?: AbortSignal): Promise<Client> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}`, { schema: clientSchema, signal });

export const clientQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: clientKeys.detail(clientId),
    queryFn: ({ signal }) => getClient(clientId, signal),
  });

export const useClient = (clientId: string) => useQuery(clientQueryOptions(clientId));
