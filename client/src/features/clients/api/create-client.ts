import { type Client, type CreateClientInput, clientSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { clientKeys } from './keys';

/** Opens a client record in the signed-in clinician's caseload. */
export const createClient = (input: CreateClientInput): Promise<Client> =>
  apiRequest('/clients', { method: 'POST', body: input, schema: clientSchema });

export const useCreateClient = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createClient,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: clientKeys.all }),
  });
};
