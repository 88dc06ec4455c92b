import type { QueryClient } from '@tanstack/react-query';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { createQueryClient } from '@/lib/query-client';

/**
 * The app's query client. Any 401 means the session ended (expired, or signed out in another
 * tab): forget the user, and the page guards send the reader to sign in again. A 403 saying a
 * password change is due: ask "who am I" again, and the page guards send the reader to choose one.
 */
export const createAppQueryClient = (options: { retry?: boolean } = {}): QueryClient => {
  const queryClient: QueryClient = createQueryClient({
    ...options,
    onUnauthorized: () => {
      if (queryClient.getQueryData(meQueryOptions().queryKey)) {
        queryClient.setQueryData(meQueryOptions().queryKey, null);
      }
    },
    onPasswordChangeRequired: () => void queryClient.invalidateQueries(meQueryOptions()),
  });
  return queryClient;
};
