import { type ProfileVersion, profileVersionSchema, type SendBackInput } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export type SendBackVariables = { versionId: string; input: SendBackInput };

/** A supervisor sends a signed-off version back with the reason (signed_off → sent_back). */
export const sendBackProfileVersion = ({ versionId, input }: SendBackVariables): Promise<ProfileVersion> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/send-back`, {
    method: 'POST',
    body: input,
    schema: profileVersionSchema,
  });

export const useSendBackProfileVersion = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: sendBackProfileVersion,
    onSuccess: (version) => {
      queryClient.setQueryData(['profile-versions', 'detail', version.id], version);
      return queryClient.invalidateQueries({ queryKey: ['profile-versions'] });
    },
  });
};
