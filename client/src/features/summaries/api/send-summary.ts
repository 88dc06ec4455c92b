import { type Summary, summarySchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { idempotencyHeader } from './idempotency-key';
import { summaryKeys } from './keys';

export type SendSummaryVariables = { summaryId: string; idempotencyKey: string };

/**
 * Sends a draft as it stands: one e-mail per recipient, queued at once. A retry with the same key gets
 * the first answer and sends nothing again.
 */
export const sendSummary = ({ summaryId, idempotencyKey }: SendSummaryVariables): Promise<Summary> =>
  apiRequest(`/summaries/${encodeURIComponent(summaryId)}/send`, {
    method: 'POST',
    schema: summarySchema,
    headers: idempotencyHeader(idempotencyKey),
  });

export const useSendSummary = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: sendSummary,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: summaryKeys.all }),
  });
};
