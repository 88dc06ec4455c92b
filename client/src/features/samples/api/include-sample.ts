import { type SampleSummary, sampleSummarySchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { sampleKeys } from './keys';

/** Takes a left-out sample back in (ready, or needing review while flags are open). */
export const includeSample = (sampleId: string): Promise<SampleSummary> =>
  apiRequest(`/samples/${encodeURIComponent(sampleId)}/include`, {
    method: 'POST',
    schema: sampleSummarySchema,
  });

export const useIncludeSample = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: includeSample,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sampleKeys.all }),
  });
};
