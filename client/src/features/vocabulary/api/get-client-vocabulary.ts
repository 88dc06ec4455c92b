import { type ClientVocabularyState, clientVocabularyStateSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { vocabularyKeys } from './keys';

/** The client's current added and blocked words (what the next version freezes) and kept spellings. */
export const getClientVocabulary = (clientId: string, signal?: AbortSignal): Promise<ClientVocabularyState> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/vocabulary`, {
    schema: clientVocabularyStateSchema,
    signal,
  });

export const clientVocabularyQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: vocabularyKeys.client(clientId),
    queryFn: ({ signal }) => getClientVocabulary(clientId, signal),
  });

/** Pass null to wait (e.g. until the page knows who is reading). */
export const useClientVocabulary = (clientId: string | null) =>
  useQuery({ ...clientVocabularyQueryOptions(clientId ?? ''), enabled: clientId !== null });
