import { type CreateProfileVersionInput, type ProfileVersion, profileVersionSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

export type CreateProfileVersionVariables = { clientId: string; input: CreateProfileVersionInput };

/** Creates a draft version with its settings and sample set frozen. */
export const createProfileVersion = ({
  clientId,
  input,
}: CreateProfileVersionVariables): Promise<ProfileVersion> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/profile-versions`, {
    method: 'POST',
    body: input,
    schema: profileVersionSchema,
  });

export const useCreateProfileVersion = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProfileVersion,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: profileVersionKeys.all }),
  });
};
