import { type FlagDecisionInput, type SampleDetail, sampleDetailSchema } from '@keyloom/shared';
import { type QueryClient, useMutation, useQueryClient } from '@tanstack/react-query';
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

/** After a change answered with the whole sample: the detail as answered, the lists fetched again. */
export const storeSampleDetail = (queryClient: QueryClient) => async (sample: SampleDetail) => {
  queryClient.setQueryData(sampleKeys.detail(sample.id), sample);
  await queryClient.invalidateQueries({ queryKey: sampleKeys.lists() });
};

export const useDecideFlag = () => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: decideFlag, onSuccess: storeSampleDetail(queryClient) });
};
