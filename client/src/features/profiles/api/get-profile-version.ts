import { type ProfileVersion, profileVersionSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

/** How often a version in training is asked for its progress, ms. */
export const PROGRESS_POLL_MS = 1000;

/** One profile version: status, progress while training, metrics once trained, history. */
export const getProfileVersion = (versionId: string, signal?: AbortSignal): Promise<ProfileVersion> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}`, { schema: profileVersionSchema, signal });

export const profileVersionQueryOptions = (versionId: string) =>
  queryOptions({
    queryKey: profileVersionKeys.detail(versionId),
    queryFn: ({ signal }) => getProfileVersion(versionId, signal),
    // Poll every second while the job runs; stop as soon as it has ended one way or another.
    refetchInterval: (query) => (query.state.data?.status === 'training' ? PROGRESS_POLL_MS : false),
  });

export const useProfileVersion = (versionId: string) => useQuery(profileVersionQueryOptions(versionId));
