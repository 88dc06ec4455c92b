import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

/** Deletes a draft version (the API refuses anything past a draft with 409). */
export const deleteProfileVersion = async (versionId: string): Promise<void> => {
  await apiRequest(`/profile-versions/${encodeURIComponent(versionId)}`, { method: 'DELETE' });
};

export const useDeleteProfileVersion = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteProfileVersion,
    onSuccess: (_, versionId) => {
      queryClient.removeQueries({ queryKey: profileVersionKeys.detail(versionId) });
      return queryClient.invalidateQueries({ queryKey: profileVersionKeys.all });
    },
  });
};
