import { type CreateSummaryInput, type Summary, summarySchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { idempotencyHeader } from './idempotency-key';
import { summaryKeys } from './keys';

export type CreateSummaryVariables = { clientId: string; input: CreateSummaryInput; idempotencyKey: string };

/**
 * Stores the summary and queues one e-mail per recipient (owning clinician); answers at once. A retry
 * with the same key gets the first answer and sends nothing again.
 */
export const createSummary = ({
  clientId,
  input,
  idempotencyKey,
}: CreateSummaryVariables): Promise<Summary> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/summaries`, {
    method: 'POST',
    body: input,
    schema: summarySchema,
    headers: idempotencyHeader(idempotencyKey),
  });

export const useCreateSummary = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSummary,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: summaryKeys.all }),
  });
};
