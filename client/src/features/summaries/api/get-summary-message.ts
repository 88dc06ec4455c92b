import { type SummaryMessagePreview, summaryMessagePreviewSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { summaryKeys } from './keys';

/** The e-mail exactly as the family receives it: HTML and plain-text parts, headers, charts. */
export const getSummaryMessage = (summaryId: string): Promise<SummaryMessagePreview> =>
  apiRequest(`/summaries/${encodeURIComponent(summaryId)}/message`, { schema: summaryMessagePreviewSchema });

export const summaryMessageQueryOptions = (summaryId: string) =>
  queryOptions({
    queryKey: summaryKeys.message(summaryId),
    queryFn: () => getSummaryMessage(summaryId),
  });

export const useSummaryMessage = (summaryId: string, enabled: boolean) =>
  useQuery({ ...summaryMessageQueryOptions(summaryId), enabled });
