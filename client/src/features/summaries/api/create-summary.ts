import { type CreateSummaryInput, type Summary, summarySchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export type CreateSummaryVariables = { clientId: string; input: CreateSummaryInput };

/** Stores the summary and queues one e-mail per recipient (owning clinician); answers at once. */
export const createSummary = ({ clientId, input }: CreateSummaryVariables): Promise<Summary> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/summaries`, {
    method: 'POST',
    body: input,
    schema: summarySchema,
  });

export const useCreateSummary = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSummary,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['summaries'] }),
  });
};
