import { type Contact, type UpdateContactInput, contactSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { contactKeys } from './keys';

export type UpdateContactVariables = { clientId: string; contactId: string; changes: UpdateContactInput };

/** Changes a family contact (owning clinician). */
export const updateContact = ({ clientId, contactId, changes }: UpdateContactVariables): Promise<Contact> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/contacts/${encodeURIComponent(contactId)}`, {
    method: 'PATCH',
    body: changes,
    schema: contactSchema,
  });

export const useUpdateContact = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateContact,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: contactKeys.all }),
  });
};
