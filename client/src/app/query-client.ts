import { PASSWORD_CHANGE_REQUIRED_CODE } from '@keyloom/shared';
import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { authKeys } from '@/features/auth/api/keys';
import { isApiError } from '@/lib/api-client';

type QueryClientOptions = {
  /** Tests turn retries off so failures show at once. */
  retry?: boolean;
};

// Client errors (4xx) will not change on a retry; a dropped connection or a 5xx might.
const shouldRetry = (failureCount: number, error: unknown): boolean =>
  failureCount < 2 && !(isApiError(error) && error.status >= 400 && error.status < 500);

/**
 * The app's one query client. Any 401 means the session ended (expired, or signed out in another
 * tab): forget the user, and the page guards send the reader to sign in again. A 403 saying a
 * password change is due: ask "who am I" again, and the page guards send the reader to choose one.
 */
export const createAppQueryClient = ({ retry = true }: QueryClientOptions = {}): QueryClient => {
  const handleError = (error: unknown) => {
    if (isApiError(error) && error.status === 401 && queryClient.getQueryData(authKeys.me())) {
      queryClient.setQueryData(authKeys.me(), null);
    }
    if (isApiError(error) && error.status === 403 && error.code === PASSWORD_CHANGE_REQUIRED_CODE) {
      void queryClient.invalidateQueries({ queryKey: authKeys.me() });
    }
  };
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: handleError }),
    mutationCache: new MutationCache({ onError: handleError }),
    defaultOptions: {
      queries: {
        retry: retry ? shouldRetry : false,
        staleTime: 30_000,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
  return queryClient;
};
