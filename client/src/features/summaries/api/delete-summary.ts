import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { summaryKeys } from './keys';

/** Deletes a draft summary (nothing was sent). */
export const deleteSummary = (summaryId: string): Promise<void> =>
  apiRequest(`/summaries/${encodeURIComponent(summaryId)}`, { method: 'DELETE' });

export const useDeleteSummary = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSummary,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: summaryKeys.all }),
  });
};
