import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import type { AssignmentVariables } from './create-assignment';
import { clientKeys } from './keys';

/** Takes a carer off a client (owning clinician or admin). */
export const deleteAssignment = ({ clientId, userId }: AssignmentVariables): Promise<unknown> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/assignments/${encodeURIComponent(userId)}`, {
    method: 'DELETE',
  });

export const useDeleteAssignment = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteAssignment,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: clientKeys.all }),
  });
};
