import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { practicePhraseKeys } from './keys';

export type DeletePracticePhraseVariables = { clientId: string; phraseId: string };

/** Deletes one of the client's own practice phrases (owning clinician; built-in ones stay). */
export const deletePracticePhrase = ({ clientId, phraseId }: DeletePracticePhraseVariables): Promise<void> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/practice-phrases/${encodeURIComponent(phraseId)}`, {
    method: 'DELETE',
  });

export const useDeletePracticePhrase = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deletePracticePhrase,
    onSuccess: (_nothing, { clientId }) =>
      queryClient.invalidateQueries({ queryKey: practicePhraseKeys.list(clientId) }),
  });
};
