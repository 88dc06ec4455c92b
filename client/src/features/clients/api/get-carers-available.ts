import { type PersonRef, personRefSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { clientKeys } from './keys';

const carerListSchema = z.array(personRefSchema);

/** Active carers who can be assigned to the client (owning clinician or admin). */
export const getCarersAvailable = (clientId: string, signal?: AbortSignal): Promise<PersonRef[]> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/carers-available`, {
    schema: carerListSchema,
    signal,
  });

export const carersAvailableQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: clientKeys.carersAvailable(clientId),
    queryFn: ({ signal }) => getCarersAvailable(clientId, signal),
  });

export const useCarersAvailable = (clientId: string, enabled = true) =>
  useQuery({ ...carersAvailableQueryOptions(clientId), enabled });
