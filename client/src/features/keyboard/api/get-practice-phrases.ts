import { type PracticePhrase, practicePhraseSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { practicePhraseKeys } from './keys';

const phraseListSchema = z.array(practicePhraseSchema);

/** Keyloom's built-in practice phrases, then the client's own (oldest first). */
export const getPracticePhrases = (clientId: string, signal?: AbortSignal): Promise<PracticePhrase[]> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/practice-phrases`, {
    schema: phraseListSchema,
    signal,
  });

export const practicePhrasesQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: practicePhraseKeys.list(clientId),
    queryFn: ({ signal }) => getPracticePhrases(clientId, signal),
  });

export const usePracticePhrases = (clientId: string) => useQuery(practicePhrasesQueryOptions(clientId));
