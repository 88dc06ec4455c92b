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
    onSuccess: (saved) => {
      // The saved draft at once (the editor starts again from it, so Send is on without waiting).
      queryClient.setQueryData<Summary[]>(summaryKeys.list(saved.clientId), (list) =>
        list?.map((summary) => (summary.id === saved.id ? saved : summary)),
      );
      return queryClient.invalidateQueries({ queryKey: summaryKeys.all });
    },
  });
};
