import { type ProfileVersion, profileVersionSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

/** Queues training of a draft version, or retries a failed one; it answers at once with status training. */
export const trainProfileVersion = (versionId: string): Promise<ProfileVersion> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/train`, {
    method: 'POST',
    schema: profileVersionSchema,
  });

export const useTrainProfileVersion = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: trainProfileVersion,
    onSuccess: (version) => {
      queryClient.setQueryData(profileVersionKeys.detail(version.id), version);
      return queryClient.invalidateQueries({ queryKey: profileVersionKeys.all });
    },
  });
};
