import { type VocabularyPage, vocabularyPageSchema } from '@keyloom/shared';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest, toQueryString } from '@/lib/api-client';
import { type VocabularyListing, vocabularyKeys } from './keys';

/** One page of a version's words, found, filtered and sorted by the server. */
export const getVocabularyPage = (
  versionId: string,
  listing: VocabularyListing,
  signal?: AbortSignal,
): Promise<VocabularyPage> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/vocabulary${toQueryString(listing)}`, {
    schema: vocabularyPageSchema,
    signal,
  });

export const vocabularyPageQueryOptions = (versionId: string, listing: VocabularyListing) =>
  queryOptions({
    queryKey: vocabularyKeys.words(versionId, listing),
    queryFn: ({ signal }) => getVocabularyPage(versionId, listing, signal),
    // The table keeps the last page on screen while the next one loads.
    placeholderData: keepPreviousData,
  });

export const useVocabularyPage = (versionId: string, listing: VocabularyListing) =>
  useQuery(vocabularyPageQueryOptions(versionId, listing));
