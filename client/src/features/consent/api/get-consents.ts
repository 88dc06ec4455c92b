import { type Consent, consentSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { consentKeys } from './keys';

const consentListSchema = z.array(consentSchema);

/** Every consent record of a client, withdrawn ones included (clinician, supervisor). */
export const getConsents = (clientId: string, signal?: AbortSignal): Promise<Consent[]> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/consents`, { schema: consentListSchema, signal });

export const consentsQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: consentKeys.list(clientId),
    queryFn: ({ signal }) => getConsents(clientId, signal),
  });

export const useConsents = (clientId: string) => useQuery(consentsQueryOptions(clientId));
