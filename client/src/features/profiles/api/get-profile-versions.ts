import { type ProfileVersion, profileVersionSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

const profileVersionListSchema = z.array(profileVersionSchema);

/** A client's profile versions, newest first as the API sends them. */
export const getProfileVersions = (clientId: string, signal?: AbortSignal): Promise<ProfileVersion[]> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/profile-versions`, {
    schema: profileVersionListSchema,
    signal,
  });

export const profileVersionsQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: profileVersionKeys.list(clientId),
    queryFn: ({ signal }) => getProfileVersions(clientId, signal),
    // A version in training moves on by itself: look again every few seconds while one does.
    refetchInterval: (query) =>
      query.state.data?.some((version) => version.status === 'training') ? 3000 : false,
  });

export const useProfileVersions = (clientId: string) => useQuery(profileVersionsQueryOptions(clientId));
