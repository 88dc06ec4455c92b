import {
  type ClientVocabularyState,
  clientVocabularyStateSchema,
  type UpdateClientVocabularyInput,
} from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { vocabularyKeys } from './keys';

export type UpdateClientVocabularyVariables = { clientId: string; input: UpdateClientVocabularyInput };

/** Saves the whole list; the API refuses (409) a revision someone else has already moved on from. */
export const updateClientVocabulary = ({
  clientId,
  input,
}: UpdateClientVocabularyVariables): Promise<ClientVocabularyState> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/vocabulary`, {
    method: 'PUT',
    body: input,
    schema: clientVocabularyStateSchema,
  });

export const useUpdateClientVocabulary = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateClientVocabulary,
    onSuccess: (state) => {
      queryClient.setQueryData(vocabularyKeys.client(state.clientId), state);
      // The misspelling review leaves out what the list blocks or keeps.
      return queryClient.invalidateQueries({ queryKey: vocabularyKeys.versions() });
    },
  });
};
