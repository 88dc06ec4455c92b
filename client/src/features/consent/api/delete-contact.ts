import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { contactKeys } from './keys';

export type DeleteContactVariables = { clientId: string; contactId: string };

/** Deletes a family contact (owning clinician); summaries already sent keep their record. */
export const deleteContact = ({ clientId, contactId }: DeleteContactVariables): Promise<unknown> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/contacts/${encodeURIComponent(contactId)}`, {
    method: 'DELETE',
  });

export const useDeleteContact = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteContact,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: contactKeys.all }),
  });
};
