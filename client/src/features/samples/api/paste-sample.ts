import { type PasteSampleInput, type UploadResult, uploadResultSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { sampleKeys } from './keys';

export type PasteSampleVariables = { clientId: string; input: PasteSampleInput };

/** Stores pasted text as a sample (JSON body on the upload route). */
export const pasteSample = ({ clientId, input }: PasteSampleVariables): Promise<UploadResult> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/samples`, {
    method: 'POST',
    body: input,
    schema: uploadResultSchema,
  });

export const usePasteSample = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: pasteSample,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sampleKeys.all }),
  });
};
