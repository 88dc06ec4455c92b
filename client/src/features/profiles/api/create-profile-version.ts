import { createProfileVersionSchema, type ProfileVersion, profileVersionSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

// The request as sent: fields with defaults may be left out (settings without `vocabulary` take the
// client's current list).
export type CreateProfileVersionVariables = {
  clientId: string;
  input: z.input<typeof createProfileVersionSchema>;
};

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
