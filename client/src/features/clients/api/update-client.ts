import { type Client, type UpdateClientInput, clientSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { clientKeys } from './keys';

export type UpdateClientVariables = { clientId: string; changes: UpdateClientInput };

/** Changes a client's record (owning clinician only). */
export const updateClient = ({ clientId, changes }: UpdateClientVariables): Promise<Client> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}`, {
    method: 'PATCH',
    body: changes,
    schema: clientSchema,
  });

export const useUpdateClient = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateClient,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: clientKeys.all }),
  });
};
