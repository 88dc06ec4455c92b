import { type ExcludeSampleInput, type SampleSummary, sampleSummarySchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { sampleKeys } from './keys';

export type ExcludeSampleVariables = { sampleId: string; input: ExcludeSampleInput };

/** Leaves a sample out of training for good, with the reason on record. */
export const excludeSample = ({ sampleId, input }: ExcludeSampleVariables): Promise<SampleSummary> =>
  apiRequest(`/samples/${encodeURIComponent(sampleId)}/exclude`, {
    method: 'POST',
    body: input,
    schema: sampleSummarySchema,
  });

export const useExcludeSample = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: excludeSample,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sampleKeys.all }),
  });
};
