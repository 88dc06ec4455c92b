import type { DeleteSampleInput } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { sampleKeys } from './keys';

export type DeleteSampleVariables = { sampleId: string; input: DeleteSampleInput };

/** Deletes a sample uploaded by mistake (refused once a version has trained on it). */
export const deleteSample = ({ sampleId, input }: DeleteSampleVariables): Promise<unknown> =>
  apiRequest(`/samples/${encodeURIComponent(sampleId)}`, { method: 'DELETE', body: input });

export const useDeleteSample = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSample,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sampleKeys.all }),
  });
};
