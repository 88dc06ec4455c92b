import { type ProfileVersion, profileVersionSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

/** Asks the running training job to stop; nothing half-made is kept. */
export const cancelProfileVersion = (versionId: string): Promise<ProfileVersion> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/cancel`, {
    method: 'POST',
    schema: profileVersionSchema,
  });

export const useCancelProfileVersion = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelProfileVersion,
    onSuccess: (version) => {
      queryClient.setQueryData(profileVersionKeys.detail(version.id), version);
      return queryClient.invalidateQueries({ queryKey: profileVersionKeys.all });
    },
  });
};
