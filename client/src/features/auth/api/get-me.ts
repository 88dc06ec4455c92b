import { type SessionUser, sessionUserSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest, isApiError } from '@/lib/api-client';
import { authKeys } from './keys';

/** The signed-in user, or null when there is no session (the API answers 401). */
export const getMe = async (signal?: AbortSignal): Promise<SessionUser | null> => {
  try {
    return await apiRequest('/auth/me', { schema: sessionUserSchema, signal });
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
};

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    // The session changes only through sign-in and sign-out, which write this entry themselves.
    staleTime: 5 * 60_000,
  });

export const useMe = () => useQuery(meQueryOptions());
