import { type Summary, summarySchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { idempotencyHeader } from './idempotency-key';
import { summaryKeys } from './keys';

export type ResendSummaryVariables = { summaryId: string; idempotencyKey: string };

/**
 * Sends the same summary again, as a new round, to the original contacts who may still receive it.
 * A retry with the same key gets the first answer and adds no round.
 */
export const resendSummary = ({ summaryId, idempotencyKey }: ResendSummaryVariables): Promise<Summary> =>
  apiRequest(`/summaries/${encodeURIComponent(summaryId)}/resend`, {
    method: 'POST',
    schema: summarySchema,
    headers: idempotencyHeader(idempotencyKey),
  });

export const useResendSummary = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendSummary,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: summaryKeys.all }),
  });
};
