import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { clientKeys } from './keys';

export type AssignmentVariables = { clientId: string; userId: string };

/** Assigns a carer to a client (owning clinician or admin); 400 when they are not an active carer. */
export const createAssignment = ({ clientId, userId }: AssignmentVariables): Promise<unknown> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/assignments`, { method: 'POST', body: { userId } });

export const useCreateAssignment = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAssignment,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: clientKeys.all }),
  });
};
