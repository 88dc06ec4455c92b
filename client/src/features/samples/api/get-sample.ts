import { type SampleDetail, sampleDetailSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { sampleKeys } from './keys';

/** One sample: statistics, current text and personal-data flags. */
export const getSample = (sampleId: string, signal?: AbortSignal): Promise<SampleDetail> =>
  apiRequest(`/samples/${encodeURIComponent(sampleId)}`, { schema: sampleDetailSchema, signal });

export const sampleQueryOptions = (sampleId: string) =>
  queryOptions({
    queryKey: sampleKeys.detail(sampleId),
    queryFn: ({ signal }) => getSample(sampleId, signal),
  });

export const useSample = (sampleId: string) => useQuery(sampleQueryOptions(sampleId));
