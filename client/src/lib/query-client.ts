import { PASSWORD_CHANGE_REQUIRED_CODE } from '@keyloom/shared';
import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

type QueryClientOptions = {
  /** Called when any request finds the session gone (HTTP 401). */
  onUnauthorized?: () => void;
  /** Called when the API refuses a request because the account must change its password first. */
  onPasswordChangeRequired?: () => void;
  /** Tests turn retries off so failures show at once. */
  retry?: boolean;
};

// Client errors (4xx) will not change on a retry; a dropped connection or a 5xx might.
const shouldRetry = (failureCount: number, error: unknown): boolean =>
  failureCount < 2 && !(isApiError(error) && error.status >= 400 && error.status < 500);

export const createQueryClient = ({
  onUnauthorized,
  onPasswordChangeRequired,
  retry = true,
}: QueryClientOptions = {}): QueryClient => {
  const handleError = (error: unknown) => {
    if (isApiError(error) && error.status === 401) onUnauthorized?.();
    if (isApiError(error) && error.status === 403 && error.code === PASSWORD_CHANGE_REQUIRED_CODE) {
      onPasswordChangeRequired?.();
    }
  };
  return new QueryClient({
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
};
