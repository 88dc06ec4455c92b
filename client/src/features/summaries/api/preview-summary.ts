import { type SummaryPreview, type SummaryPreviewRequest, summaryPreviewSchema } from '@keyloom/shared';
import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export type PreviewSummaryVariables = { clientId: string; input: SummaryPreviewRequest };

/** What the e-mail would say and show (owning clinician); nothing is stored or sent. */
export const previewSummary = ({ clientId, input }: PreviewSummaryVariables): Promise<SummaryPreview> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/summaries/preview`, {
    method: 'POST',
    body: input,
    schema: summaryPreviewSchema,
  });

export const usePreviewSummary = () => useMutation({ mutationFn: previewSummary });
