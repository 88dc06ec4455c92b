import { type Summary, summarySchema, type UpdateSummaryInput } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { summaryKeys } from './keys';

export type UpdateSummaryVariables = { summaryId: string; input: UpdateSummaryInput };

/** Changes a draft summary (owning clinician): subject, text, versions, ticked comments, recipients. */
export const updateSummary = ({ summaryId, input }: UpdateSummaryVariables): Promise<Summary> =>
  apiRequest(`/summaries/${encodeURIComponent(summaryId)}`, {
    method: 'PATCH',
    body: input,
    schema: summarySchema,
  });

export const useUpdateSummary = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSummary,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: summaryKeys.all }),
  });
};
