import { type Contact, type CreateContactInput, contactSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { contactKeys } from './keys';

export type CreateContactVariables = { clientId: string; input: CreateContactInput };

/** Adds a family contact (owning clinician). */
export const createContact = ({ clientId, input }: CreateContactVariables): Promise<Contact> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/contacts`, {
    method: 'POST',
    body: input,
    schema: contactSchema,
  });

export const useCreateContact = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createContact,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: contactKeys.all }),
  });
};
