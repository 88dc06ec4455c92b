import { type Summary, summarySchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/** Sends the same summary again, as a new round, to the original contacts who may still receive it. */
export const resendSummary = (summaryId: string): Promise<Summary> =>
  apiRequest(`/summaries/${encodeURIComponent(summaryId)}/resend`, {
    method: 'POST',
    schema: summarySchema,
  });

export const useResendSummary = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendSummary,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['summaries'] }),
  });
};
