import { type MisspellingList, misspellingListSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { vocabularyKeys } from './keys';

/** A version's words that look like misspellings of a much commoner word. */
export const getMisspellings = (versionId: string, signal?: AbortSignal): Promise<MisspellingList> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/misspellings`, {
    schema: misspellingListSchema,
    signal,
  });

export const misspellingsQueryOptions = (versionId: string) =>
  queryOptions({
    queryKey: vocabularyKeys.misspellings(versionId),
    queryFn: ({ signal }) => getMisspellings(versionId, signal),
  });

export const useMisspellings = (versionId: string) => useQuery(misspellingsQueryOptions(versionId));
