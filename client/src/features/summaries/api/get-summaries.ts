import { type Summary, summarySchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { summaryKeys } from './keys';

const summaryListSchema = z.array(summarySchema);

/** A client's progress summaries, newest first (owning clinician, supervisor). */
export const getSummaries = (clientId: string, signal?: AbortSignal): Promise<Summary[]> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/summaries`, { schema: summaryListSchema, signal });

export const summariesQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: summaryKeys.list(clientId),
    queryFn: ({ signal }) => getSummaries(clientId, signal),
    // E-mails go out from the background worker: look again every few seconds while any waits.
    refetchInterval: (query) =>
      query.state.data?.some((summary) => summary.status === 'sending') ? 3000 : false,
  });

export const useSummaries = (clientId: string) => useQuery(summariesQueryOptions(clientId));
