import { type ApproveInput, type ProfileVersion, profileVersionSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export type ApproveVariables = { versionId: string; input: ApproveInput };

/** A supervisor's approval (signed_off → active; the previous active version retires). */
export const approveProfileVersion = ({ versionId, input }: ApproveVariables): Promise<ProfileVersion> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/approve`, {
    method: 'POST',
    body: input,
    schema: profileVersionSchema,
  });

export const useApproveProfileVersion = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: approveProfileVersion,
    onSuccess: (version) => {
      queryClient.setQueryData(['profile-versions', 'detail', version.id], version);
      return queryClient.invalidateQueries({ queryKey: ['profile-versions'] });
    },
  });
};
