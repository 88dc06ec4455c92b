import { type ClientSummary, clientSummarySchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { clientKeys } from './keys';

const clientListSchema = z.array(clientSummarySchema);

/** The clients the signed-in user may see: own caseload, the clinic, or assigned clients (by role). */
export const getClients = (signal?: AbortSignal): Promise<ClientSummary[]> =>
  apiRequest('/clients', { schema: clientListSchema, signal });

export const clientsQueryOptions = () =>
  queryOptions({
    queryKey: clientKeys.list(),
    queryFn: ({ signal }) => getClients(signal),
  });

export const useClients = (options: { enabled?: boolean } = {}) =>
  useQuery({ ...clientsQueryOptions(), enabled: options.enabled ?? true });
