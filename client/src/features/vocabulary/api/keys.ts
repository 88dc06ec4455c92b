import type { VocabularyQuery } from '@keyloom/shared';
import { queryRoots } from '@/lib/query-keys';

/**
 * Query keys of vocabularies: a client's current list, and a version's word listing and
 * misspellings. Invalidating `all` refreshes all three (a saved list changes the misspellings).
 */
export const vocabularyKeys = {
  all: queryRoots.vocabulary,
  client: (clientId: string) => [...vocabularyKeys.all, 'client', clientId] as const,
  versions: () => [...vocabularyKeys.all, 'version'] as const,
  words: (versionId: string, query: VocabularyListing) =>
    [...vocabularyKeys.versions(), versionId, 'words', query] as const,
  misspellings: (versionId: string) => [...vocabularyKeys.versions(), versionId, 'misspellings'] as const,
};

/** What the listing asks for (the server's default page size is kept). */
export type VocabularyListing = Pick<VocabularyQuery, 'query' | 'sort' | 'show' | 'page'>;
