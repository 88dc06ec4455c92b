import { type UploadResult, type UploadSamplesFields, uploadResultSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { sampleKeys } from './keys';

export type UploadSamplesVariables = {
  clientId: string;
  files: readonly File[];
  fields: UploadSamplesFields;
};

/**
 * Sends files as multipart field `files` with the sample fields beside them.
 * Fields left empty are not sent.
 */
export const uploadSamples = ({ clientId, files, fields }: UploadSamplesVariables): Promise<UploadResult> => {
  const body = new FormData();
  for (const [name, value] of Object.entries(fields)) {
    if (typeof value === 'string' && value !== '') body.append(name, value);
  }
  for (const file of files) body.append('files', file, file.name);
  return apiRequest(`/clients/${encodeURIComponent(clientId)}/samples`, {
    method: 'POST',
    body,
    schema: uploadResultSchema,
  });
};

export const useUploadSamples = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadSamples,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sampleKeys.all }),
  });
};
