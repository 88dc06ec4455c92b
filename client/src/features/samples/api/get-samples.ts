import { type SampleSummary, sampleSummarySchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { sampleKeys } from './keys';

const sampleListSchema = z.array(sampleSummarySchema);

/** A client's language samples with their statistics and review status. */
export const getSamples = (clientId: string, signal?: AbortSignal): Promise<SampleSummary[]> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/samples`, { schema: sampleListSchema, signal });

export const samplesQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: sampleKeys.list(clientId),
    queryFn: ({ signal }) => getSamples(clientId, signal),
  });

export const useSamples = (clientId: string) => useQuery(samplesQueryOptions(clientId));
