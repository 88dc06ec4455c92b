import { type ProfileVersion, profileVersionSchema, updateProfileVersionSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

export type UpdateProfileVersionVariables = {
  versionId: string;
  input: z.input<typeof updateProfileVersionSchema>;
};

/** Changes a draft: each field sent replaces the draft's (the API refuses anything past a draft). */
export const updateProfileVersion = ({
  versionId,
  input,
}: UpdateProfileVersionVariables): Promise<ProfileVersion> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}`, {
    method: 'PATCH',
    body: input,
    schema: profileVersionSchema,
  });

export const useUpdateProfileVersion = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateProfileVersion,
    onSuccess: (version) => {
      queryClient.setQueryData(profileVersionKeys.detail(version.id), version);
      return queryClient.invalidateQueries({ queryKey: profileVersionKeys.all });
    },
  });
};
