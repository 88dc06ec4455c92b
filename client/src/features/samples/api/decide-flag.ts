import { type FlagDecisionInput, type SampleDetail, sampleDetailSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { sampleKeys } from './keys';

export type DecideFlagVariables = { sampleId: string; flagId: string; decision: FlagDecisionInput };

/** Redacts a flagged span, or keeps it with a reason; answers with the updated sample. */
export const decideFlag = ({ sampleId, flagId, decision }: DecideFlagVariables): Promise<SampleDetail> =>
  apiRequest(`/samples/${encodeURIComponent(sampleId)}/flags/${encodeURIComponent(flagId)}`, {
    method: 'POST',
    body: decision,
    schema: sampleDetailSchema,
  });

export const useDecideFlag = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: decideFlag,
    onSuccess: async (sample) => {
      queryClient.setQueryData(sampleKeys.detail(sample.id), sample);
      await queryClient.invalidateQueries({ queryKey: sampleKeys.lists() });
    },
  });
};
