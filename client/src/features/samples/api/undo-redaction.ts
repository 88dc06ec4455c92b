import { type SampleDetail, sampleDetailSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { storeSampleDetail } from './decide-flag';

export type UndoRedactionVariables = { sampleId: string; flagId: string };

/** Puts a redacted span's original text back (until a version trains on the sample). */
export const undoRedaction = ({ sampleId, flagId }: UndoRedactionVariables): Promise<SampleDetail> =>
  apiRequest(`/samples/${encodeURIComponent(sampleId)}/flags/${encodeURIComponent(flagId)}/undo`, {
    method: 'POST',
    schema: sampleDetailSchema,
  });

export const useUndoRedaction = () => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: undoRedaction, onSuccess: storeSampleDetail(queryClient) });
};
