import { type ProfileVersion, profileVersionSchema, type SignOffInput } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export type SignOffVariables = { versionId: string; input: SignOffInput };

/** The assigned carer's sign-off after trying a version (trained → signed_off). */
export const signOffProfileVersion = ({ versionId, input }: SignOffVariables): Promise<ProfileVersion> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/sign-off`, {
    method: 'POST',
    body: input,
    schema: profileVersionSchema,
  });

export const useSignOffProfileVersion = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOffProfileVersion,
    onSuccess: (version) => {
      queryClient.setQueryData(['profile-versions', 'detail', version.id], version);
      return queryClient.invalidateQueries({ queryKey: ['profile-versions'] });
    },
  });
};
