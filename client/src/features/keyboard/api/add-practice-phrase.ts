import { type CreatePracticePhraseInput, type PracticePhrase, practicePhraseSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { practicePhraseKeys } from './keys';

export type AddPracticePhraseVariables = { clientId: string; input: CreatePracticePhraseInput };

/** Adds one of the client's own practice phrases (owning clinician). */
export const addPracticePhrase = ({ clientId, input }: AddPracticePhraseVariables): Promise<PracticePhrase> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/practice-phrases`, {
    method: 'POST',
    body: input,
    schema: practicePhraseSchema,
  });

export const useAddPracticePhrase = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addPracticePhrase,
    onSuccess: (_phrase, { clientId }) =>
      queryClient.invalidateQueries({ queryKey: practicePhraseKeys.list(clientId) }),
  });
};
